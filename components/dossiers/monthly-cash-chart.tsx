"use client";

import { ResponsiveLine } from "@nivo/line";
import { ChartPanel, LineLegend } from "@/components/results/chart-panel";
import { CHART_COLORS, chartTheme } from "@/components/results/chart-theme";
import { Table, Td, Th } from "@/components/ui/table";
import type { MonthlyCashFlow } from "@/lib/dossier";
import { formatMoney, formatMoneyCompact, moneyToChartNumber } from "@/lib/results/format";
import { FINANCE_TERMS, SCENARIO_LABELS } from "@/lib/glossary";

type Series = { id: string; data: { x: number; y: number }[] };

/** Cumulative cash month by month (physics scenario), with the payback month marked. */
export function MonthlyCashChart({
  monthly,
  currency,
}: {
  monthly: MonthlyCashFlow;
  currency: string;
}) {
  const data: Series[] = [
    {
      id: "Cumulative cash",
      data: monthly.rows.map((r) => ({
        x: r.month,
        y: moneyToChartNumber(r.cumulative, currency),
      })),
    },
  ];
  const months = monthly.rows.length - 1;
  const step = months <= 36 ? 6 : 12;
  const payback = monthly.paybackMonth;
  return (
    <ChartPanel
      title="Cumulative cash, month by month"
      description={`${SCENARIO_LABELS.physics}. Each year's flow is spread evenly over its twelve months; the tariff escalation steps once a year. ${payback === null ? "The cash does not turn positive within the horizon." : `The cash turns positive in month ${payback}.`} Amounts in ${currency}, not discounted.`}
      height={300}
      legend={
        <LineLegend
          items={[
            { label: "Cumulative cash", color: CHART_COLORS.closedLoop },
            ...(payback === null
              ? []
              : [
                  {
                    label: `Payback: month ${payback}`,
                    color: CHART_COLORS.operatingPoint,
                    dash: "4 4",
                  },
                ]),
          ]}
        />
      }
      table={
        <Table caption={`Monthly and cumulative cash flow, in ${currency}`}>
          <thead>
            <tr>
              <Th>Month</Th>
              <Th>Year</Th>
              <Th className="text-right">Flow [{currency}]</Th>
              <Th className="text-right">Cumulative [{currency}]</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {monthly.rows.map((r) => (
              <tr key={r.month}>
                <Td>{r.month === 0 ? FINANCE_TERMS.upFrontCostYear : r.month}</Td>
                <Td>{r.year}</Td>
                <Td className="text-right tabular-nums">{formatMoney(r.flow, currency)}</Td>
                <Td className="text-right tabular-nums">{formatMoney(r.cumulative, currency)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      }
    >
      <ResponsiveLine<Series>
        data={data}
        theme={chartTheme}
        margin={{ top: 16, right: 24, bottom: 52, left: 80 }}
        xScale={{ type: "linear", min: 0, max: Math.max(1, months) }}
        yScale={{ type: "linear", min: "auto", max: "auto" }}
        colors={[CHART_COLORS.closedLoop]}
        lineWidth={3}
        enablePoints={false}
        enableArea
        areaOpacity={0.08}
        useMesh
        animate={false}
        markers={[
          {
            axis: "y",
            value: 0,
            lineStyle: { stroke: CHART_COLORS.reference, strokeWidth: 1 },
          },
          ...(payback === null
            ? []
            : [
                {
                  axis: "x" as const,
                  value: payback,
                  lineStyle: {
                    stroke: CHART_COLORS.operatingPoint,
                    strokeWidth: 1.5,
                    strokeDasharray: "4 4",
                  },
                  legend: `month ${payback}`,
                  legendPosition: "top-right" as const,
                  textStyle: { fontSize: 12, fill: CHART_COLORS.text },
                },
              ]),
        ]}
        axisBottom={{
          legend: "Month",
          legendOffset: 40,
          legendPosition: "middle",
          tickValues: Array.from({ length: Math.floor(months / step) + 1 }, (_, i) => i * step),
        }}
        axisLeft={{
          legend: `Cumulative cash [${currency}]`,
          legendOffset: -68,
          legendPosition: "middle",
          format: (v) => formatMoneyCompact(Number(v), currency),
        }}
        tooltip={({ point }) => (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            Month {point.data.x}:{" "}
            {formatMoney(monthly.rows[Number(point.data.x)]?.cumulative ?? "0", currency)}
          </div>
        )}
        role="img"
        ariaLabel="Cumulative cash flow by month"
      />
    </ChartPanel>
  );
}
