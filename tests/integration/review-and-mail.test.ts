import Decimal from "decimal.js";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listAxesForExport } from "@/db/queries/axes";
import { createCase, getCaseOrThrow } from "@/db/queries/cases";
import { setAxisRetrofit, setCaseAxes, listCaseAxes } from "@/db/queries/case-axes";
import { freezeProposal } from "@/server/cases/freeze";
import { acceptInvitation, inspectInvitation } from "@/db/queries/invitations";
import { listOutbox } from "@/db/queries/outbox";
import { pipeline, pipelineWinRate } from "@/db/queries/pipeline";
import { addComment, decideProposal, runWhatIf } from "@/server/review/decisions";
import { listComments } from "@/db/queries/proposal-comments";
import {
  getProposalSnapshotOrThrow,
  getVisibleQuoteOrThrow,
  listProposalsFor,
} from "@/db/queries/proposals";
import { approveDiscount, updateQuote } from "@/db/queries/quotes";
import { sendProposal } from "@/server/proposals/send";
import { getSalesSettings, saveSalesSettings } from "@/db/queries/sales-settings";
import { listSites } from "@/db/queries/sites";
import { findUserForSignIn } from "@/db/queries/users";
import { db } from "@/db";
import { openDatabase } from "@/db/client";
import { auditLog, mailQueue, proposals, quotes } from "@/db/schema";
import { authOptions } from "@/server/auth/options";
import { verifyPassword } from "@/lib/auth/password";
import { evaluateCase, roundMoney } from "@/lib/engine";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { startFakeSmtpServer, type FakeSmtpServer } from "@/server/mail/fake-smtp-server";
import { flushMailQueue } from "@/server/mail/queue";
import { axisRetrofitSchema } from "@/lib/validations/case";
import { decisionSchema, whatIfSchema } from "@/lib/validations/pipeline";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");
const reviewer = () => caller("reviewer@example.com");

const APP = "http://loopshift.test:4321";
let smtp: FakeSmtpServer;
// The fake SMTP server files messages through a connection of its own, as under `npm start`.
const smtpDb = openDatabase(process.env.DATABASE_PATH);

beforeAll(async () => {
  process.env.NEXTAUTH_URL = APP;
  smtp = await startFakeSmtpServer(smtpDb);
  process.env.SMTP_URL = smtp.url;
});
afterAll(async () => {
  await smtp?.close();
  smtpDb.$client.close();
});

const siteNamed = (name: string) => listSites(manager()).find((s) => s.name === name)!;

// A fresh case on a site, its first axes picked at the given kit discount, frozen as a proposal.
function frozenCase(who = engineer(), siteName = "North hall", discountPct = 5, count = 4) {
  const site = siteNamed(siteName);
  const row = createCase(who, {
    name: `Mail test ${Math.random().toString(36).slice(2)}`,
    siteId: site.id,
  });
  const picked = listAxesForExport(who, site.id, 0, count).axes.map((a) => a.id);
  setCaseAxes(who, row.id, picked);
  for (const axis of listCaseAxes(who, row.id))
    setAxisRetrofit(
      who,
      row.id,
      axis.axisId,
      axisRetrofitSchema.parse({ kitId: axis.kitId, discountPct }),
    );
  return freezeProposal(who, row.id);
}

/**
 * Issue 16: the message says where the value comes from. The amounts it lists, read back from
 * the text, add up to its "All sources" line, and that is the engine's own yearly flows of the
 * engineering estimate (years 1 to the horizon) re-evaluated from the frozen input.
 */
function expectValueBreakdown(text: string, proposalId: number) {
  const { input } = getProposalSnapshotOrThrow(engineer(), proposalId);
  const flows = evaluateCase(input).scenarios.physics.cashFlows.slice(1);
  const expected = flows.reduce((acc, f) => acc.plus(f), new Decimal(0));
  const after = text.split("Where the value comes from, in the engineering estimate over ")[1];
  expect(after, text).toBeDefined();
  const rows = after.split("\n\n")[1].split("\n");
  const amount = (line: string) => {
    const [, sign, digits] = /: (-?)€([\d,]+\.\d{2})$/.exec(line) ?? [];
    expect(digits, line).toBeDefined();
    return new Decimal(`${sign}${digits.replaceAll(",", "")}`);
  };
  const total = rows.find((r) => r.startsWith("All sources: "))!;
  const parts = rows.slice(0, rows.indexOf(total));
  expect(parts.length).toBeGreaterThan(1);
  const sum = parts.reduce((acc, line) => acc.plus(amount(line)), new Decimal(0));
  // Each part is rounded to the cent on its own: the sum may differ from the total by a cent a part.
  expect(sum.minus(amount(total)).abs().toNumber()).toBeLessThanOrEqual(0.01 * parts.length);
  expect(amount(total).toFixed(2)).toBe(
    expected.toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2),
  );
  expect(
    rows.some((r) => /^Net present value: €[\d,]+00$/.test(r)),
    rows.join("\n"),
  ).toBe(true);
}

