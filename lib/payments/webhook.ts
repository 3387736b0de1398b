import "server-only";
import Stripe from "stripe";
import { recordPaymentEvent, type RecordedEvent } from "@/db/queries/payments";
import { appOrigin } from "./checkout";
import { paymentConfig } from "./config";
import { sendDossierReceipt } from "./receipt";

export class BadSignatureError extends Error {}

/**
 * Verifies a webhook with the SDK's constructEvent against the raw body, records it once, and
 * mails the receipt when this event unlocked a dossier. A body whose signature does not verify
 * throws BadSignatureError before anything is read from it.
 */
export async function handlePaymentWebhook(
  rawBody: string,
  signature: string | null,
): Promise<RecordedEvent> {
  let event: Stripe.Event;
  try {
    event = Stripe.webhooks.constructEvent(rawBody, signature ?? "", paymentConfig().webhookSecret);
  } catch (error) {
    throw new BadSignatureError(error instanceof Error ? error.message : "bad signature");
  }
  const session =
    event.type === "checkout.session.completed"
      ? (event.data.object as Stripe.Checkout.Session)
      : null;
  const recorded = recordPaymentEvent({
    id: event.id,
    type: event.type,
    session: session
      ? {
          id: session.id,
          paymentStatus: session.payment_status ?? null,
          amountTotal: session.amount_total ?? null,
          currency: session.currency ?? null,
        }
      : null,
  });
  const g = recorded.granted;
  if (g) {
    // The grant is committed; a mail that fails must not undo it or make the provider retry.
    await sendDossierReceipt({
      to: g.buyerEmail,
      accountName: g.accountName,
      caseName: g.caseName,
      version: g.version,
      proposalId: g.proposalId,
      amount: g.amount,
      currency: g.currency,
      sessionId: g.id,
      paidAt: g.completedAt ?? new Date().toISOString(),
      reportUrl: `${appOrigin()}/dossiers/${g.proposalId}`,
    }).catch((error: unknown) => console.error("the dossier receipt could not be mailed", error));
  }
  return recorded;
}
