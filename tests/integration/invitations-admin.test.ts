// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { openDatabase } from "@/db/client";
import { listAudit } from "@/db/queries/audit";
import { setCaseAxes, listCaseAxes, setAxisRetrofit } from "@/db/queries/case-axes";
import { createCase } from "@/db/queries/cases";
import { listAxesForExport } from "@/db/queries/axes";
import {
  acceptInvitation,
  inspectInvitation,
  INVITATION_MESSAGES,
  revokeInvitation,
} from "@/db/queries/invitations";
import { listOutbox } from "@/db/queries/outbox";
import { listSites } from "@/db/queries/sites";
import { findUserForSignIn, listUsers, setUserActive } from "@/db/queries/users";
import { auditLog, invitations, mailQueue } from "@/db/schema";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { axisRetrofitSchema } from "@/lib/validations/case";
import { freezeProposal } from "@/server/cases/freeze";
import { resendInvitationAction, revokeInvitationAction } from "@/server/invitations/actions";
import { resendInvitation } from "@/server/invitations/resend";
import { startFakeSmtpServer, type FakeSmtpServer } from "@/server/mail/fake-smtp-server";
import { sendProposal } from "@/server/proposals/send";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

const engineer = () => caller("engineer@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");
const reviewer = () => caller("reviewer@example.com");

const APP = "http://loopshift.test:4321";
let smtp: FakeSmtpServer;
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

// A new reviewer invited the way the app invites people: a proposal sent to a new address.
async function invitedReviewer(email: string) {
  const site = listSites(manager()).find((s) => s.name === "North hall")!;
  const row = createCase(engineer(), { name: `Invite ${email}`, siteId: site.id });
  const picked = listAxesForExport(engineer(), site.id, 0, 2).axes.map((a) => a.id);
  setCaseAxes(engineer(), row.id, picked);
  for (const axis of listCaseAxes(engineer(), row.id))
    setAxisRetrofit(
      engineer(),
      row.id,
      axis.axisId,
      axisRetrofitSchema.parse({ kitId: axis.kitId, discountPct: 0 }),
    );
  const proposal = freezeProposal(engineer(), row.id);
  await sendProposal(engineer(), proposal.id, { email, name: `Reviewer ${email.split("@")[0]}` });
  return { user: findUserForSignIn(email)!, token: newestToken(email), proposalId: proposal.id };
}

const mailsTo = (email: string) => listOutbox(admin()).filter((m) => m.to.includes(email));

function newestToken(email: string): string {
  const text = mailsTo(email)[0]?.text ?? "";
  const match = /\/invitation\/([A-Za-z0-9_-]+)/.exec(text);
  if (!match) throw new Error(`no invitation link in the newest mail to ${email}`);
  return match[1];
}

const invitationCount = (userId: number) =>
  db.select({ n: count() }).from(invitations).where(eq(invitations.userId, userId)).get()!.n;
const auditCount = () => db.select({ n: count() }).from(auditLog).get()!.n;
const userRow = (email: string) =>
  listUsers(admin(), { q: email }).rows.find((u) => u.email === email)!;