const newestMailTo = (email: string) => listOutbox(admin()).find((m) => m.to.includes(email));

function linkIn(text: string, path: string): string {
  const match = new RegExp(`${APP.replace(/[.:/]/g, "\\$&")}${path}[A-Za-z0-9_-]+`).exec(text);
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return match[0];
}

describe("the pipeline (seeded demo quotes)", () => {
  it("totals per stage, per close month and overall are exactly the sums of its quotes", () => {
    const data = pipeline(manager());
    const { stageProbabilities } = getSalesSettings();
    expect(data.quotes.length).toBeGreaterThanOrEqual(5);
    expect(new Set(data.quotes.map((q) => q.stage)).size).toBeGreaterThanOrEqual(5);
    for (const q of data.quotes) {
      // Weighted revenue: the vendor's revenue × the stage's probability, to the cent (half-even, docs/contracts.md (Numbers and money)).
      const expected = new Decimal(q.vendorRevenue).times(stageProbabilities[q.stage]).div(100);
      expect(q.weighted).toBe(roundMoney(expected.toFixed(), q.currency));
    }
    const add = (xs: string[]) => xs.reduce((s, x) => s.plus(x), new Decimal(0));
    for (const s of data.stages) {
      const rows = data.quotes.filter((q) => q.stage === s.stage && q.currency === s.currency);
      expect(s.count).toBe(rows.length);
      expect(new Decimal(s.value).eq(add(rows.map((r) => r.value)))).toBe(true);
      expect(new Decimal(s.weighted).eq(add(rows.map((r) => r.weighted)))).toBe(true);
    }
    for (const t of data.totals) {
      const rows = data.quotes.filter((q) => q.currency === t.currency);
      expect(new Decimal(t.value).eq(add(rows.map((r) => r.value)))).toBe(true);
      expect(
        new Decimal(t.value).eq(
          add(data.stages.filter((s) => s.currency === t.currency).map((s) => s.value)),
        ),
      ).toBe(true);
      expect(
        new Decimal(t.weighted).eq(
          add(data.byMonth.filter((m) => m.currency === t.currency).map((m) => m.weighted)),
        ),
      ).toBe(true);
    }
  });

  it("filters by stage, account, owner and close month, and the totals follow the filter", () => {
    const all = pipeline(manager()).quotes;
    const sent = pipeline(manager(), { stage: "sent" });
    expect(sent.quotes.map((q) => q.id).sort()).toEqual(
      all
        .filter((q) => q.stage === "sent")
        .map((q) => q.id)
        .sort(),
    );
    expect(sent.totals[0].count).toBe(sent.quotes.length);
    const account = all[0].accountId;
    expect(pipeline(manager(), { account }).quotes.every((q) => q.accountId === account)).toBe(
      true,
    );
    const month = all[0].expectedCloseOn.slice(0, 7);
    expect(
      pipeline(manager(), { closeMonth: month }).quotes.every((q) =>
        q.expectedCloseOn.startsWith(month),
      ),
    ).toBe(true);
    const owner = engineer2().id;
    expect(pipeline(manager(), { owner }).quotes.every((q) => q.ownerId === owner)).toBe(true);
  });

  it("shows an engineer only the quotes they own, and no reviewer or administrator at all", () => {
    const mine = pipeline(engineer2()).quotes;
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((q) => q.ownerId === engineer2().id)).toBe(true);
    expect(() => pipeline(reviewer())).toThrow(ForbiddenError);
    expect(() => pipeline(admin())).toThrow(ForbiddenError);
  });

  it("counts the win rate of quotes decided in the period: the demo's one accepted and one declined", () => {
    const to = new Date().toISOString().slice(0, 7);
    const from = new Date(Date.now() - 330 * 24 * 3600 * 1000).toISOString().slice(0, 7);
    expect(pipelineWinRate(manager(), { from, to })).toMatchObject({
      won: 1,
      lost: 1,
      ratePct: 50,
    });
    // Nothing was decided in a month long before the demo.
    expect(pipelineWinRate(manager(), { from: "2001-01", to: "2001-12" })).toMatchObject({
      won: 0,
      lost: 0,
      ratePct: null,
    });
  });
});

