import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
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
import { appUrl } from "@/lib/mail/app-url";
import { dossierReceiptMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/server/mail/queue";

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
