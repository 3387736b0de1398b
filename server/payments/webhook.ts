import "server-only";
import Stripe from "stripe";
import { recordPaymentEvent, type RecordedEvent } from "@/server/payments/record-event";
import { deliverMail } from "@/server/mail/queue";
import { MISSING_WEBHOOK_SECRET, PaymentConfigError, paymentConfig } from "./config";

export class BadSignatureError extends Error {}

// constructEvent refuses signatures older than its tolerance (300 s) but not ones dated in the
// future, which a leaked signing secret could use to mint events that stay valid for long.
export const FUTURE_TOLERANCE_S = 300;

function signedAt(signature: string | null): number | null {
  const t = signature
    ?.split(",")
    .map((part) => part.trim().split("="))
    .find(([k]) => k === "t")?.[1];
  return t && /^\d+$/.test(t) ? Number(t) : null;
}

/**
 * Verifies a webhook with the SDK's constructEvent against the raw body, records it once (the
 * receipt is queued in the same transaction when this event unlocked a dossier), then hands the
 * receipt to the mail server. A body whose signature does not verify throws BadSignatureError
 * before anything is read from it.
 */
export async function handlePaymentWebhook(
  rawBody: string,
  signature: string | null,
): Promise<RecordedEvent> {
  const { webhookSecret } = paymentConfig();
  // An empty key would make the signature computable by anyone: refuse before verifying.
  if (!webhookSecret) throw new PaymentConfigError(MISSING_WEBHOOK_SECRET);
  let event: Stripe.Event;
  try {
    event = Stripe.webhooks.constructEvent(rawBody, signature ?? "", webhookSecret);
  } catch (error) {
    throw new BadSignatureError(error instanceof Error ? error.message : "bad signature");
  }
  const t = signedAt(signature);
  if (t === null || t > Math.floor(Date.now() / 1000) + FUTURE_TOLERANCE_S) {
    throw new BadSignatureError("The signature's timestamp lies in the future");
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
  if (recorded.receiptMailId !== null) {
    // The grant and its queued receipt are committed. A mail server that does not answer leaves
    // the receipt in the queue for the retry; it must not fail the webhook, or the provider
    // would send the event again for nothing.
    await deliverMail([recorded.receiptMailId]).catch((error: unknown) =>
      console.error("the dossier receipt could not be handed to the mail server", error),
    );
  }
  return recorded;
}
