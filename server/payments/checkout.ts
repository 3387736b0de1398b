import "server-only";
import { getDossierAccess, readDossierPrice } from "@/db/queries/dossiers";
import {
  latestOpenCheckout,
  markCheckoutExpired,
  recordCheckoutSession,
} from "@/db/queries/payments";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError } from "@/lib/errors";
import { stripeClient } from "./client";
import { minorUnits } from "@/lib/payments/minor-units";

/** The app's public URL, as the payment provider sends the customer back to it. */
export function appOrigin(): string {
  return (process.env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, "");
}

/**
 * Opens a Checkout Session for a proposal's dossier at the price the administrators set (the
 * client names only the proposal), records it, and answers the hosted page's URL.
 */
export async function createDossierCheckout(caller: SessionUser, proposalId: number) {
  // The vendor's team buys; the customer's reviewer only reads what was bought.
  assertRole(caller, ...VENDOR_ROLES);
  const { proposal, grant } = getDossierAccess(caller, proposalId);
  if (grant) throw new ConflictError("This proposal's dossier is already paid for");
  const price = readDossierPrice();
  const amountMinor = minorUnits(price.amount, price.currency);
  const origin = appOrigin();
  const session = await stripeClient().checkout.sessions.create({
    mode: "payment",
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: price.currency.toLowerCase(),
          unit_amount: amountMinor,
          product_data: {
            name: `Loopshift dossier: ${proposal.caseName}, proposal v${proposal.version}`,
          },
        },
      },
    ],
    customer_email: caller.email,
    client_reference_id: String(proposal.id),
    metadata: { proposalId: String(proposal.id), accountId: String(proposal.accountId) },
    success_url: `${origin}/dossiers/${proposal.id}/paid?session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${origin}/dossiers/${proposal.id}/cancelled`,
  });
  if (!session.url) throw new Error("The payment provider answered a session without a URL");
  recordCheckoutSession(caller, proposal.id, {
    id: session.id,
    amountMinor,
    amount: price.amount,
    currency: price.currency,
  });
  return { url: session.url, sessionId: session.id };
}

/**
 * Expires the caller's open checkout of a proposal at the provider, so a checkout page left
 * open in another tab cannot be paid later by mistake. A POST (the cancel page's button), never
 * a page load: a GET must not change anything, whoever's link leads to it.
 */
export async function closeOpenCheckout(caller: SessionUser, proposalId: number) {
  assertRole(caller, ...VENDOR_ROLES);
  const open = latestOpenCheckout(caller, proposalId);
  if (!open) return { closed: false };
  try {
    await stripeClient().checkout.sessions.expire(open.id);
  } catch (error) {
    // Paid in the meantime, or already expired: the provider knows; the webhook decides.
    console.error("could not expire the checkout session", error);
    return { closed: false };
  }
  markCheckoutExpired(caller, proposalId, open.id);
  return { closed: true };
}
