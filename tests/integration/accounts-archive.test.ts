import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { archiveAccount, createAccount, restoreAccount } from "@/db/queries/account-changes";
import { getAccountDetailOrThrow, listAccounts, listAccountsPage } from "@/db/queries/accounts";
import { listAudit } from "@/db/queries/audit";
import { createCase, getCaseOrThrow, listCases } from "@/db/queries/cases";
import { pipeline } from "@/db/queries/pipeline";
import { listVisibleQuotes } from "@/db/queries/proposals";
import { createSite, listOpenSites, listSites } from "@/db/queries/sites";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { siteInputSchema } from "@/lib/validations/installed-base";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");
const reviewer = () => caller("reviewer@example.com");

const lastAudit = () => listAudit(admin(), 1)[0];
const webline = () => listAccounts(manager()).find((a) => a.name === "Webline Print Finishing")!;
const siteValues = (name: string) =>
  siteInputSchema.parse({
    name,
    currency: "EUR",
    tariffPerKWh: "0.2",
    ambientC: 30,
    hoursPerYear: 4000,
  });

describe("archiving an account", () => {
  it("takes it off the lists and pickers, keeps its pages, cases and pipeline, and restores", () => {
    const account = webline();
    const sites = listSites(manager(), account.id);
    const cases = listCases(manager()).filter((c) => c.accountId === account.id);
    const quotes = pipeline(manager()).quotes.filter((q) => q.accountId === account.id);
    expect(sites.length).toBeGreaterThan(0);
    expect(cases.length).toBeGreaterThan(0);
    expect(quotes.length).toBeGreaterThan(0);
    expect(listOpenSites(engineer()).some((s) => s.accountId === account.id)).toBe(true);

    archiveAccount(engineer(), account.id);
    expect(lastAudit()).toMatchObject({
      action: "account.archive",
      actorEmail: "engineer@example.com",
      targetType: "account",
      targetId: String(account.id),
      detail: "Webline Print Finishing archived",
    });

    // Off the working lists and the new case's site choice...
    for (const who of [engineer(), engineer2(), manager()]) {
      expect(listAccounts(who).some((a) => a.id === account.id)).toBe(false);
      expect(listAccountsPage(who).rows.some((a) => a.id === account.id)).toBe(false);
      expect(listOpenSites(who).some((s) => s.accountId === account.id)).toBe(false);
    }
    const shown = listAccountsPage(manager(), { archived: "show" }).rows.find(
      (a) => a.id === account.id,
    );
    expect(shown?.archivedAt).toBeTruthy();

    // ...but its page, sites, cases, proposals and pipeline history stay readable, for the owner
    // and the engineer it is shared with.
    for (const who of [engineer(), engineer2()]) {
      expect(getAccountDetailOrThrow(who, account.id).archivedAt).toBeTruthy();
      expect(listSites(who, account.id)).toEqual(
        sites.map((s) => ({ ...s, accountArchivedAt: expect.any(String) })),
      );
    }
    for (const c of cases) expect(getCaseOrThrow(manager(), c.id).name).toBe(c.name);
    expect(listCases(manager()).filter((c) => c.accountId === account.id)).toHaveLength(
      cases.length,
    );
    expect(pipeline(manager()).quotes.filter((q) => q.accountId === account.id)).toEqual(quotes);
    expect(
      listVisibleQuotes(manager()).filter((q) => q.accountId === account.id).length,
    ).toBeGreaterThan(0);

    // No new sites or cases until it is restored.
    expect(() => createSite(engineer(), account.id, siteValues("Invented annexe"))).toThrow(
      "Webline Print Finishing is archived: restore the account before adding sites or cases to it.",
    );
    expect(() => createCase(engineer(), { name: "Invented case", siteId: sites[0].id })).toThrow(
      ConflictError,
    );
    expect(listSites(manager(), account.id)).toHaveLength(sites.length);

    restoreAccount(manager(), account.id);
    expect(lastAudit()).toMatchObject({
      action: "account.restore",
      actorEmail: "manager@example.com",
      detail: "Webline Print Finishing restored",
    });
    expect(listAccounts(engineer2()).some((a) => a.id === account.id)).toBe(true);
    expect(listOpenSites(engineer()).some((s) => s.accountId === account.id)).toBe(true);
    const site = createSite(engineer(), account.id, siteValues("Invented annexe"));
    expect(createCase(engineer(), { name: "Invented case", siteId: site.id }).accountId).toBe(
      account.id,
    );
  });

  it("owner, manager and administrator may archive; a shared engineer is refused, others find nothing", () => {
    const account = createAccount(engineer(), { name: "Invented Archive Rights" });
    // engineer2 is not on this account at all.
    expect(() => archiveAccount(engineer2(), account.id)).toThrow(NotFoundError);
    expect(() => archiveAccount(reviewer(), account.id)).toThrow(ForbiddenError);
    // On the print finisher's account engineer2 is shared, not the owner.
    expect(() => archiveAccount(engineer2(), webline().id)).toThrow(
      "Only the account's owner, a manager or an administrator may archive or restore it.",
    );
    expect(webline().archivedAt).toBeNull();

    archiveAccount(manager(), account.id);
    expect(() => archiveAccount(admin(), account.id)).toThrow(
      "Invented Archive Rights is archived already.",
    );
    restoreAccount(admin(), account.id);
    expect(() => restoreAccount(engineer(), account.id)).toThrow(
      "Invented Archive Rights is not archived.",
    );
    archiveAccount(admin(), account.id);
    expect(() => restoreAccount(engineer2(), account.id)).toThrow(NotFoundError);
    restoreAccount(engineer(), account.id);
    expect(listAudit(admin(), 4).map((a) => a.action)).toEqual([
      "account.restore",
      "account.archive",
      "account.restore",
      "account.archive",
    ]);
  });

  it("writes nothing when the audit row cannot be written", () => {
    const account = createAccount(engineer(), { name: "Invented Archive Rollback" });
    db.$client.exec(
      "create temp trigger refuse_audit before insert on audit_log begin select raise(abort, 'audit refused'); end",
    );
    try {
      expect(() => archiveAccount(engineer(), account.id)).toThrow(/audit refused/);
    } finally {
      db.$client.exec("drop trigger refuse_audit");
    }
    expect(getAccountDetailOrThrow(engineer(), account.id).archivedAt).toBeNull();
  });
});
