"use client";

import { ResponsiveBar } from "@nivo/bar";
import { VALUE_SOURCES, type CaseResult, type ParsedCase } from "@/lib/engine";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { formatMoney, formatMoneyCompact, moneyToChartNumber } from "@/lib/results/format";
import { sourceTotals } from "@/lib/results/source-totals";
import { ChartPanel, SwatchLegend } from "./chart-panel";
import { ValueBySourceTotalsTable } from "./value-by-source-totals-table";
import { CHART_COLORS, chartTheme } from "./chart-theme";

const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;
const SOURCE_COLORS = [
  CHART_COLORS.closedLoop,
  CHART_COLORS.bandHigh,
  CHART_COLORS.openLoop,
  CHART_COLORS.reference,
  CHART_COLORS.bandLow,
  CHART_COLORS.operatingPoint,
  CHART_COLORS.limit,
];

/**
 * Each scenario's value over the horizon stacked by source (lib/results/source-totals.ts); its
 * table is the dossier's too, each scenario plain and discounted at the case's rate.
 */
export function ValueBySourceChart({
  result,
  input,
}: {
  result: CaseResult;
  /** Only its discount rate, for the discounted columns: the sandbox passes the one it used. */
  input: { finance: Pick<ParsedCase["finance"], "discountRatePct"> } | null;
}) {
  const currency = result.currency;
  const rate = input?.finance.discountRatePct ?? null;
  const totals = SCENARIOS.map((key) => ({
    key,
    totals: result.scenarios[key].bySource ? sourceTotals(result.scenarios[key], rate ?? 0) : null,
  }));
  if (totals.some((t) => t.totals === null)) return null;
  const data = totals.map(({ key, totals: parts }) => ({
    scenario: SCENARIO_LABELS[key],
    ...Object.fromEntries(
      parts!.map((p) => [
        VALUE_SOURCE_LABELS[p.source],
        moneyToChartNumber(p.sum.toFixed(), currency),
      ]),
    ),
  }));
  const keys = VALUE_SOURCES.map((s) => VALUE_SOURCE_LABELS[s]);
  return (
    <ChartPanel
      title="Value by source over the horizon"
      description="Each scenario's yearly flows added over the horizon, split by where the money comes from."
      legend={<SwatchLegend items={keys.map((label, i) => ({ label, color: SOURCE_COLORS[i] }))} />}
      table={<ValueBySourceTotalsTable result={result} discountRatePct={rate} />}
    >
      <ResponsiveBar
        data={data}
        keys={keys}
        indexBy="scenario"
        groupMode="stacked"
        theme={chartTheme}
        colors={SOURCE_COLORS}
        margin={{ top: 16, right: 16, bottom: 56, left: 88 }}
        padding={0.35}
        enableLabel={false}
        animate={false}
        axisLeft={{
          legend: `Value over the horizon [${currency}]`,
          legendOffset: -76,
          legendPosition: "middle",
          format: (v) => formatMoneyCompact(Number(v), currency),
        }}
        tooltip={({ id, value, indexValue }) => (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            <strong>{indexValue}</strong>, {id}: {formatMoney(String(value), currency)}
          </div>
        )}
        role="img"
        ariaLabel="Value over the horizon by source for each scenario"
      />
    </ChartPanel>
  );
}