describe("the users list tells invited users from active ones", () => {
  it("reads Invited, with when and until when, until the user chooses a password", async () => {
    const { token } = await invitedReviewer("status.reader@example.com");
    const row = userRow("status.reader@example.com");
    expect(row).toMatchObject({ status: "invited", inviteLink: "open", inviteRevokedAt: null });
    const days = (Date.parse(row.inviteExpiresAt!) - Date.parse(row.invitedAt!)) / 86400000;
    expect(days).toBeCloseTo(7, 1);
    // The seeded users were created with a password and never invited.
    expect(userRow("reviewer@example.com").status).toBe("active");
    expect(listUsers(admin(), { status: "invited" }).rows.map((u) => u.email)).toContain(
      "status.reader@example.com",
    );
    expect(listUsers(admin(), { status: "active" }).rows.map((u) => u.email)).not.toContain(
      "status.reader@example.com",
    );

    acceptInvitation(token, "a-chosen-password-1");
    expect(userRow("status.reader@example.com")).toMatchObject({
      status: "active",
      inviteLink: null,
    });
    setUserActive(admin(), findUserForSignIn("status.reader@example.com")!.id, false);
    expect(listUsers(admin(), { status: "inactive" }).rows.map((u) => u.email)).toEqual([
      "status.reader@example.com",
    ]);
  });

  it("pages the users list on the server, the total counting the whole filter", () => {
    const all = listUsers(admin(), { sort: "email" });
    const first = listUsers(admin(), { sort: "email", page: 1 }, 2);
    const second = listUsers(admin(), { sort: "email", page: 2 }, 2);
    expect(first.total).toBe(all.total);
    expect(first.pageCount).toBe(Math.ceil(all.total / 2));
    expect([...first.rows, ...second.rows].map((u) => u.email)).toEqual(
      all.rows.slice(0, 4).map((u) => u.email),
    );
    // A page past the end shows the last page instead of nothing.
    const last = listUsers(admin(), { sort: "email", page: 999 }, 2);
    expect(last.page).toBe(last.pageCount);
    expect(last.rows.length).toBeGreaterThan(0);
  });
});

describe("sending an invitation again", () => {
  it("refuses engineers, managers and reviewers, through the action too, and writes nothing", async () => {
    const { user, token } = await invitedReviewer("scope.resend@example.com");
    const before = { invitations: invitationCount(user.id), audit: auditCount() };
    for (const who of [engineer(), manager(), reviewer()]) {
      await expect(resendInvitation(who, user.id)).rejects.toThrow(ForbiddenError);
      expect(
        await asRequestOf(who, () => resendInvitationAction({ userId: user.id })),
      ).toMatchObject({ ok: false, message: "Your role may not do this" });
    }
    expect(invitationCount(user.id)).toBe(before.invitations);
    expect(auditCount()).toBe(before.audit);
    expect(inspectInvitation(token).state).toBe("open");
  });

  it("revokes the old link and mails a new one that works, audited", async () => {
    const { user, token: oldToken, proposalId } = await invitedReviewer("lost.link@example.com");
    // The action's success path ends in revalidatePath, which needs a running Next server; the
    // service it calls is the same one.
    expect(await resendInvitation(admin(), user.id)).toMatchObject({
      email: "lost.link@example.com",
      mail: { status: "sent" },
    });
    const newToken = newestToken("lost.link@example.com");
    expect(newToken).not.toBe(oldToken);
    expect(mailsTo("lost.link@example.com")[0].subject).toBe("Your new Loopshift invitation link");
    expect(inspectInvitation(oldToken).state).toBe("replaced");
    expect(() => acceptInvitation(oldToken, "old-link-password")).toThrow(
      INVITATION_MESSAGES.replaced,
    );
    expect(listAudit(admin())[0]).toMatchObject({
      action: "invitation.resend",
      actorEmail: "admin@example.com",
      targetId: String(user.id),
    });
    expect(listAudit(admin())[0].detail).toContain("lost.link@example.com");
    expect(userRow("lost.link@example.com")).toMatchObject({
      status: "invited",
      inviteLink: "open",
    });
    // The new link leads to the same proposal as the first one.
    expect(acceptInvitation(newToken, "new-link-password")).toEqual({
      email: "lost.link@example.com",
      proposalId,
    });
  });

  it("refuses a user who already chose a password, and a deactivated one, with a message", async () => {
    const seeded = reviewer();
    await expect(resendInvitation(admin(), seeded.id)).rejects.toThrow(
      "reviewer@example.com has already chosen a password, so there is no invitation to send again.",
    );
    const action = await asRequestOf(admin(), () => resendInvitationAction({ userId: seeded.id }));
    expect(action).toMatchObject({ ok: false });
    expect((action as { message: string }).message).toMatch(/already chosen a password/);

    const { user } = await invitedReviewer("paused.invite@example.com");
    setUserActive(admin(), user.id, false);
    await expect(resendInvitation(admin(), user.id)).rejects.toThrow(ConflictError);
    await expect(resendInvitation(admin(), user.id)).rejects.toThrow(/Reactivate the user/);
    await expect(resendInvitation(admin(), 999999)).rejects.toThrow(NotFoundError);
  });

  it("names the field when the user is missing", async () => {
    expect(await asRequestOf(admin(), () => resendInvitationAction({}))).toMatchObject({
      ok: false,
      fieldErrors: { userId: expect.stringMatching(/./) },
    });
  });

  it("writes nothing when a step fails: the old link keeps working and no new one exists", async () => {
    const { user, token } = await invitedReviewer("half.write@example.com");
    const before = {
      invitations: invitationCount(user.id),
      audit: auditCount(),
      mail: db.select({ n: count() }).from(mailQueue).get()!.n,
    };
    // A real failure of the last write inside the transaction: the queue refuses the message.
    db.$client.exec(
      `create trigger refuse_mail before insert on mail_queue begin select raise(abort, 'queue refused'); end`,
    );
    try {
      await expect(resendInvitation(admin(), user.id)).rejects.toThrow(/queue refused/);
    } finally {
      db.$client.exec(`drop trigger refuse_mail`);
    }
    expect(invitationCount(user.id)).toBe(before.invitations);
    expect(auditCount()).toBe(before.audit);
    expect(db.select({ n: count() }).from(mailQueue).get()!.n).toBe(before.mail);
    expect(inspectInvitation(token).state).toBe("open");
  });
});

