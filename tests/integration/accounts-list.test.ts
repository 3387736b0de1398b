import { beforeAll, describe, expect, it } from "vitest";
import { archiveAccount, createAccount } from "@/db/queries/account-changes";
import { ACCOUNTS_PAGE_SIZE, listAccounts, listAccountsPage } from "@/db/queries/accounts";
import { ForbiddenError } from "@/lib/errors";
import { accountListParamsSchema } from "@/lib/validations/account";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const names = (rows: { name: string }[]) => rows.map((r) => r.name);

// 30 more accounts for engineer2, so that a manager's list runs over more than one page.
beforeAll(() => {
  for (let i = 1; i <= 30; i++)
    createAccount(manager(), {
      name: `Invented Paging ${String(i).padStart(2, "0")}`,
      ownerId: engineer2().id,
    });
  createAccount(engineer(), { name: "invented lower-case works" });
  createAccount(engineer(), { name: "Invented 100% Recycled_Board" });
  archiveAccount(engineer(), createAccount(engineer(), { name: "Invented Archived Mill" }).id);
});

describe("the accounts list, sorted, filtered and paged in SQL", () => {
  it("pages the caller's accounts, clamping a page past the end to the last", () => {
    const first = listAccountsPage(manager());
    expect(first.total).toBe(3 + 30 + 2);
    expect(first.pageCount).toBe(Math.ceil(first.total / ACCOUNTS_PAGE_SIZE));
    expect(first.rows).toHaveLength(ACCOUNTS_PAGE_SIZE);
    const last = listAccountsPage(manager(), { page: 99 });
    expect(last.page).toBe(first.pageCount);
    expect(last.rows).toHaveLength(first.total - ACCOUNTS_PAGE_SIZE);
    const all = [...names(first.rows), ...names(last.rows)];
    expect(new Set(all).size).toBe(first.total);
    expect(all).toEqual(names(listAccounts(manager())));
  });

  it("sorts by name without regard to capitals, by owner and by creation, either way", () => {
    const byName = names(listAccounts(manager()));
    expect(byName).toEqual(
      [...byName].sort((a, b) => a.toLowerCase().localeCompare(b.toLowerCase())),
    );
    const desc = listAccountsPage(manager(), { sort: "name", dir: "desc", page: 1 });
    expect(names(desc.rows)).toEqual([...byName].reverse().slice(0, ACCOUNTS_PAGE_SIZE));

    const byOwner = listAccountsPage(manager(), { sort: "owner", dir: "asc" }).rows;
    expect(byOwner[0].ownerName).toBe("Demo Engineer");
    expect(byOwner.at(-1)!.ownerName).toBe("Second Demo Engineer");

    const newest = listAccountsPage(manager(), { sort: "created", dir: "desc" }).rows;
    const created = newest.map((r) => r.createdAt);
    expect(created).toEqual([...created].sort().reverse());
    expect(newest[0].name).toBe("Invented 100% Recycled_Board");
  });

  it("filters by account or owner name, taking % and _ literally", () => {
    expect(names(listAccountsPage(manager(), { q: "paging 0" }).rows)).toHaveLength(9);
    expect(listAccountsPage(manager(), { q: "second demo" }).total).toBe(31);
    expect(names(listAccountsPage(manager(), { q: "100%" }).rows)).toEqual([
      "Invented 100% Recycled_Board",
    ]);
    expect(names(listAccountsPage(manager(), { q: "d_b" }).rows)).toHaveLength(1);
    // "_" would match the space of "Invented Paging" if it were a wildcard.
    expect(listAccountsPage(manager(), { q: "Invented_Paging" }).total).toBe(0);
    expect(listAccountsPage(manager(), { q: "no such account" }).total).toBe(0);
  });

  it("shows archived accounts only when asked", () => {
    expect(listAccountsPage(engineer(), { q: "archived mill" }).total).toBe(0);
    const shown = listAccountsPage(engineer(), { q: "archived mill", archived: "show" }).rows;
    expect(names(shown)).toEqual(["Invented Archived Mill"]);
    expect(shown[0].archivedAt).toBeTruthy();
  });

  it("keeps each caller's scope; a reviewer may not list", () => {
    expect(names(listAccountsPage(engineer(), { archived: "show" }).rows).sort()).toEqual([
      "Cartonia Packaging Plant",
      "Invented 100% Recycled_Board",
      "Invented Archived Mill",
      "Webline Print Finishing",
      "invented lower-case works",
    ]);
    expect(listAccountsPage(engineer2()).total).toBe(32);
    expect(() => listAccountsPage(reviewer())).toThrow(ForbiddenError);
  });

  it("reads the URL state, falling back on bad values", () => {
    expect(
      accountListParamsSchema.parse({ sort: "owner", dir: "desc", page: "2", archived: "show" }),
    ).toEqual({ sort: "owner", dir: "desc", page: 2, archived: "show" });
    expect(
      accountListParamsSchema.parse({ sort: "id; drop", dir: "up", page: "-3", archived: "yes" }),
    ).toEqual({ sort: "name", dir: "asc", page: 1, archived: undefined });
  });
});