describe("sending a proposal by e-mail through the local SMTP server", () => {
  it("invites a new reviewer: the message arrives over SMTP with both parts and a working link that sets the password once", async () => {
    const proposal = frozenCase();
    const sent = await sendProposal(engineer(), proposal.id, {
      email: "dana.finance@example.com",
      name: "Dana Finance",
    });
    expect(sent).toMatchObject({
      stage: "sent",
      mail: { status: "sent" },
      reviewer: { invited: true, email: "dana.finance@example.com" },
    });
    const user = findUserForSignIn("dana.finance@example.com")!;
    expect(user).toMatchObject({ role: "reviewer", accountId: siteNamed("North hall").accountId });
    expect(getVisibleQuoteOrThrow(engineer(), proposal.id).stage).toBe("sent");

    const message = newestMailTo("dana.finance@example.com")!;
    expect(message.subject).toMatch(/^Retrofit proposal for Cartonia Packaging Plant: Mail test/);
    expectValueBreakdown(message.text, proposal.id);
    const link = linkIn(message.text, "/invitation/");
    expect(message.html).toContain(`href="${link}"`);
    const token = link.split("/invitation/")[1];
    // Only a hash of the token is stored (the token is in the e-mail alone).
    const { invitations } = await import("@/db/schema");
    expect(
      db
        .select()
        .from(invitations)
        .all()
        .some((i) => i.tokenHash === token),
    ).toBe(false);

    expect(inspectInvitation(token)).toMatchObject({
      state: "open",
      email: "dana.finance@example.com",
    });
    expect(acceptInvitation(token, "a-new-password-1")).toEqual({
      email: "dana.finance@example.com",
      proposalId: proposal.id,
    });
    expect(
      await verifyPassword(
        "a-new-password-1",
        findUserForSignIn("dana.finance@example.com")!.passwordHash,
      ),
    ).toBe(true);
    // The sign-in provider now takes the new password.
    const provider = authOptions.providers[0] as unknown as {
      options: { authorize: (c: unknown, r: unknown) => Promise<unknown> };
    };
    await expect(
      provider.options.authorize(
        { email: "dana.finance@example.com", password: "a-new-password-1" },
        { headers: {} },
      ),
    ).resolves.toMatchObject({ role: "reviewer" });

    // The link is dead afterwards.
    expect(inspectInvitation(token)).toEqual({ state: "used" });
    expect(() => acceptInvitation(token, "another-password-2")).toThrow(/already been used/);
    expect(
      await verifyPassword(
        "a-new-password-1",
        findUserForSignIn("dana.finance@example.com")!.passwordHash,
      ),
    ).toBe(true);
    expect(() => acceptInvitation("not-a-token", "another-password-2")).toThrow(NotFoundError);
  });

  it("refuses an invitation link after 7 days, with a clear message", async () => {
    const proposal = frozenCase();
    await sendProposal(engineer(), proposal.id, {
      email: "late.reader@example.com",
      name: "Late Reader",
    });
    const token = linkIn(newestMailTo("late.reader@example.com")!.text, "/invitation/").split(
      "/invitation/",
    )[1];
    const sixDays = new Date(Date.now() + 6 * 24 * 3600 * 1000);
    const eightDays = new Date(Date.now() + 8 * 24 * 3600 * 1000);
    expect(inspectInvitation(token, sixDays).state).toBe("open");
    expect(inspectInvitation(token, eightDays).state).toBe("expired");
    expect(() => acceptInvitation(token, "too-late-password", eightDays)).toThrow(/expired/);
  });

  it("mails an existing reviewer a link to the proposal instead of an invitation", async () => {
    const proposal = frozenCase();
    const sent = await sendProposal(engineer(), proposal.id, {
      email: "reviewer@example.com",
      name: "ignored",
    });
    expect(sent.reviewer).toMatchObject({ invited: false, name: "Demo Finance Reviewer" });
    const message = newestMailTo("reviewer@example.com")!;
    expect(message.text).toContain(`${APP}/review/proposals/${proposal.id}`);
    expect(message.text).not.toContain("/invitation/");
  });

  it("refuses an address that belongs to a vendor user or another account's reviewer", async () => {
    const proposal = frozenCase();
    await expect(
      sendProposal(engineer(), proposal.id, { email: "manager@example.com", name: "M" }),
    ).rejects.toThrow(/already registered/);
    expect(getVisibleQuoteOrThrow(engineer(), proposal.id).stage).toBe("ready");
  });

  it("queues the message when the mail server is down, still sends the proposal, and delivers it on retry", async () => {
    const proposal = frozenCase();
    await smtp.close();
    const sent = await sendProposal(engineer(), proposal.id, {
      email: "queued.reviewer@example.com",
      name: "Queued Reviewer",
    });
    expect(sent.stage).toBe("sent");
    expect(sent.mail).toMatchObject({ status: "queued", notice: expect.stringMatching(/queued/) });
    expect(getVisibleQuoteOrThrow(engineer(), proposal.id).stage).toBe("sent");
    expect(newestMailTo("queued.reviewer@example.com")).toBeUndefined();
    const pending = db.select().from(mailQueue).where(eq(mailQueue.status, "pending")).all();
    expect(pending.map((m) => m.toAddress)).toContain("queued.reviewer@example.com");

    smtp = await startFakeSmtpServer(smtpDb);
    process.env.SMTP_URL = smtp.url;
    expect(await flushMailQueue(new Date(Date.now() + 10 * 60_000))).toBeGreaterThanOrEqual(1);
    expect(newestMailTo("queued.reviewer@example.com")?.text).toMatch(/\/invitation\//);
    expect(db.select().from(mailQueue).where(eq(mailQueue.status, "pending")).all()).toEqual([]);
  });

  it("needs a manager's approval for a kit discount above the administrator's threshold (default 15 %)", async () => {
    const proposal = frozenCase(engineer(), "North hall", 20);
    await expect(
      sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" }),
    ).rejects.toThrow(/sales manager must approve/);
    expect(() => approveDiscount(engineer(), proposal.id)).toThrow(ForbiddenError);
    approveDiscount(manager(), proposal.id);
    expect(() => approveDiscount(manager(), proposal.id)).toThrow(ConflictError);
    await expect(
      sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" }),
    ).resolves.toMatchObject({ stage: "sent" });

    // With the threshold raised to 25 %, the same discount needs no approval.
    const before = getSalesSettings();
    saveSalesSettings(admin(), {
      discountThresholdPct: 25,
      stageProbabilities: before.stageProbabilities,
    });
    const other = frozenCase(engineer(), "North hall", 20);
    await expect(
      sendProposal(engineer(), other.id, { email: "reviewer@example.com", name: "R" }),
    ).resolves.toMatchObject({ stage: "sent" });
    saveSalesSettings(admin(), {
      discountThresholdPct: before.discountThresholdPct,
      stageProbabilities: before.stageProbabilities,
    });
    expect(() => saveSalesSettings(manager(), before)).toThrow(ForbiddenError);
  });
});

describe("the reviewer's sandbox", () => {
  it("returns the engine's result with the reviewer's finance figures and leaves the proposal untouched", () => {
    const seeded = listProposalsFor(reviewer()).find((p) => p.stage === "sent")!;
    const rowBefore = db.select().from(proposals).where(eq(proposals.id, seeded.id)).get();
    const quoteBefore = db.select().from(quotes).where(eq(quotes.proposalId, seeded.id)).get();
    const auditBefore = db.select().from(auditLog).all().length;
    const { input, result } = getProposalSnapshotOrThrow(reviewer(), seeded.id);

    const overrides = whatIfSchema.parse({
      tariffPerKWh: "0.40",
      tariffEscalationPct: 4,
      discountRatePct: 10,
      horizonYears: 8,
    });
    const mine = runWhatIf(reviewer(), seeded.id, overrides);
    expect(mine).toEqual(evaluateCase({ ...input, finance: { ...input.finance, ...overrides } }));
    expect(mine.scenarios.physics.cashFlows).toHaveLength(9);
    expect(mine.scenarios.physics.npv).not.toBe(result.scenarios.physics.npv);

    expect(db.select().from(proposals).where(eq(proposals.id, seeded.id)).get()).toEqual(rowBefore);
    expect(db.select().from(quotes).where(eq(quotes.proposalId, seeded.id)).get()).toEqual(
      quoteBefore,
    );
    expect(db.select().from(auditLog).all()).toHaveLength(auditBefore);
  });

  it("names what is wrong with a figure the engine cannot take", () => {
    const bad = whatIfSchema.safeParse({ horizonYears: 50, tariffPerKWh: "-1", rogue: 1 });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join(".") || i.message);
    expect(paths).toEqual(expect.arrayContaining(["horizonYears", "tariffPerKWh"]));
    expect(bad.error!.issues.find((i) => i.path[0] === "horizonYears")!.message).toBe(
      "Horizon must be at most 30",
    );
  });
});

