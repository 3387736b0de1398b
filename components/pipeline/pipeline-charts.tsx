"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartPanel, SwatchLegend } from "@/components/results/chart-panel";
import { CHART_COLORS, chartTheme } from "@/components/results/chart-theme";
import type { ReactNode } from "react";
import { formatMoney, formatMoneyCompact, moneyToChartNumber } from "@/lib/results/format";
import { FINANCE_TERMS } from "@/lib/glossary";

export type ValueRow = {
  key: string;
  label: string;
  count: number;
  /** The customer's investment (in the table beside the chart, not drawn). */
  value: string;
  revenue: string;
  weighted: string;
};

// The weighted revenue is part of the revenue: a lighter shade of the same blue-green (flux-300).
const WEIGHTED_COLOR = "#78bdb8";
const VALUE = FINANCE_TERMS.vendorRevenue;
const WEIGHTED = FINANCE_TERMS.weightedRevenue;

function ValueBars({
  rows,
  currency,
  indexLegend,
  ariaLabel,
  crowded,
}: {
  rows: ValueRow[];
  currency: string;
  indexLegend: string;
  ariaLabel: string;
  crowded: boolean;
}) {
  const labelOf = new Map(rows.map((r) => [r.key, r.label]));
  return (
    <ResponsiveBar
      data={rows.map((r) => ({
        key: r.key,
        [VALUE]: moneyToChartNumber(r.revenue, currency),
        [WEIGHTED]: moneyToChartNumber(r.weighted, currency),
      }))}
      keys={[VALUE, WEIGHTED]}
      indexBy="key"
      groupMode="grouped"
      theme={chartTheme}
      colors={[CHART_COLORS.closedLoop, WEIGHTED_COLOR]}
      margin={{ top: 16, right: 16, bottom: crowded ? 96 : 56, left: 84 }}
      padding={0.3}
      innerPadding={2}
      valueScale={{ type: "linear", min: 0 }}
      enableLabel={false}
      animate={false}
      axisBottom={{
        legend: indexLegend,
        legendOffset: crowded ? 84 : 42,
        legendPosition: "middle",
        tickRotation: crowded ? -30 : 0,
        format: (key) => labelOf.get(String(key)) ?? String(key),
      }}
      axisLeft={{
        legend: `Amount [${currency}]`,
        legendOffset: -72,
        legendPosition: "middle",
        format: (v) => formatMoneyCompact(Number(v), currency),
      }}
      tooltip={({ id, indexValue }) => {
        const row = rows.find((r) => r.key === String(indexValue));
        return (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            <strong>{labelOf.get(String(indexValue))}</strong>, {id}:{" "}
            {row ? formatMoney(id === VALUE ? row.revenue : row.weighted, currency) : ""}
          </div>
        );
      }}
      role="img"
      ariaLabel={ariaLabel}
    />
  );
}

const legend = (
  <SwatchLegend
    items={[
      { label: VALUE, color: CHART_COLORS.closedLoop },
      { label: `${WEIGHTED} (revenue × the stage's chance, open quotes)`, color: WEIGHTED_COLOR },
    ]}
  />
);

type ChartProps = { rows: ValueRow[]; currency: string; table: ReactNode; asTable?: boolean };

export function ValueByStageChart({ rows, currency, table, asTable }: ChartProps) {
  return (
    <ChartPanel
      title="Revenue by stage"
      description={`What the vendor would invoice for the quotes in each stage, and the same weighted by the chance of closing from that stage. Amounts in ${currency}.`}
      legend={legend}
      table={table}
      initialAsTable={asTable}
    >
      <ValueBars
        rows={rows}
        currency={currency}
        indexLegend="Stage"
        ariaLabel="Vendor revenue and weighted revenue by stage"
        crowded
      />
    </ChartPanel>
  );
}

export function ValueByMonthChart({ rows, currency, table, asTable }: ChartProps) {
  return (
    <ChartPanel
      title="Revenue by expected close month"
      description={`When the quotes are expected to close, with the vendor's revenue and weighted revenue per month. Amounts in ${currency}.`}
      legend={legend}
      table={table}
      initialAsTable={asTable}
    >
      <ValueBars
        rows={rows}
        currency={currency}
        indexLegend="Expected close month"
        ariaLabel="Vendor revenue and weighted revenue by expected close month"
        crowded={rows.length > 8}
      />
    </ChartPanel>
  );
}
