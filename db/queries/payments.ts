import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import {
  accounts,
  cases,
  checkoutSessions,
  dossierGrants,
  proposals,
  type CheckoutSession,
} from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import { recordAudit } from "./audit";
import { getProposalOrThrow } from "./proposal-versions";

export function recordCheckoutSession(
  caller: SessionUser,
  proposalId: number,
  session: { id: string; amountMinor: number; amount: string; currency: string },
): CheckoutSession {
  const proposal = getProposalOrThrow(caller, proposalId);
  const [row] = db
    .insert(checkoutSessions)
    .values({
      id: session.id,
      proposalId: proposal.id,
      accountId: proposal.accountId,
      buyerId: caller.id,
      buyerEmail: caller.email,
      amountMinor: session.amountMinor,
      amount: session.amount,
      currency: session.currency,
    })
    .returning()
    .all();
  recordAudit({
    actor: caller,
    action: "dossier.checkout",
    targetType: "proposal",
    targetId: proposal.id,
    detail: `${session.amount} ${session.currency}, session ${session.id}`,
  });
  return row;
}

/** One of this proposal's checkout sessions, only through a proposal the caller may see. */
export function getCheckoutOrThrow(caller: SessionUser, proposalId: number, sessionId: string) {
  getProposalOrThrow(caller, proposalId);
  const row = db
    .select()
    .from(checkoutSessions)
    .where(and(eq(checkoutSessions.id, sessionId), eq(checkoutSessions.proposalId, proposalId)))
    .get();
  if (!row) throw new NotFoundError("No such checkout");
  return row;
}

/** The caller's most recent checkout of this proposal still open, if any (the cancel page). */
export function latestOpenCheckout(caller: SessionUser, proposalId: number) {
  getProposalOrThrow(caller, proposalId);
  return (
    db
      .select()
      .from(checkoutSessions)
      .where(
        and(
          eq(checkoutSessions.proposalId, proposalId),
          eq(checkoutSessions.buyerId, caller.id),
          eq(checkoutSessions.status, "open"),
        ),
      )
      .orderBy(desc(checkoutSessions.createdAt))
      .get() ?? null
  );
}

export function markCheckoutExpired(caller: SessionUser, proposalId: number, sessionId: string) {
  getCheckoutOrThrow(caller, proposalId, sessionId);
  db.update(checkoutSessions)
    .set({ status: "expired" })
    .where(and(eq(checkoutSessions.id, sessionId), eq(checkoutSessions.status, "open")))
    .run();
}

// Recording a verified webhook event (grant and receipt in one transaction) is
// server/payments/record-event.ts.

/** Every checkout, newest first, for the administrators' payments page. */
export function listCheckouts(caller: SessionUser, limit = 100) {
  assertRole(caller, "admin");
  return db
    .select({
      id: checkoutSessions.id,
      proposalId: checkoutSessions.proposalId,
      caseName: cases.name,
      version: proposals.version,
      accountName: accounts.name,
      buyerEmail: checkoutSessions.buyerEmail,
      amount: checkoutSessions.amount,
      currency: checkoutSessions.currency,
      status: checkoutSessions.status,
      createdAt: checkoutSessions.createdAt,
      grantedAt: dossierGrants.grantedAt,
    })
    .from(checkoutSessions)
    .innerJoin(proposals, eq(proposals.id, checkoutSessions.proposalId))
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, checkoutSessions.accountId))
    .leftJoin(dossierGrants, eq(dossierGrants.sessionId, checkoutSessions.id))
    .orderBy(desc(checkoutSessions.createdAt))
    .limit(limit)
    .all();
}
