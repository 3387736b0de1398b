import type { Metadata } from "next";
import type { ReactNode } from "react";
import { addVendorCommentAction } from "@/server/proposals/actions";
import { CommentThread } from "@/components/proposals/comment-thread";
import { ApproveDiscountButton, QuoteManagerForm } from "@/components/proposals/quote-manager-form";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import { SendForm } from "@/components/proposals/send-form";
import { CaseResultsView } from "@/components/results/case-results";
import { Badge } from "@/components/ui/badge";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listProposalEvidence } from "@/db/queries/evidence";
import { listComments } from "@/db/queries/proposal-comments";
import { getProposalSnapshotOrThrow, vendorView } from "@/db/queries/proposals";
import { listAccountReviewers, listOwnerOptions } from "@/db/queries/quotes";
import { sendBlocker } from "@/server/proposals/send";
import { getSalesSettings } from "@/db/queries/sales-settings";
import { requirePageUser } from "@/server/auth";
import { idParam } from "@/lib/pages";
import { SENDABLE_STAGES } from "@/lib/pipeline/stages";
import { parseCaseInput } from "@/lib/results/case-view";
import { formatMoney, formatPayback } from "@/lib/results/format";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { discountAboveThreshold, needsDiscountApproval } from "@/lib/pipeline/discount";
import { FINANCE_TERMS } from "@/lib/glossary";
import { storedRevenue, vendorRevenue } from "@/lib/pipeline/revenue";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";

export const metadata: Metadata = { title: "Proposal" };

export default async function ProposalPage({
  params,
}: {
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).proposalId);
  const { quote: row, input: rawInput, result } = getProposalSnapshotOrThrow(user, id);
  const settings = getSalesSettings();
  // The revenue stored at freezing, as the pipeline shows it; worked out only if not yet stored.
  const revenue = storedRevenue(row) ?? vendorRevenue(rawInput);
  const quote = vendorView(row, settings.stageProbabilities, revenue);
  const input = parseCaseInput(rawInput);
  const comments = listComments(user, id);
  const blocker = sendBlocker(row, settings.discountThresholdPct);
  const needsApproval = needsDiscountApproval(row, settings.discountThresholdPct);
  const sendable = SENDABLE_STAGES.includes(row.stage);
  const isManager = user.role === "manager";
  // The sources recorded for the frozen figures' axes, machines and case, as they stand now.
  const evidence = input
    ? {
        caseId: quote.caseId,
        index: indexEvidence(listProposalEvidence(user, quote.caseId, frozenSubjects(input))),
      }
    : undefined;

  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/cases", label: "Cases" },
          { href: `/cases/${quote.caseId}`, label: quote.caseName },
          { label: `Version ${quote.version}` },
        ]}
      />
      <PageHeader
        title={`${quote.caseName}, version ${quote.version}`}
        lead={`${quote.accountName} · ${quote.siteName} · frozen ${quote.createdAt.slice(0, 10)} · engine ${quote.engineVersion}`}
        actions={
          <div className="flex flex-wrap items-center gap-3">
            <QuoteStageBadge stage={quote.stage} />
            <a href={`/api/v1/proposals/${id}/workbook`} className={buttonClass("secondary")}>
              Download workbook
            </a>
          </div>
        }
      />

      <div className="grid gap-6 xl:grid-cols-[2fr_3fr]">
        <Panel title="Quote">
          <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-small">
            <Fact term="Stage" value={<QuoteStageBadge stage={quote.stage} />} />
            <Fact term="Owner" value={quote.ownerName} />
            <Fact
              term={FINANCE_TERMS.vendorRevenue}
              value={formatMoney(quote.vendorRevenue, quote.currency)}
            />
            <Fact
              term={FINANCE_TERMS.customerInvestment}
              value={formatMoney(quote.value, quote.currency)}
            />
            <Fact
              term={FINANCE_TERMS.weightedRevenue}
              value={`${formatMoney(quote.weighted, quote.currency)} (${quote.probabilityPct} % for this stage)`}
            />
            <Fact term={FINANCE_TERMS.estimatedPayback} value={formatPayback(quote.paybackYears)} />
            <Fact term="Expected close" value={quote.expectedCloseOn} />
            <Fact
              term="Largest kit discount"
              value={
                <span className="flex flex-wrap items-center gap-2">
                  {quote.maxDiscountPct} %
                  {discountAboveThreshold(row.maxDiscountPct, settings.discountThresholdPct) ? (
                    row.discountApprovedAt ? (
                      <Badge tone="success">Approved {row.discountApprovedAt.slice(0, 10)}</Badge>
                    ) : (
                      <Badge tone="caution">
                        Needs approval (above {settings.discountThresholdPct} %)
                      </Badge>
                    )
                  ) : null}
                </span>
              }
            />
            <Fact
              term="Sent to"
              value={
                quote.sentAt
                  ? `${quote.sentToName ?? "the customer"}${quote.sentToEmail ? ` <${quote.sentToEmail}>` : ""} on ${quote.sentAt.slice(0, 10)}`
                  : "not sent yet"
              }
            />
            {quote.decidedAt ? <Fact term="Decided" value={quote.decidedAt.slice(0, 10)} /> : null}
          </dl>
        </Panel>

        <Panel
          title={quote.sentAt ? "Send to the reviewer again" : "Send to the customer's reviewer"}
        >
          {needsApproval && isManager ? (
            <div className="mb-4 rounded-md border-l-4 border-caution-600 bg-caution-50 p-3">
              <p className="mb-2 text-small text-steel-900">{blocker}</p>
              <ApproveDiscountButton proposalId={id} />
            </div>
          ) : null}
          {blocker ? (
            isManager && needsApproval ? null : (
              <p
                role="note"
                className="rounded-md border-l-4 border-caution-600 bg-caution-50 p-3 text-small text-steel-900"
              >
                {blocker}
              </p>
            )
          ) : sendable ? (
            <SendForm
              proposalId={id}
              accountName={quote.accountName}
              reviewers={listAccountReviewers(user, id)}
              resend={Boolean(quote.sentAt)}
            />
          ) : null}
        </Panel>
      </div>

      {isManager ? (
        <Panel title="Manage the quote">
          <QuoteManagerForm
            proposalId={id}
            stage={quote.stage}
            ownerId={quote.ownerId}
            expectedCloseOn={quote.expectedCloseOn}
            owners={listOwnerOptions(user, quote.accountId)}
          />
        </Panel>
      ) : null}

      <Panel title="Conversation with the customer">
        <CommentThread
          comments={comments}
          post={addVendorCommentAction.bind(null, id)}
          placeholder={
            quote.sentAt
              ? "Reply to the reviewer; they are told by e-mail"
              : "A note on this version (the reviewer sees it once the proposal is sent)"
          }
        />
      </Panel>

      <section aria-labelledby="frozen-results" className="space-y-4">
        <h2 id="frozen-results" className="text-title">
          Figures as frozen
        </h2>
        <p className="text-small text-steel-700">
          The figures are as frozen; the sources beside the typed ones are as recorded now.
        </p>
        <CaseResultsView result={result} input={input} methodHref="/method" evidence={evidence} />
      </section>
    </div>
  );
}

function Fact({ term, value }: { term: string; value: ReactNode }) {
  return (
    <>
      <dt className="text-steel-700">{term}</dt>
      <dd className="font-bold text-steel-900">{value}</dd>
    </>
  );
}