describe("the reviewer's decision and the conversation", () => {
  it("accepting moves the stage and the case, records the audit entry, and mails the owner", async () => {
    const proposal = frozenCase();
    await sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" });
    const outcome = await decideProposal(
      reviewer(),
      proposal.id,
      decisionSchema.parse({ decision: "accept", comment: "Go ahead in the March shutdown." }),
    );
    expect(outcome).toMatchObject({ stage: "accepted", mail: { status: "sent" } });
    const quote = getVisibleQuoteOrThrow(manager(), proposal.id);
    expect(quote.stage).toBe("accepted");
    expect(quote.decidedAt).not.toBeNull();
    expect(getCaseOrThrow(engineer(), proposal.caseId).stage).toBe("won");
    const audit = db
      .select()
      .from(auditLog)
      .where(eq(auditLog.action, "proposal.decision"))
      .all()
      .at(-1)!;
    expect(audit).toMatchObject({
      actorEmail: "reviewer@example.com",
      targetId: String(proposal.id),
    });
    const mail = newestMailTo("engineer@example.com")!;
    expect(mail.subject).toMatch(/^Demo Finance Reviewer accepted Mail test/);
    expect(mail.text).toContain("Go ahead in the March shutdown.");
    expect(mail.text).toContain(`${APP}/proposals/${proposal.id}`);
    expect(listComments(engineer(), proposal.id).at(-1)).toMatchObject({
      decision: "accept",
      authorRole: "reviewer",
    });
    await expect(
      decideProposal(reviewer(), proposal.id, decisionSchema.parse({ decision: "decline" })),
    ).rejects.toThrow(/already accepted/);
  });

  it("asks for a comment when changes are asked for, and a newer version replaces the one decided on", async () => {
    expect(decisionSchema.safeParse({ decision: "changes", comment: " " }).success).toBe(false);
    expect(decisionSchema.safeParse({ decision: "maybe" }).success).toBe(false);
    const proposal = frozenCase();
    await sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" });
    await decideProposal(
      reviewer(),
      proposal.id,
      decisionSchema.parse({ decision: "changes", comment: "Six years, please." }),
    );
    expect(getVisibleQuoteOrThrow(engineer(), proposal.id).stage).toBe("changes");
    const v2 = freezeProposal(engineer(), proposal.caseId);
    expect(getVisibleQuoteOrThrow(engineer(), proposal.id).stage).toBe("replaced");
    expect(getVisibleQuoteOrThrow(engineer(), v2.id).stage).toBe("ready");
    await expect(
      decideProposal(reviewer(), proposal.id, decisionSchema.parse({ decision: "accept" })),
    ).rejects.toThrow(/replaced by version 2/);
    // v2 is not sent yet: the reviewer cannot see it.
    expect(() => getVisibleQuoteOrThrow(reviewer(), v2.id)).toThrow(NotFoundError);
  });

  it("mails each side the other's comments", async () => {
    const seeded = listProposalsFor(reviewer()).find((p) => p.stage === "sent")!;
    const fromReviewer = await addComment(
      reviewer(),
      seeded.id,
      "Does the price include the brake checks?",
    );
    expect(fromReviewer.mail).toEqual({ status: "sent" });
    expect(newestMailTo("engineer@example.com")!.text).toContain(
      "Does the price include the brake checks?",
    );
    await addComment(engineer(), seeded.id, "Yes, one hour per vertical axis.");
    expect(newestMailTo("reviewer@example.com")!.text).toContain(
      "Yes, one hour per vertical axis.",
    );
    expect(
      listComments(reviewer(), seeded.id)
        .slice(-2)
        .map((c) => c.authorRole),
    ).toEqual(["reviewer", "engineer"]);
  });
});

