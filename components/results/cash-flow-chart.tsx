"use client";

import { ResponsiveLine } from "@nivo/line";
import { useMemo } from "react";
import { Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { formatMoney, formatMoneyCompact, moneyToChartNumber } from "@/lib/results/format";
import { cashFlowSeries, type CashFlowSeries, type ScenarioKey } from "@/lib/results/scenarios";
import { ChartPanel, isNarrow, LineLegend } from "./chart-panel";
import { CHART_COLORS, chartTheme } from "./chart-theme";
import { styledLinesLayer, type LineStyle } from "./styled-lines";
import { FINANCE_TERMS } from "@/lib/glossary";
import { Term } from "@/components/ui/term";

type FlowSeries = { id: string; data: { x: number; y: number }[] };

const STYLE_BY_KEY: Record<ScenarioKey, LineStyle> = {
  physics: { color: CHART_COLORS.closedLoop, width: 3 },
  bandLow: { color: CHART_COLORS.bandLow, dash: "8 5" },
  bandHigh: { color: CHART_COLORS.bandHigh, dash: "2 4" },
};

/** Cumulative cash flow of the three scenarios, from the up-front cost at year 0 to the horizon. */
export function CashFlowChart({
  result,
  input,
}: {
  result: CaseResult;
  /** Only its band (the trade-claim scenarios' labels): the sandbox passes the proposal's. */
  input: Pick<ParsedCase, "band"> | null;
}) {
  const currency = result.currency;
  const series = useMemo(() => cashFlowSeries(result, input), [result, input]);
  const data: FlowSeries[] = series.map((s) => ({
    id: s.label,
    data: s.points.map((p) => ({ x: p.year, y: moneyToChartNumber(p.cumulative, currency) })),
  }));
  const layers = useMemo(() => {
    const styles = Object.fromEntries(series.map((s) => [s.label, STYLE_BY_KEY[s.key]]));
    return [
      "grid",
      "markers",
      "axes",
      styledLinesLayer<FlowSeries>(styles),
      "points",
      "mesh",
    ] as const;
  }, [series]);
  const years = series[0]?.points.length ?? 0;
  return (
    <ChartPanel
      title="Cumulative cash flow"
      description={`The retrofit's cash position year by year: the up-front cost at year 0, then each year's savings less the service cost. Where a line crosses zero the retrofit has paid for itself. Amounts in ${currency}, not discounted.`}
      height={320}
      legend={
        <LineLegend
          items={series.map((s) => ({
            label: s.label,
            color: STYLE_BY_KEY[s.key].color,
            dash: STYLE_BY_KEY[s.key].dash,
          }))}
        />
      }
      table={<CashFlowTable series={series} currency={currency} />}
    >
      {({ width }) => (
        <ResponsiveLine<FlowSeries>
          data={data}
          layers={layers}
          theme={chartTheme}
          margin={{ top: 16, right: 24, bottom: 52, left: 80 }}
          xScale={{ type: "linear", min: 0, max: Math.max(1, years - 1) }}
          yScale={{ type: "linear", min: "auto", max: "auto" }}
          colors={series.map((s) => STYLE_BY_KEY[s.key].color)}
          pointSize={7}
          pointColor={{ from: "seriesColor" }}
          pointBorderWidth={1.5}
          pointBorderColor="#ffffff"
          useMesh
          animate={false}
          markers={[
            {
              axis: "y",
              value: 0,
              lineStyle: { stroke: CHART_COLORS.operatingPoint, strokeWidth: 1.5 },
              legend: "break-even",
              legendPosition: "bottom-right",
              textStyle: { fontSize: 12, fill: CHART_COLORS.text },
            },
          ]}
          axisBottom={{
            legend: "Year",
            legendOffset: 40,
            legendPosition: "middle",
            // Every year up to a dozen; long horizons (up to 30 years) label every few.
            tickValues: Array.from({ length: years }, (_, i) => i).filter(
              (y) => y % Math.ceil(years / (isNarrow(width) ? 6 : 12)) === 0,
            ),
            format: (v) => String(v),
          }}
          axisLeft={{
            legend: `Cumulative cash flow [${currency}]`,
            legendOffset: -68,
            legendPosition: "middle",
            format: (v) => formatMoneyCompact(Number(v), currency),
          }}
          tooltip={({ point }) => {
            const s = series.find((x) => x.label === point.seriesId);
            const p = s?.points[point.data.x];
            return (
              <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
                <strong>{point.seriesId}</strong>, year {point.data.x}:{" "}
                {p ? formatMoney(p.cumulative, currency) : ""}
              </div>
            );
          }}
          role="img"
          ariaLabel="Cumulative cash flow of the three scenarios by year"
        />
      )}
    </ChartPanel>
  );
}

function CashFlowTable({ series, currency }: { series: CashFlowSeries[]; currency: string }) {
  const years = series[0]?.points.map((p) => p.year) ?? [];
  return (
    <Table caption={`Yearly and cumulative cash flow of each scenario, in ${currency}`}>
      <thead>
        <tr>
          <Th rowSpan={2}>Year</Th>
          {series.map((s) => (
            <Th key={s.key} colSpan={2} className="text-center">
              <Term kind="scenario">{s.label}</Term>
            </Th>
          ))}
        </tr>
        <tr>
          {series.map((s) => [
            <Th key={`${s.key}-flow`} className="text-right">
              Flow [{currency}]
            </Th>,
            <Th key={`${s.key}-cum`} className="text-right">
              Cumulative [{currency}]
            </Th>,
          ])}
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {years.map((year) => (
          <tr key={year}>
            <Td>{year === 0 ? FINANCE_TERMS.upFrontCostYear : year}</Td>
            {series.map((s) => [
              <Td key={`${s.key}-flow`} className="text-right tabular-nums">
                {formatMoney(s.points[year].flow, currency)}
              </Td>,
              <Td key={`${s.key}-cum`} className="text-right tabular-nums">
                {formatMoney(s.points[year].cumulative, currency)}
              </Td>,
            ])}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