describe("revoking an invitation", () => {
  it("refuses engineers, managers and reviewers, through the action too, and writes nothing", async () => {
    const { user, token } = await invitedReviewer("scope.revoke@example.com");
    const before = auditCount();
    for (const who of [engineer(), manager(), reviewer()]) {
      expect(() => revokeInvitation(who, user.id)).toThrow(ForbiddenError);
      expect(
        await asRequestOf(who, () => revokeInvitationAction({ userId: user.id })),
      ).toMatchObject({ ok: false, message: "Your role may not do this" });
    }
    expect(auditCount()).toBe(before);
    expect(inspectInvitation(token).state).toBe("open");
  });

  it("stops the link at once; the user stays, still invited, and can be invited again", async () => {
    const { user, token } = await invitedReviewer("withdrawn@example.com");
    expect(revokeInvitation(admin(), user.id)).toMatchObject({ email: "withdrawn@example.com" });
    expect(inspectInvitation(token).state).toBe("revoked");
    expect(() => acceptInvitation(token, "too-late-password")).toThrow(INVITATION_MESSAGES.revoked);
    expect(listAudit(admin())[0]).toMatchObject({
      action: "invitation.revoke",
      actorEmail: "admin@example.com",
      targetId: String(user.id),
    });
    expect(findUserForSignIn("withdrawn@example.com")?.active).toBe(true);
    expect(userRow("withdrawn@example.com")).toMatchObject({
      status: "invited",
      inviteLink: "revoked",
    });
    // Nothing left to revoke, and the message says what to do instead.
    expect(() => revokeInvitation(admin(), user.id)).toThrow(
      "withdrawn@example.com has no open invitation link to revoke.",
    );
    // Invited again: a new link that works.
    await resendInvitation(admin(), user.id);
    expect(inspectInvitation(newestToken("withdrawn@example.com")).state).toBe("open");
    expect(inspectInvitation(token).state).toBe("replaced");
  });

  it("refuses a user whose invitation was used, with a message", () => {
    expect(() => revokeInvitation(admin(), reviewer().id)).toThrow(/already chosen a password/);
  });

  it("writes nothing when the audit entry fails: the link still works", async () => {
    const { user, token } = await invitedReviewer("audit.fails@example.com");
    db.$client.exec(
      `create trigger refuse_audit before insert on audit_log begin select raise(abort, 'audit refused'); end`,
    );
    try {
      expect(() => revokeInvitation(admin(), user.id)).toThrow(/audit refused/);
    } finally {
      db.$client.exec(`drop trigger refuse_audit`);
    }
    expect(inspectInvitation(token).state).toBe("open");
  });
});
