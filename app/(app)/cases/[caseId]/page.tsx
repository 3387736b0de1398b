import type { Metadata } from "next";
import { AssumptionsForm } from "@/components/cases/assumptions-form";
import { CaseAxesEditor } from "@/components/cases/case-axes-editor";
import { CaseDetails } from "@/components/cases/case-details";
import { CaseToolbar } from "@/components/cases/case-toolbar";
import { ProposalsList } from "@/components/cases/proposals-list";
import { StageBadge } from "@/components/cases/stage-badge";
import { RemovedAxesNotice } from "@/components/cases/removed-axes-notice";
import { EvidencePanel } from "@/components/evidence/evidence-panel";
import { CaseResults } from "@/components/results/case-results";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listAxisPickerOptions } from "@/db/queries/axes";
import { listKits } from "@/db/queries/catalogue";
import { listCaseAxesOf } from "@/db/queries/case-axes";
import { listCaseEvidence } from "@/db/queries/evidence";
import { listProposalsPage } from "@/db/queries/proposal-list";
import { getSalesSettings } from "@/db/queries/sales-settings";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { requirePageUser } from "@/server/auth";
import { idParam } from "@/lib/pages";
import { flatParams } from "@/lib/lists/list-params";
import { caseEvidenceFigures } from "@/lib/evidence/figures";
import { indexEvidence } from "@/lib/evidence/subjects";
import { Money, moneyString } from "@/lib/engine/money";
import { proposalListParamsSchema } from "@/lib/validations/case-lists";
import { readCase } from "./case-reads";

export const metadata: Metadata = { title: "Case" };

// The picker lists the site's axes in one go; sites of the demo and typical retrofits hold
// hundreds, and the API pages beyond that.
const PICKER_LIMIT = 5000;

export default async function CasePage({
  params,
  searchParams,
}: {
  params: Promise<{ caseId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const caseId = idParam((await params).caseId);
  // The layout has read the case already: readCase returns that row, without a query.
  const item = readCase(user, caseId);
  const caseAxes = listCaseAxesOf(item);
  const siteAxes = listAxisPickerOptions(user, item.siteId, PICKER_LIMIT);
  const kits = listKits(user).filter((k) => k.currency === item.siteCurrency);
  // The proposal versions' list state (filter, sort, page) is the page's query string.
  const current = flatParams(await searchParams);
  const proposalParams = proposalListParamsSchema.parse(current);
  const proposals = listProposalsPage(item, proposalParams);
  // The sources of the typed figures the value rests on: the headline weighs them.
  const caseEvidence = listCaseEvidence(user, caseId);
  const maintenance = caseAxes.reduce(
    (sum, a) => sum.plus(new Money(a.maintenanceSavingPerYear).times(a.quantity)),
    new Money(0),
  );

  return (
    <div className="space-y-6">
      <Breadcrumbs items={[{ href: "/cases", label: "Cases" }, { label: item.name }]} />
      <PageHeader
        title={item.name}
        lead={`${item.accountName} · ${item.siteName} · owner ${item.ownerName} · ${caseAxes.length} axes`}
        actions={<StageBadge stage={item.stage} />}
      />
      <RemovedAxesNotice user={user} caseId={caseId} />
      <CaseToolbar caseId={caseId} canFreeze={caseAxes.length > 0} />
      <Panel title="Notes">
        <CaseDetails caseId={caseId} name={item.name} notes={item.notes} />
      </Panel>
      {caseAxes.length ? (
        <CaseResults
          caseId={caseId}
          methodHref="/method"
          evidence={{ caseId, index: indexEvidence(caseEvidence) }}
        />
      ) : null}
      <Panel title="Axes and kits">
        <CaseAxesEditor
          caseId={caseId}
          caseAxes={caseAxes}
          siteAxes={siteAxes}
          kits={kits.map((k) => ({
            id: k.id,
            code: k.code,
            name: k.name,
            price: k.price,
            currency: k.currency,
          }))}
          currency={item.siteCurrency}
          thresholdPct={getSalesSettings().discountThresholdPct}
        />
      </Panel>
      <Panel title="Assumptions">
        <AssumptionsForm caseId={caseId} values={item.assumptions} currency={item.siteCurrency} />
      </Panel>
      <Panel title="Sources of the case's figures">
        <EvidencePanel
          subjectType="case"
          subjectId={caseId}
          figures={caseEvidenceFigures(
            item.assumptions.finance,
            moneyString(maintenance),
            item.siteCurrency,
          )}
          entries={caseEvidence.filter((e) => e.subjectType === "case")}
        />
      </Panel>
      <Panel title={`Proposals (${proposals.total})`}>
        <ProposalsList
          caseId={caseId}
          result={proposals}
          params={proposalParams}
          current={current}
        />
      </Panel>
    </div>
  );
}
