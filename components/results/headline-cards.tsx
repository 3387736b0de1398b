import { Badge } from "@/components/ui/badge";
import { Term } from "@/components/ui/term";
import { BAND_POSITION_LABELS, FINANCE_TERMS, UP_FRONT_COST_BREAKDOWN } from "@/lib/glossary";
import type { CaseResult, ParsedCase, Scenario } from "@/lib/engine";
import { paybackShort } from "@/lib/results/engine-v2";
import {
  formatIrr,
  formatKWh,
  formatMoney,
  formatMoneyHeadline,
  formatPayback,
  formatPct,
  formatTonnes,
} from "@/lib/results/format";
import { scenarioHeadlines, type ScenarioHeadline } from "@/lib/results/scenarios";
import { RelianceNote, type CaseEvidence } from "./reliance-note";

export type { CaseEvidence };

const BAND_TONE = { below: "caution", within: "success", above: "flux" } as const;

/** The business case at a glance: each scenario's figures in one column, side by side. */
export function HeadlineCards({
  result,
  input,
  evidence,
}: {
  result: CaseResult;
  input: ParsedCase | null;
  evidence?: CaseEvidence;
}) {
  const headlines = scenarioHeadlines(result, input);
  const horizonYears = result.scenarios.physics.cashFlows.length - 1;
  return (
    <section aria-labelledby="headline-title">
      <h2 id="headline-title" className="sr-only">
        Headline figures by scenario
      </h2>
      {/* Once for the three cards: they share their typed figures (lib/results/headline-reliance.ts). */}
      <RelianceNote result={result} input={input} evidence={evidence} className="mb-4" />
      <div className="grid gap-4 md:grid-cols-3">
        {headlines.map((h) => (
          <ScenarioCard
            key={h.key}
            headline={h}
            scenario={result.scenarios[h.key]}
            currency={result.currency}
            horizonYears={horizonYears}
          />
        ))}
      </div>
      <p className="mt-2 text-small text-steel-700">
        {FINANCE_TERMS.upFrontCost} is the same in every scenario: {UP_FRONT_COST_BREAKDOWN}.
      </p>
    </section>
  );
}

function ScenarioCard({
  headline: h,
  scenario,
  currency,
  horizonYears,
}: {
  headline: ScenarioHeadline;
  scenario: Scenario;
  currency: string;
  horizonYears: number;
}) {
  const primary = h.key === "physics";
  const negative = h.npv.startsWith("-");
  const titleId = `scenario-${h.key}-title`;
  return (
    <article
      aria-labelledby={titleId}
      className={`rounded-panel border bg-white p-5 shadow-panel ${primary ? "border-flux-500 ring-1 ring-flux-500" : "border-steel-200"}`}
    >
      <header className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={titleId} className="text-lead">
          <Term kind="scenario">{h.label}</Term>
        </h3>
        {primary ? <Badge tone="flux">Basis of the proposal</Badge> : <Badge>For comparison</Badge>}
      </header>
      <p className="mt-3 text-caption font-bold uppercase tracking-wide text-steel-600">
        Net present value
      </p>
      <p
        className={`text-display font-black tabular-nums ${negative ? "text-danger-700" : "text-flux-800"}`}
      >
        {/* Rounded to the hundred for reading; the exact figure rides along for tools and tests. */}
        <data value={h.npv} data-testid="headline-npv">
          {formatMoneyHeadline(h.npv, currency)}
        </data>
      </p>
      <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-small">
        <Row term={FINANCE_TERMS.upFrontCost} value={formatMoney(h.capex, currency)} />
        <Row term="Payback" value={paybackShort(scenario, horizonYears)} />
        <Row
          term="Discounted payback"
          value={formatPayback(h.discountedPaybackYears, horizonYears)}
        />
        <Row term="IRR" value={formatIrr(h)} />
        <Row term="Return on investment" value={formatPct(h.roiPct, 0)} />
        <Row term="Energy saved" value={formatKWh(h.energySavedKWhPerYear)} />
        <Row
          term="CO₂ avoided"
          value={h.co2TonnesPerYear === null ? "—" : formatTonnes(h.co2TonnesPerYear)}
        />
      </dl>
      <div className="mt-4 border-t border-steel-100 pt-3">
        {h.band ? (
          <Badge tone={BAND_TONE[h.band]} term="band-position">
            {BAND_POSITION_LABELS[h.band]}
          </Badge>
        ) : null}
        <p className="mt-1 text-small text-steel-700">{h.bandText}</p>
      </div>
    </article>
  );
}

function Row({ term, value }: { term: string; value: string }) {
  return (
    <>
      <dt className="text-steel-700">{term}</dt>
      <dd className="text-right font-bold tabular-nums text-steel-900">{value}</dd>
    </>
  );
}
