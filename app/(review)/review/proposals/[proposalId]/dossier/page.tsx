import type { Metadata } from "next";
import Link from "next/link";
import { DossierContentsList } from "@/components/dossiers/dossier-report";
import { PaidDossierView } from "@/components/dossiers/paid-dossier-view";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess, getDossierSettings } from "@/db/queries/dossiers";
import { listReviewedProposalEvidence } from "@/db/queries/evidence";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";

export const metadata: Metadata = { title: "Dossier" };

// The customer's reviewer reads the dossier their supplier bought for this proposal: the same
// report as the supplier's, ranges and seed shown but not changed here. Reviewers never buy, so
// before payment the page says what the dossier holds and who adds it, with no price or button.
export default async function ReviewDossierPage({
  params,
}: {
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser("reviewer");
  const id = idParam((await params).proposalId);
  const { proposal, grant } = orNotFound(() => getDossierAccess(user, id));
  const title = `Dossier: ${proposal.caseName}, version ${proposal.version}`;
  const proposalHref = `/review/proposals/${id}`;
  const crumbs = (
    <Breadcrumbs
      items={[
        { href: "/review", label: "Proposals for review" },
        { href: proposalHref, label: `${proposal.caseName}, v${proposal.version}` },
        { label: "Dossier" },
      ]}
    />
  );

  if (!grant) {
    return (
      <div className="space-y-6">
        {crumbs}
        <PageHeader title={title} lead={`${proposal.accountName} · ${proposal.siteName}`} />
        <Panel title="The dossier is not available yet">
          <div className="max-w-3xl space-y-3">
            <p className="text-steel-800">
              The dossier is an extended report of this proposal for an investment committee. Your
              supplier adds it to the proposal; once they have, it opens here, ready to print, with
              its workbook to download.
            </p>
            <DossierContentsList />
            <Link href={proposalHref} className={buttonClass("secondary")}>
              Back to the proposal
            </Link>
          </div>
        </Panel>
      </div>
    );
  }

  // The supplier's recorded sources of the frozen figures, in the proposal's scope, read only.
  const evidence = indexEvidence(
    listReviewedProposalEvidence(user, id, frozenSubjects(proposal.input)),
  );
  return (
    <PaidDossierView
      proposalId={id}
      title={title}
      crumbs={crumbs}
      proposal={proposal}
      settings={getDossierSettings(user, id)}
      evidence={{ index: evidence, audience: "reviewer" }}
      methodHref="/review/method"
    />
  );
}
