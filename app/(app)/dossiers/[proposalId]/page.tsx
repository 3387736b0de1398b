import type { Metadata } from "next";
import { BuyDossierButton } from "@/components/dossiers/buy-dossier-button";
import { DossierContentsList } from "@/components/dossiers/dossier-report";
import { PaidDossierView } from "@/components/dossiers/paid-dossier-view";
import { UncertaintyForm } from "@/components/dossiers/uncertainty-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess, getDossierSettings } from "@/db/queries/dossiers";
import { listProposalEvidence } from "@/db/queries/evidence";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";
import { requirePageUser } from "@/server/auth";
import { formatMoney } from "@/lib/results/format";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Dossier" };

export default async function DossierPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).proposalId);
  const { proposal, grant, price } = orNotFound(() => getDossierAccess(user, id));
  const settings = getDossierSettings(user, id);
  const title = `Dossier: ${proposal.caseName}, proposal v${proposal.version}`;
  const crumbs = (
    <Breadcrumbs
      items={[
        { href: "/cases", label: "Cases" },
        { href: `/cases/${proposal.caseId}`, label: proposal.caseName },
        { label: `Dossier v${proposal.version}` },
      ]}
    />
  );
  const rangesPanel = (
    <Panel title="Uncertainty ranges and seed" className="print:hidden">
      <UncertaintyForm proposalId={id} values={settings} />
    </Panel>
  );

  if (!grant) {
    return (
      <div className="space-y-6">
        {crumbs}
        <PageHeader
          title={title}
          lead={`${proposal.accountName} · ${proposal.siteName} · frozen ${proposal.createdAt.slice(0, 10)}`}
        />
        <Panel title="This dossier is locked">
          <div className="grid gap-6 md:grid-cols-[3fr_2fr]">
            <div>
              <p className="text-steel-800">
                The dossier is the extended report an investment committee can rely on. It is bought
                once per proposal; everyone who works on this account can then open it, and so can
                the customer&apos;s reviewer the proposal is sent to.
              </p>
              <DossierContentsList />
            </div>
            <div className="rounded-panel border border-flux-200 bg-flux-50 p-5">
              <p className="text-small font-bold uppercase tracking-wide text-flux-800">Price</p>
              <p className="mt-1 text-display font-bold tabular-nums text-flux-900">
                {formatMoney(price.amount, price.currency)}
              </p>
              <p className="mb-4 text-small text-steel-700">
                One payment for this proposal version, through the payment provider&apos;s checkout.
              </p>
              <BuyDossierButton proposalId={id} label="Buy the dossier" />
            </div>
          </div>
        </Panel>
        {rangesPanel}
      </div>
    );
  }

  // The sources recorded for the frozen figures' axes, machines and case, as they stand now.
  const evidence = indexEvidence(
    listProposalEvidence(user, proposal.caseId, frozenSubjects(proposal.input)),
  );
  return (
    <PaidDossierView
      proposalId={id}
      title={title}
      crumbs={crumbs}
      proposal={proposal}
      settings={settings}
      // The dossier leaves with the customer: its warning is worded for whoever holds it.
      evidence={{ index: evidence, audience: "report" }}
      methodHref="/method"
    >
      {rangesPanel}
    </PaidDossierView>
  );
}
