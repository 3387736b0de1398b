import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import {
  accounts,
  cases,
  checkoutSessions,
  dossierGrants,
  paymentEvents,
  proposals,
  users,
  type CheckoutSession,
} from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import { appUrl } from "@/lib/mail/app-url";
import { dossierReceiptMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/lib/mail/queue";
import { recordAudit } from "./audit";
import { getProposalOrThrow } from "./cases";

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

/** What a verified webhook event carries that matters here. */
export interface VerifiedEvent {
  id: string;
  type: string;
  session: {
    id: string;
    paymentStatus: string | null;
    amountTotal: number | null;
    currency: string | null;
  } | null;
}

export type EventOutcome =
  | "granted"
  | "already granted"
  | "unknown session"
  | "amount or currency differs"
  | "not paid"
  | "ignored";

export interface RecordedEvent {
  duplicate: boolean;
  outcome: EventOutcome;
  /** Set when this event unlocked a dossier. */
  granted: (CheckoutSession & { caseName: string; version: number; accountName: string }) | null;
  /** The buyer's receipt, queued with the grant; delivered once the transaction is committed. */
  receiptMailId: number | null;
}

/**
 * Records a webhook event whose signature the caller verified, once: the event id is the key,
 * and a replay answers "duplicate" without touching anything. A checkout.session.completed for
 * a paid session of ours, at the amount and currency we asked, grants the proposal's dossier
 * to its account and queues the buyer's receipt — in the same transaction, so an event is never
 * half applied and a replay, already recorded, can never queue a second receipt. The caller here
 * is the payment provider, proved by the signature; there is no user.
 */
export function recordPaymentEvent(event: VerifiedEvent): RecordedEvent {
  return db.transaction((tx) => {
    const seen = tx
      .select({ id: paymentEvents.id, outcome: paymentEvents.outcome })
      .from(paymentEvents)
      .where(eq(paymentEvents.id, event.id))
      .get();
    if (seen)
      return {
        duplicate: true,
        outcome: seen.outcome as EventOutcome,
        granted: null,
        receiptMailId: null,
      };

    const decide = (): { outcome: EventOutcome; checkout: CheckoutSession | null } => {
      if (event.type !== "checkout.session.completed" || !event.session)
        return { outcome: "ignored", checkout: null };
      const checkout =
        tx.select().from(checkoutSessions).where(eq(checkoutSessions.id, event.session.id)).get() ??
        null;
      if (!checkout) return { outcome: "unknown session", checkout: null };
      if (event.session.paymentStatus !== "paid") return { outcome: "not paid", checkout: null };
      if (
        event.session.amountTotal !== checkout.amountMinor ||
        event.session.currency?.toUpperCase() !== checkout.currency
      )
        return { outcome: "amount or currency differs", checkout: null };
      const already = tx
        .select({ id: dossierGrants.id })
        .from(dossierGrants)
        .where(eq(dossierGrants.proposalId, checkout.proposalId))
        .get();
      return { outcome: already ? "already granted" : "granted", checkout };
    };
    const { outcome, checkout } = decide();
    tx.insert(paymentEvents)
      .values({ id: event.id, type: event.type, sessionId: event.session?.id ?? null, outcome })
      .run();
    if (!checkout) return { duplicate: false, outcome, granted: null, receiptMailId: null };

    const completedAt = new Date().toISOString();
    tx.update(checkoutSessions)
      .set({ status: "complete", completedAt })
      .where(eq(checkoutSessions.id, checkout.id))
      .run();
    if (outcome !== "granted")
      return { duplicate: false, outcome, granted: null, receiptMailId: null };
    tx.insert(dossierGrants)
      .values({
        proposalId: checkout.proposalId,
        accountId: checkout.accountId,
        sessionId: checkout.id,
        eventId: event.id,
      })
      .run();
    const about = tx
      .select({ caseName: cases.name, version: proposals.version, accountName: accounts.name })
      .from(proposals)
      .innerJoin(cases, eq(cases.id, proposals.caseId))
      .innerJoin(accounts, eq(accounts.id, cases.accountId))
      .where(eq(proposals.id, checkout.proposalId))
      .get()!;
    recordAudit({
      actor: null,
      action: "dossier.grant",
      targetType: "proposal",
      targetId: checkout.proposalId,
      detail: `${about.caseName} v${about.version}: ${checkout.amount} ${checkout.currency}, event ${event.id}`,
    });
    const buyer = checkout.buyerId
      ? tx.select({ name: users.name }).from(users).where(eq(users.id, checkout.buyerId)).get()
      : undefined;
    const receiptMailId = enqueueMail(
      tx,
      { email: checkout.buyerEmail, name: buyer?.name },
      dossierReceiptMail({
        recipientName: buyer?.name ?? null,
        accountName: about.accountName,
        caseName: about.caseName,
        version: about.version,
        amount: checkout.amount,
        currency: checkout.currency,
        paidAt: completedAt,
        reference: checkout.id,
        dossierUrl: appUrl(`/dossiers/${checkout.proposalId}`),
      }),
    );
    return {
      duplicate: false,
      outcome,
      granted: { ...checkout, status: "complete" as const, completedAt, ...about },
      receiptMailId,
    };
  });
}

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
