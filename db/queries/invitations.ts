import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { db } from "@/db";
import { accounts, cases, invitations, proposals, sites, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { recordAudit } from "./audit";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

export const INVITATION_DAYS = 7;

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

/**
 * A new single-use invitation for the user, replacing any open one; returns the token, which is
 * only ever in the e-mail (the table keeps its hash).
 */
export function createInvitation(
  tx: Tx,
  args: { userId: number; proposalId: number | null; createdById: number; now?: Date },
) {
  const now = args.now ?? new Date();
  tx.update(invitations)
    .set({ revokedAt: now.toISOString() })
    .where(
      and(
        eq(invitations.userId, args.userId),
        isNull(invitations.usedAt),
        isNull(invitations.revokedAt),
      ),
    )
    .run();
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000).toISOString();
  tx.insert(invitations)
    .values({
      userId: args.userId,
      proposalId: args.proposalId,
      tokenHash: hashToken(token),
      expiresAt,
      createdById: args.createdById,
    })
    .run();
  return { token, expiresAt };
}

/**
 * Whether the user came in by invitation and has not chosen a password through one yet.
 *
 * The users table has no "password set" column, and this needs no migration: a password is only
 * ever chosen in two ways. An administrator creates vendor staff (and may create reviewers) with a
 * password they type (db/queries/users.ts createUser), and such users never get an invitation.
 * A reviewer created by sending a proposal (server/proposals/send.ts) gets a password nobody knows
 * plus an invitation, and chooses their own only by using one (acceptInvitation sets used_at).
 * So a user with invitations none of which was used has never set a password; anyone else has.
 * listUsers in db/queries/users.ts states the same rule in SQL for the users list.
 */
export function awaitsFirstPassword(userId: number): boolean {
  const rows = db
    .select({ usedAt: invitations.usedAt })
    .from(invitations)
    .where(eq(invitations.userId, userId))
    .all();
  return rows.length > 0 && rows.every((r) => r.usedAt === null);
}

export type InvitationState =
  | {
      state: "open";
      email: string;
      name: string;
      accountName: string | null;
      expiresAt: string;
      proposalId: number | null;
      /** Who sent the invitation (a person at the vendor); null when that user is gone. */
      senderName: string | null;
      /** The proposal it leads to, only when it belongs to the invited reviewer's own account. */
      proposal: { caseName: string; version: number; siteName: string } | null;
    }
  | { state: "invalid" | "used" | "replaced" | "revoked" }
  | { state: "expired"; expiredAt: string };

// The invitation page runs before anyone is signed in: the token itself is the credential.
export function inspectInvitation(token: string, now = new Date()): InvitationState {
  const row = db
    .select({
      invitation: invitations,
      email: users.email,
      name: users.name,
      active: users.active,
      accountId: users.accountId,
      accountName: accounts.name,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.userId))
    .leftJoin(accounts, eq(accounts.id, users.accountId))
    .where(eq(invitations.tokenHash, hashToken(token)))
    .get();
  if (!row || !row.active) return { state: "invalid" };
  if (row.invitation.usedAt) return { state: "used" };
  if (row.invitation.revokedAt) {
    // Revoked with nothing newer after it: an administrator withdrew the link (revokeInvitation);
    // with a newer invitation, that one replaced it.
    const newer = db
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(eq(invitations.userId, row.invitation.userId), gt(invitations.id, row.invitation.id)),
      )
      .get();
    return { state: newer ? "replaced" : "revoked" };
  }
  if (Date.parse(row.invitation.expiresAt) <= now.getTime())
    return { state: "expired", expiredAt: row.invitation.expiresAt };
  return {
    state: "open",
    email: row.email,
    name: row.name,
    accountName: row.accountName,
    expiresAt: row.invitation.expiresAt,
    proposalId: row.invitation.proposalId,
    senderName: senderName(row.invitation.createdById),
    proposal: invitedProposal(row.invitation.proposalId, row.accountId),
  };
}

function senderName(userId: number | null): string | null {
  if (userId === null) return null;
  return (
    db.select({ name: users.name }).from(users).where(eq(users.id, userId)).get()?.name ?? null
  );
}

// The proposal named on the invitation page, read only through the invited reviewer's own
// account: a proposal of any other account is never described to them, whatever the row says.
function invitedProposal(proposalId: number | null, accountId: number | null) {
  if (proposalId === null || accountId === null) return null;
  return (
    db
      .select({ caseName: cases.name, version: proposals.version, siteName: sites.name })
      .from(proposals)
      .innerJoin(cases, eq(cases.id, proposals.caseId))
      .innerJoin(sites, eq(sites.id, cases.siteId))
      .where(and(eq(proposals.id, proposalId), eq(cases.accountId, accountId)))
      .get() ?? null
  );
}

export const INVITATION_MESSAGES = {
  invalid:
    "This invitation link is not valid. Check that the whole address was copied from the e-mail.",
  used: "This invitation link has already been used to choose a password; it works only once. Sign in with your e-mail address and that password.",
  replaced:
    "A newer invitation replaced this link. Use the link in the most recent e-mail you received.",
  revoked:
    "This invitation link was withdrawn by an administrator. Ask your contact at the supplier to invite you again; you will receive a new link.",
  expired:
    "This invitation link has expired. Ask your contact at the supplier to send the proposal again; you will receive a new link.",
} as const;

