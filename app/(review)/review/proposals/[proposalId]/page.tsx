import type { Metadata } from "next";
import Link from "next/link";
import { addReviewerCommentAction } from "@/server/review/actions";
import { CommentThread } from "@/components/proposals/comment-thread";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import { CashFlowChart } from "@/components/results/cash-flow-chart";
import { BreakEvenPanel } from "@/components/results/break-even-panel";
import { CautionsPanel } from "@/components/results/cautions-panel";
import { EnergyByMachineChart } from "@/components/results/energy-by-machine-chart";
import { HeadlineCards } from "@/components/results/headline-cards";
import { MethodLink } from "@/components/results/method-link";
import { EvidenceSources } from "@/components/results/evidence-sources";
import { listReviewedProposalEvidence } from "@/db/queries/evidence";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";
import { ValueBySourceChart } from "@/components/results/value-by-source-chart";
import { ValueBySourceTable } from "@/components/results/value-by-source-table";
import { WarningsPanel } from "@/components/results/warnings-panel";
import { AssumptionsList } from "@/components/review/assumptions-list";
import { DecisionForm } from "@/components/review/decision-form";
import { MachineFiguresTable } from "@/components/review/machine-figures-table";
import { ValueByMachineTable } from "@/components/results/value-by-machine-table";
import { WhatIfPanel } from "@/components/review/what-if-panel";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { isDossierPaid } from "@/db/queries/dossiers";
import { listComments } from "@/db/queries/proposal-comments";
import { getProposalSnapshotOrThrow } from "@/db/queries/proposals";
import { requirePageUser } from "@/server/auth";
import { QUEUED_NOTICE } from "@/server/mail/delivery";
import { idParam, orNotFound } from "@/lib/pages";
import { DECIDABLE_STAGES } from "@/lib/pipeline/stages";
import { parseCaseInput } from "@/lib/results/case-view";
import { paybackLead } from "@/lib/results/engine-v2";
import { formatMoney } from "@/lib/results/format";
import { FINANCE_TERMS } from "@/lib/glossary";

export const metadata: Metadata = { title: "Proposal" };

const DECIDED_TEXT = {
  accepted: "You accepted this proposal",
  declined: "You declined this proposal",
  replaced: "A newer version replaced this one",
} as const;

export default async function ReviewProposalPage({
  params,
  searchParams,
}: {
  params: Promise<{ proposalId: string }>;
  searchParams: Promise<{ recorded?: string }>;
}) {
  const user = await requirePageUser("reviewer");
  const id = idParam((await params).proposalId);
  // Set by the decision form once a decision is saved: the form itself is gone from the page then.
  const { recorded } = await searchParams;
  const { quote, input: rawInput, result } = orNotFound(() => getProposalSnapshotOrThrow(user, id));
  const input = parseCaseInput(rawInput);
  const comments = listComments(user, id);
  const physics = result.scenarios.physics;
  const horizon = physics.cashFlows.length - 1;
  const decidable = DECIDABLE_STAGES.includes(quote.stage);
  // The supplier's paid dossier; the link shows only once it is paid for (reviewers never buy).
  const dossierPaid = isDossierPaid(user, id);
  // The supplier's recorded sources of the typed figures the value rests on, as they stand now.
  const evidence = input
    ? indexEvidence(listReviewedProposalEvidence(user, id, frozenSubjects(input)))
    : null;

  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/review", label: "Proposals for review" },
          { label: `${quote.caseName}, v${quote.version}` },
        ]}
      />
      <PageHeader
        title={`${quote.caseName}, version ${quote.version}`}
        lead={`${quote.siteName} · sent by ${quote.ownerName} on ${quote.sentAt?.slice(0, 10)} · ${FINANCE_TERMS.upFrontCost.toLowerCase()} ${formatMoney(quote.value, quote.currency)}, ${paybackLead(physics, horizon)}`}
        actions={
          <div className="flex flex-wrap items-center gap-3">
            <QuoteStageBadge stage={quote.stage} />
            <a href={`/api/v1/proposals/${id}/workbook`} className={buttonClass("secondary")}>
              Download the workbook (.xlsx)
            </a>
            {dossierPaid ? (
              <Link href={`/review/proposals/${id}/dossier`} className={buttonClass("secondary")}>
                Open the dossier
              </Link>
            ) : null}
            {decidable ? (
              <a href="#decision" className={buttonClass("primary")}>
                Decide
              </a>
            ) : null}
          </div>
        }
      />

      <p className="flex flex-wrap items-center justify-between gap-3">
        <span className="text-caption text-steel-600">
          Computed by engine {result.engineVersion} · amounts in {result.currency}
        </span>
        <MethodLink href="/review/method" />
      </p>
      <HeadlineCards
        result={result}
        input={input}
        evidence={
          evidence ? { caseId: quote.caseId, index: evidence, audience: "reviewer" } : undefined
        }
      />
      <BreakEvenPanel result={result} input={input} />

      {input ? (
        <WhatIfPanel
          proposalId={id}
          proposal={result}
          finance={{
            tariffPerKWh: input.finance.tariffPerKWh,
            tariffEscalationPct: input.finance.tariffEscalationPct,
            discountRatePct: input.finance.discountRatePct,
            horizonYears: input.finance.horizonYears,
            taxRatePct: input.finance.taxRatePct,
          }}
          band={input.band}
        />
      ) : null}

      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <CashFlowChart result={result} input={input} />
        <EnergyByMachineChart result={result} input={input} />
      </div>
      <ValueBySourceChart result={result} input={input} />
      <ValueBySourceTable result={result} />
      {input && evidence ? (
        <EvidenceSources
          result={result}
          input={input}
          caseId={quote.caseId}
          index={evidence}
          readOnly
        />
      ) : null}
      <MachineFiguresTable result={result} input={input} />
      <ValueByMachineTable result={result} input={input} />
      <WarningsPanel result={result} input={input} />
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        {input ? <AssumptionsList input={input} /> : null}
        <CautionsPanel result={result} input={input} />
      </div>

      <div id="decision" className="scroll-mt-6">
        <Panel title="Your decision">
          {decidable ? (
            <>
              {quote.stage === "changes" ? (
                <p className="mb-3 text-small text-steel-700">
                  You asked for changes to this version. You may still accept or decline it as it
                  stands.
                </p>
              ) : null}
              <DecisionForm proposalId={id} />
            </>
          ) : (
            <>
              {recorded === "sent" || recorded === "queued" ? (
                <p
                  role="status"
                  className="mb-3 rounded-md bg-flux-50 p-3 text-small text-steel-800"
                >
                  {recorded === "sent"
                    ? "Your decision is recorded and your supplier has been told."
                    : `Your decision is recorded. ${QUEUED_NOTICE}`}
                </p>
              ) : null}
              <p className="text-body font-bold text-steel-900">
                {DECIDED_TEXT[quote.stage as keyof typeof DECIDED_TEXT] ?? ""}
                {quote.decidedAt ? ` on ${quote.decidedAt.slice(0, 10)}` : ""}.
                <span className="block font-normal text-steel-700">
                  Write to your supplier in the comments below if anything needs saying.
                </span>
              </p>
            </>
          )}
        </Panel>
      </div>

      <Panel title="Questions and comments">
        <CommentThread
          comments={comments}
          post={addReviewerCommentAction.bind(null, id)}
          placeholder="Ask your supplier a question about this proposal"
        />
      </Panel>
    </div>
  );
}
