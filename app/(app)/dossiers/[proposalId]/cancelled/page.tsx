import type { Metadata } from "next";
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess } from "@/db/queries/dossiers";
import { latestOpenCheckout } from "@/db/queries/payments";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { closeDossierCheckoutAction } from "@/server/dossiers/actions";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Checkout cancelled" };

// Where the checkout's "cancel" leads. Loading it changes nothing (anyone's link can lead here);
// the open session is expired at the provider only by the button, a POST, so the checkout page
// left behind in another tab cannot be paid later by mistake. Left alone, it expires at the
// provider by itself.
export default async function CancelledPage({
  params,
}: {
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).proposalId);
  const { proposal, grant } = orNotFound(() => getDossierAccess(user, id));
  const open = grant ? null : latestOpenCheckout(user, id);
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
          {open && (
            <form action={closeDossierCheckoutAction.bind(null, id)}>
              <p className="text-steel-800">
                The checkout page may still be open in another tab. Close it so it cannot be paid by
                mistake.
              </p>
              <button type="submit" className={buttonClass("primary")}>
                Close the checkout
              </button>
            </form>
          )}
          <Link href={`/dossiers/${id}`} className={buttonClass("secondary")}>
            Back to the dossier
          </Link>
        </div>
      </Panel>
    </div>
  );
}
