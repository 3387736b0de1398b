import {
  AxisStatesPanel,
  PaybackGridPanel,
  SensitivitySwingsPanel,
  UncertaintySummary,
} from "@/components/dossiers/dossier-tables";
import { DrawsHistogram } from "@/components/dossiers/draws-histogram";
import { MonthlyCashChart } from "@/components/dossiers/monthly-cash-chart";
import { ValueBySourcePanel } from "@/components/dossiers/value-by-source-panel";
import { BreakEvenPanel } from "@/components/results/break-even-panel";
import { CautionsPanel } from "@/components/results/cautions-panel";
import { EvidenceSources } from "@/components/results/evidence-sources";
import { HeadlineCards } from "@/components/results/headline-cards";
import { MotionTable } from "@/components/results/motion-table";
import type { CaseEvidence } from "@/components/results/reliance-note";
import { TornadoChart } from "@/components/results/tornado-chart";
import { TorqueSpeedChart } from "@/components/results/torque-speed-chart";
import { ValueByMachineTable } from "@/components/results/value-by-machine-table";
import { ValueBySourceTable } from "@/components/results/value-by-source-table";
import { WarningsPanel } from "@/components/results/warnings-panel";
import { WindingTemperatureChart } from "@/components/results/winding-temperature-chart";
import type { Dossier } from "@/lib/dossier";
import type { ParsedCase } from "@/lib/engine";
import { npvHistogram } from "@/lib/results/dossier";

/** What a dossier holds beyond the proposal, for the locked views. */
export const DOSSIER_CONTENTS = [
  "Everything in the proposal workbook, recomputed from the frozen input",
  "Value by source over the horizon for each scenario, plain and discounted, and by machine",
  "The typed figures the value rests on, each with its recorded source or the lack of one",
  "Cash flow month by month over the horizon",
  "Payback over tariff × running hours",
  "Sensitivity of NPV and payback at ±10, ±20 and ±30 %",
  "Per axis: torque–speed points of both loops, currents, losses and temperatures in each state",
  "Uncertainty: 1,000 seeded draws of tariff, hours, load and step-loss events, with P10/P50/P90 of payback and NPV",
];

export function DossierContentsList() {
  return (
    <ul className="mt-3 list-disc space-y-1 pl-5 text-small text-steel-800">
      {DOSSIER_CONTENTS.map((c) => (
        <li key={c}>{c}</li>
      ))}
    </ul>
  );
}

/**
 * The paid dossier's report body, the same for the vendor's people and the customer's reviewer:
 * headline figures, uncertainty, monthly cash, payback grid, swings, charts, cautions, axes.
 * The headline weighs the recorded sources of the frozen figures as the proposal pages do, and
 * the typed figures are listed beside their sources, read only: a report records nothing.
 */
export function DossierReport({
  dossier,
  input,
  evidence,
}: {
  dossier: Dossier;
  input: ParsedCase;
  evidence: CaseEvidence;
}) {
  const { result } = dossier;
  const swing30 = dossier.sensitivity.find((s) => s.swingPct === 30)!;
  return (
    <>
      <HeadlineCards result={result} input={input} evidence={evidence} />
      <BreakEvenPanel result={result} input={input} />
      <UncertaintySummary dossier={dossier} />
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <DrawsHistogram
          bins={npvHistogram(dossier.uncertainty.draws)}
          currency={result.currency}
          percentiles={dossier.uncertainty.percentiles.map((q) => ({ p: q.p, npv: Number(q.npv) }))}
        />
        <MonthlyCashChart monthly={dossier.monthly} currency={result.currency} />
      </div>
      <PaybackGridPanel dossier={dossier} />
      <SensitivitySwingsPanel dossier={dossier} />
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <TornadoChart
          result={{ ...result, sensitivity: swing30.rows }}
          input={{ ...input, sensitivity: { swingPct: 30 } }}
        />
        <TorqueSpeedChart result={result} input={input} />
        <WindingTemperatureChart result={result} input={input} />
        <CautionsPanel result={result} input={input} />
      </div>
      <ValueBySourcePanel result={result} input={input} />
      <ValueBySourceTable result={result} />
      <ValueByMachineTable result={result} input={input} />
      <EvidenceSources
        result={result}
        input={input}
        caseId={evidence.caseId}
        index={evidence.index}
        readOnly
      />
      <MotionTable result={result} input={input} />
      <WarningsPanel result={result} input={input} />
      <AxisStatesPanel dossier={dossier} />
    </>
  );
}
