import type { Metadata } from "next";
import { BuyDossierButton } from "@/components/dossiers/buy-dossier-button";
import {
  AxisStatesPanel,
  PaybackGridPanel,
  SensitivitySwingsPanel,
  UncertaintySummary,
} from "@/components/dossiers/dossier-tables";
import { DrawsHistogram } from "@/components/dossiers/draws-histogram";
import { MonthlyCashChart } from "@/components/dossiers/monthly-cash-chart";
import { PrintButton } from "@/components/dossiers/print-button";
import { UncertaintyForm } from "@/components/dossiers/uncertainty-form";
import { CautionsPanel } from "@/components/results/cautions-panel";
import { HeadlineCards } from "@/components/results/headline-cards";
import { TornadoChart } from "@/components/results/tornado-chart";
import { TorqueSpeedChart } from "@/components/results/torque-speed-chart";
import { WindingTemperatureChart } from "@/components/results/winding-temperature-chart";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getDossierAccess, getDossierSettings } from "@/db/queries/dossiers";
import { requirePageUser } from "@/lib/auth";
import { buildDossier } from "@/lib/dossier";
import { caseInputSchema } from "@/lib/engine";
import { npvHistogram } from "@/lib/results/dossier";
import { formatMoney } from "@/lib/results/format";
import { idParam } from "@/lib/pages";

export const metadata: Metadata = { title: "Dossier" };

const CONTENTS = [
  "Everything in the proposal workbook, recomputed from the frozen input",
  "Cash flow month by month over the horizon",
  "Payback over tariff × running hours",
  "Sensitivity of NPV and payback at ±10, ±20 and ±30 %",
  "Per axis: torque–speed points of both loops, currents, losses and temperatures in each state",
  "Uncertainty: 1,000 seeded draws of tariff, hours, load and step-loss events, with P10/P50/P90 of payback and NPV",
];

export default async function DossierPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const user = await requirePageUser("engineer", "manager", "admin");
  const id = idParam((await params).proposalId);
  const { proposal, grant, price } = getDossierAccess(user, id);
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
                once per proposal; everyone who works on this account can then open it.
              </p>
              <ul className="mt-3 list-disc space-y-1 pl-5 text-small text-steel-800">
                {CONTENTS.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
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

  const input = caseInputSchema.parse(proposal.input);
  const dossier = buildDossier(input, settings);
  const { result } = dossier;
  const swing30 = dossier.sensitivity.find((s) => s.swingPct === 30)!;
  return (
    <div className="space-y-6 dossier-report">
      <div className="print:hidden">{crumbs}</div>
      <PageHeader
        title={title}
        lead={`${proposal.accountName} · ${proposal.siteName} · engine ${result.engineVersion} · seed ${settings.seed} · amounts in ${result.currency}`}
        actions={
          <div className="flex flex-wrap gap-2 print:hidden">
            <a href={`/api/v1/proposals/${id}/dossier`} className={buttonClass("primary")}>
              Download the workbook (.xlsx)
            </a>
            <PrintButton />
          </div>
        }
      />
      <HeadlineCards result={result} input={input} />
      <UncertaintySummary dossier={dossier} />
      <div className="grid gap-6 xl:grid-cols-2">
        <DrawsHistogram
          bins={npvHistogram(dossier.uncertainty.draws)}
          currency={result.currency}
          percentiles={dossier.uncertainty.percentiles.map((q) => ({ p: q.p, npv: Number(q.npv) }))}
        />
        <MonthlyCashChart monthly={dossier.monthly} currency={result.currency} />
      </div>
      <PaybackGridPanel dossier={dossier} />
      <SensitivitySwingsPanel dossier={dossier} />
      <div className="grid gap-6 xl:grid-cols-2">
        <TornadoChart
          result={{ ...result, sensitivity: swing30.rows }}
          input={{ ...input, sensitivity: { swingPct: 30 } }}
        />
        <TorqueSpeedChart result={result} input={input} />
        <WindingTemperatureChart result={result} input={input} />
        <CautionsPanel result={result} input={input} />
      </div>
      <AxisStatesPanel dossier={dossier} />
      {rangesPanel}
    </div>
  );
}
