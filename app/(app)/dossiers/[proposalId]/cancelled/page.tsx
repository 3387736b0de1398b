import type { Metadata } from "next";
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess } from "@/db/queries/dossiers";
import { latestOpenCheckout, markCheckoutExpired } from "@/db/queries/payments";
import { requirePageUser } from "@/lib/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { stripeClient } from "@/lib/payments/client";

export const metadata: Metadata = { title: "Checkout cancelled" };

// Where the checkout's "cancel" leads. The open session is expired at the provider, so the
// page left behind in another tab cannot be paid later by mistake.
export default async function CancelledPage({
  params,
}: {
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser("engineer", "manager", "admin");
  const id = idParam((await params).proposalId);
  const { proposal, grant } = orNotFound(() => getDossierAccess(user, id));
  const open = latestOpenCheckout(user, id);
  if (open) {
    try {
      await stripeClient().checkout.sessions.expire(open.id);
      markCheckoutExpired(user, id, open.id);
    } catch (error) {
      // Paid in the meantime, or already expired: the provider knows; the webhook decides.
      console.error("could not expire the checkout session", error);
    }
  }
  return (
    <div className="mx-auto max-w-2xl space-y-6">
      <PageHeader title={`Dossier: ${proposal.caseName}, proposal v${proposal.version}`} />
      <Panel>
        <div role="status" className="space-y-3">
          <h2 className="text-title text-steel-900">Checkout cancelled</h2>
          <p className="text-steel-800">
            {grant
              ? "This dossier was already paid for, so it stays unlocked; nothing more was charged."
              : "Nothing was charged and the dossier stays locked. You can buy it whenever you are ready."}
          </p>
          <Link href={`/dossiers/${id}`} className={buttonClass("secondary")}>
            Back to the dossier
          </Link>
        </div>
      </Panel>
    </div>
  );
}
