import type { Metadata } from "next";
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess } from "@/db/queries/dossiers";
import { getCheckoutOrThrow } from "@/db/queries/payments";
import { requirePageUser } from "@/server/auth";
import { firstParam, idParam, orNotFound, type SearchParams } from "@/lib/pages";
import { stripeClient } from "@/server/payments/client";
import { formatMoney } from "@/lib/results/format";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Payment" };

// Where the checkout sends the buyer back after paying. The dossier unlocks on the provider's
// signed webhook, not on this visit; the page says which of the two has happened.
export default async function PaidPage({
  params,
  searchParams,
}: {
  params: Promise<{ proposalId: string }>;
  searchParams: SearchParams;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).proposalId);
  const sessionId = firstParam((await searchParams).session_id) ?? "";
  const checkout = orNotFound(() => getCheckoutOrThrow(user, id, sessionId));
  const { proposal, grant } = getDossierAccess(user, id);
  const session = await stripeClient().checkout.sessions.retrieve(checkout.id);
  const paid = session.payment_status === "paid";
  const amount = formatMoney(checkout.amount, checkout.currency);

  return (
    <div className="mx-auto max-w-2xl space-y-6">
      {!grant && paid ? <meta httpEquiv="refresh" content="2" /> : null}
      <PageHeader title={`Dossier: ${proposal.caseName}, proposal v${proposal.version}`} />
      <Panel>
        {grant ? (
          <div role="status" className="space-y-4">
            <h2 className="text-title text-success-700">
              Payment received: the dossier is unlocked
            </h2>
            <p className="text-steel-800">
              {amount} paid. The receipt is on its way to {checkout.buyerEmail}. Everyone who works
              on {proposal.accountName} can now open the report and download the workbook, and so
              can the customer&apos;s reviewer the proposal is sent to.
            </p>
            <div className="flex flex-wrap gap-2">
              <Link href={`/dossiers/${id}`} className={buttonClass("primary")}>
                Open the dossier
              </Link>
              <a href={`/api/v1/proposals/${id}/dossier`} className={buttonClass("secondary")}>
                Download the workbook (.xlsx)
              </a>
            </div>
          </div>
        ) : paid ? (
          <div role="status" className="space-y-3">
            <h2 className="text-title text-flux-800">Payment received, confirmation pending</h2>
            <p className="text-steel-800">
              The payment of {amount} went through. The dossier unlocks as soon as the payment
              provider confirms it to Loopshift, usually within seconds; this page checks again by
              itself.
            </p>
          </div>
        ) : (
          <div role="alert" className="space-y-3">
            <h2 className="text-title text-danger-700">The payment has not gone through</h2>
            <p className="text-steel-800">
              Nothing was charged and the dossier stays locked. You can try again from the dossier
              page.
            </p>
            <Link href={`/dossiers/${id}`} className={buttonClass("secondary")}>
              Back to the dossier
            </Link>
          </div>
        )}
      </Panel>
    </div>
  );
}
