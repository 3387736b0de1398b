"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartPanel, SwatchLegend } from "@/components/results/chart-panel";
import { CHART_COLORS, chartTheme } from "@/components/results/chart-theme";
import { Table, Td, Th } from "@/components/ui/table";
import { formatMoney, formatMoneyCompact, moneyToChartNumber } from "@/lib/results/format";
import { FINANCE_TERMS } from "@/lib/glossary";

export type ValueRow = {
  key: string;
  label: string;
  count: number;
  value: string;
  weighted: string;
};

// The weighted value is part of the value: a lighter shade of the same blue-green (flux-300).
const WEIGHTED_COLOR = "#78bdb8";
const VALUE = FINANCE_TERMS.pipelineValue;
const WEIGHTED = "Weighted value";

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
        [VALUE]: moneyToChartNumber(r.value, currency),
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
            {row ? formatMoney(id === VALUE ? row.value : row.weighted, currency) : ""}
          </div>
        );
      }}
      role="img"
      ariaLabel={ariaLabel}
    />
  );
}

function ValueTable({
  rows,
  currency,
  first,
  caption,
}: {
  rows: ValueRow[];
  currency: string;
  first: string;
  caption: string;
}) {
  return (
    <Table caption={caption}>
      <thead>
        <tr>
          <Th>{first}</Th>
          <Th className="text-right">Quotes</Th>
          <Th className="text-right">Value [{currency}]</Th>
          <Th className="text-right">Weighted [{currency}]</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {rows.map((r) => (
          <tr key={r.key}>
            <Td>{r.label}</Td>
            <Td className="text-right tabular-nums">{r.count}</Td>
            <Td className="whitespace-nowrap text-right tabular-nums">
              {formatMoney(r.value, currency)}
            </Td>
            <Td className="whitespace-nowrap text-right tabular-nums">
              {formatMoney(r.weighted, currency)}
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

const legend = (
  <SwatchLegend
    items={[
      { label: VALUE, color: CHART_COLORS.closedLoop },
      { label: `${WEIGHTED} (value × the stage's chance)`, color: WEIGHTED_COLOR },
    ]}
  />
);

export function ValueByStageChart({ rows, currency }: { rows: ValueRow[]; currency: string }) {
  return (
    <ChartPanel
      title="Value by stage"
      description={`The quotes' up-front cost in each stage, and the same weighted by the chance of closing from that stage. Amounts in ${currency}.`}
      legend={legend}
      table={
        <ValueTable rows={rows} currency={currency} first="Stage" caption="Quote value by stage" />
      }
    >
      <ValueBars
        rows={rows}
        currency={currency}
        indexLegend="Stage"
        ariaLabel="Quote value and weighted value by stage"
        crowded
      />
    </ChartPanel>
  );
}

export function ValueByMonthChart({ rows, currency }: { rows: ValueRow[]; currency: string }) {
  return (
    <ChartPanel
      title="Value by expected close month"
      description={`When the quotes are expected to close, with their up-front cost and weighted value per month. Amounts in ${currency}.`}
      legend={legend}
      table={
        <ValueTable
          rows={rows}
          currency={currency}
          first="Close month"
          caption="Quote value by expected close month"
        />
      }
    >
      <ValueBars
        rows={rows}
        currency={currency}
        indexLegend="Expected close month"
        ariaLabel="Quote value and weighted value by expected close month"
        crowded={rows.length > 8}
      />
    </ChartPanel>
  );
}