describe("who sees which proposal", () => {
  it("a reviewer sees only the proposals sent to their own account; every other id is not found, on every path", async () => {
    const mine = listProposalsFor(reviewer());
    const cartonia = siteNamed("North hall").accountId;
    expect(mine.length).toBeGreaterThanOrEqual(2);
    expect(mine.every((p) => p.accountId === cartonia && p.sentAt !== null)).toBe(true);
    // Nothing internal leaks to a reviewer: no weights, discounts or close dates.
    expect(Object.keys(mine[0])).not.toEqual(expect.arrayContaining(["weighted"]));
    expect(mine[0]).not.toHaveProperty("maxDiscountPct");

    const others = pipeline(manager()).quotes.filter(
      (q) => q.accountId !== cartonia || q.sentAt === null,
    );
    expect(others.some((q) => q.accountId !== cartonia)).toBe(true);
    expect(others.some((q) => q.accountId === cartonia && q.sentAt === null)).toBe(true);
    for (const q of [...others.map((o) => o.id), 99_999_999]) {
      expect(() => getVisibleQuoteOrThrow(reviewer(), q)).toThrow(NotFoundError);
      expect(() => getProposalSnapshotOrThrow(reviewer(), q)).toThrow(NotFoundError);
      expect(() => runWhatIf(reviewer(), q, {})).toThrow(NotFoundError);
      expect(() => listComments(reviewer(), q)).toThrow(NotFoundError);
      await expect(
        decideProposal(reviewer(), q, decisionSchema.parse({ decision: "accept" })),
      ).rejects.toThrow(NotFoundError);
      await expect(addComment(reviewer(), q, "hello")).rejects.toThrow(NotFoundError);
    }
  });

  it("a reviewer of another account sees none of the first account's proposals", async () => {
    const webline = frozenCase(engineer(), "Finishing works");
    await sendProposal(engineer(), webline.id, {
      email: "web.reviewer@example.com",
      name: "Web Reviewer",
    });
    const other = caller("web.reviewer@example.com");
    const weblineSent = pipeline(manager())
      .quotes.filter((q) => q.accountName === "Webline Print Finishing" && q.sentAt !== null)
      .map((q) => q.id);
    expect(weblineSent).toContain(webline.id);
    expect(
      listProposalsFor(other)
        .map((p) => p.id)
        .sort(),
    ).toEqual(weblineSent.sort());
    for (const p of listProposalsFor(reviewer()))
      expect(() => getProposalSnapshotOrThrow(other, p.id)).toThrow(NotFoundError);
  });

  it("an engineer reaches the proposals of their accounts only; only managers move quotes", async () => {
    const theirs = pipeline(manager()).quotes.find(
      (q) => q.accountName === "Pipetteworks Lab Automation",
    )!;
    expect(() => getVisibleQuoteOrThrow(engineer(), theirs.id)).toThrow(NotFoundError);
    await expect(
      sendProposal(engineer(), theirs.id, { email: "x@example.com", name: "X" }),
    ).rejects.toThrow(NotFoundError);
    expect(() => updateQuote(engineer(), theirs.id, { stage: "accepted" })).toThrow(ForbiddenError);
    await expect(
      sendProposal(reviewer(), theirs.id, { email: "x@example.com", name: "X" }),
    ).rejects.toThrow(ForbiddenError);
  });

  it("a manager changes stage, owner and close date, each in the audit log; an owner must work on the account", () => {
    const proposal = frozenCase();
    const out = updateQuote(manager(), proposal.id, {
      stage: "declined",
      ownerId: manager().id,
      expectedCloseOn: "2027-03-31",
    });
    expect(out.changes).toHaveLength(3);
    const quote = getVisibleQuoteOrThrow(manager(), proposal.id);
    expect(quote).toMatchObject({
      stage: "declined",
      ownerId: manager().id,
      expectedCloseOn: "2027-03-31",
    });
    expect(getCaseOrThrow(manager(), proposal.caseId).stage).toBe("lost");
    const entries = db
      .select()
      .from(auditLog)
      .where(eq(auditLog.targetId, String(proposal.id)))
      .all();
    expect(entries.filter((e) => e.action === "quote.update")).toHaveLength(3);
    // engineer2 works on neither Cartonia account: not an owner for it.
    expect(() => updateQuote(manager(), proposal.id, { ownerId: engineer2().id })).toThrow(
      NotFoundError,
    );
  });

  it("lists the outbox for administrators only, newest first", () => {
    const all = listOutbox(admin());
    expect(all.length).toBeGreaterThan(3);
    const stamps = all.map((m) => m.createdAt);
    expect([...stamps].sort().reverse()).toEqual(stamps);
    expect(Object.keys(all[0]).sort()).toEqual([
      "createdAt",
      "html",
      "id",
      "subject",
      "text",
      "to",
    ]);
    expect(() => listOutbox(manager())).toThrow(ForbiddenError);
  });
});