/** Sets the password once; the link (and any other open one of the user's) is dead afterwards. */
export function acceptInvitation(token: string, password: string, now = new Date()) {
  const state = inspectInvitation(token, now);
  if (state.state === "invalid") throw new NotFoundError(INVITATION_MESSAGES.invalid);
  if (state.state !== "open") throw new ConflictError(INVITATION_MESSAGES[state.state]);
  const passwordHash = hashPassword(password);
  const stamp = now.toISOString();
  const user = db.transaction((tx) => {
    const invitation = tx
      .select()
      .from(invitations)
      .where(eq(invitations.tokenHash, hashToken(token)))
      .get()!;
    // Checked again inside the transaction: two tabs submitting at once set the password once.
    const claimed = tx
      .update(invitations)
      .set({ usedAt: stamp })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.usedAt)))
      .run();
    if (claimed.changes !== 1) throw new ConflictError(INVITATION_MESSAGES.used);
    tx.update(invitations)
      .set({ revokedAt: stamp })
      .where(
        and(
          eq(invitations.userId, invitation.userId),
          ne(invitations.id, invitation.id),
          isNull(invitations.usedAt),
          isNull(invitations.revokedAt),
        ),
      )
      .run();
    // A new password ends the sessions opened with the old one.
    tx.update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, invitation.userId))
      .run();
    return tx
      .select({ id: users.id, email: users.email })
      .from(users)
      .where(eq(users.id, invitation.userId))
      .get()!;
  });
  recordAudit({
    actor: user,
    action: "invitation.accept",
    targetType: "user",
    targetId: user.id,
    detail: `${user.email} chose a password`,
  });
  return { email: user.email, proposalId: state.proposalId };
}

type InvitationTarget = { id: number; email: string; name: string; active: boolean };

function invitationTargetOrThrow(userId: number): InvitationTarget {
  const user = db
    .select({ id: users.id, email: users.email, name: users.name, active: users.active })
    .from(users)
    .where(eq(users.id, userId))
    .get();
  if (!user) throw new NotFoundError("No such user");
  return user;
}

export const INVITATION_ADMIN_MESSAGES = {
  passwordSet: (email: string) =>
    `${email} has already chosen a password, so there is no invitation to send again. If they have forgotten it, create a new user for them or ask them to use the password they chose.`,
  deactivated: (email: string) =>
    `${email} is deactivated. Reactivate the user before sending them a new invitation.`,
  nothingToRevoke: (email: string) =>
    `${email} has no open invitation link to revoke. Send the invitation again to give them a new one.`,
  revokePasswordSet: (email: string) =>
    `${email} has already chosen a password; their invitation was used and cannot be revoked. Deactivate the user to stop them signing in.`,
} as const;

/**
 * The user an administrator may send a new invitation to: one still waiting to choose a
 * password, and active (an invitation link of a deactivated user does not work). Returns the
 * proposal of their latest invitation, so the new link leads to the same proposal.
 */
export function resendableInvitationOrThrow(caller: SessionUser, userId: number) {
  assertRole(caller, "admin");
  const user = invitationTargetOrThrow(userId);
  if (!awaitsFirstPassword(user.id))
    throw new ConflictError(INVITATION_ADMIN_MESSAGES.passwordSet(user.email));
  if (!user.active) throw new ConflictError(INVITATION_ADMIN_MESSAGES.deactivated(user.email));
  const latest = db
    .select({ proposalId: invitations.proposalId })
    .from(invitations)
    .where(eq(invitations.userId, user.id))
    .orderBy(desc(invitations.id))
    .limit(1)
    .get();
  return { user, proposalId: latest?.proposalId ?? null };
}

/**
 * Revokes the user's open invitation links: they stop working at once. The user stays, and since
 * they never chose a password they cannot sign in until an administrator (or a proposal sent to
 * them) invites them again.
 */
export function revokeInvitation(caller: SessionUser, userId: number, now = new Date()) {
  assertRole(caller, "admin");
  const user = invitationTargetOrThrow(userId);
  if (!awaitsFirstPassword(user.id))
    throw new ConflictError(INVITATION_ADMIN_MESSAGES.revokePasswordSet(user.email));
  const stamp = now.toISOString();
  return db.transaction((tx) => {
    const revoked = tx
      .update(invitations)
      .set({ revokedAt: stamp })
      .where(
        and(
          eq(invitations.userId, user.id),
          isNull(invitations.usedAt),
          isNull(invitations.revokedAt),
        ),
      )
      .run();
    if (revoked.changes === 0)
      throw new ConflictError(INVITATION_ADMIN_MESSAGES.nothingToRevoke(user.email));
    recordAudit({
      actor: caller,
      action: "invitation.revoke",
      targetType: "user",
      targetId: user.id,
      detail: `${user.email}: invitation link revoked`,
    });
    return { email: user.email, revokedAt: stamp };
  });
}
