"use client";

import { ResponsiveBar, type BarCustomLayerProps, type BarDatum } from "@nivo/bar";
import { useMemo } from "react";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import {
  formatMoney,
  formatMoneyChange,
  formatMoneyCompact,
  formatNumber,
  formatPayback,
  moneyToChartNumber,
} from "@/lib/results/format";
import { tornado, type Tornado } from "@/lib/results/tornado";
import { ChartPanel, isNarrow, SwatchLegend } from "./chart-panel";
import { CHART_COLORS, chartTheme } from "./chart-theme";

/** How far each driver moves the NPV when it is lowered or raised by the case's swing. */
export function TornadoChart({ result, input }: { result: CaseResult; input: ParsedCase | null }) {
  const currency = result.currency;
  const view = useMemo(() => tornado(result, input), [result, input]);
  const swing = formatNumber(view.swingPct);
  const lowKey = `Driver lowered by ${swing} %`;
  const highKey = `Driver raised by ${swing} %`;
  // nivo stacks a horizontal band scale from the bottom up; reversed, the widest swing is on top.
  const data: BarDatum[] = [...view.rows].reverse().map((r) => ({
    driver: r.label,
    [lowKey]: moneyToChartNumber(r.lowChange, currency),
    [highKey]: moneyToChartNumber(r.highChange, currency),
  }));
  // Symmetric about zero, so that a driver's downside and upside read at the same scale.
  const reach = Math.max(
    1,
    ...view.rows
      .flatMap((r) => [r.lowChange, r.highChange])
      .map((c) => Math.abs(moneyToChartNumber(c, currency))),
  );
  return (
    <ChartPanel
      title="What moves the NPV"
      description={`Each driver lowered and raised by ${swing} % with everything else as modelled; bars show the change against the modelled NPV of ${formatMoney(view.baseNpv, currency)}. The widest bars are the assumptions most worth checking with the customer.`}
      height={Math.max(260, 48 * view.rows.length + 80)}
      legend={
        <SwatchLegend
          items={[
            { label: lowKey, color: CHART_COLORS.bandLow },
            { label: highKey, color: CHART_COLORS.closedLoop },
          ]}
        />
      }
      table={<TornadoTable view={view} currency={currency} swing={swing} />}
    >
      {({ width }) => (
        <ResponsiveBar
          data={data}
          keys={[lowKey, highKey]}
          indexBy="driver"
          layout="horizontal"
          groupMode="grouped"
          theme={chartTheme}
          colors={[CHART_COLORS.bandLow, CHART_COLORS.closedLoop]}
          margin={{
            top: isNarrow(width) ? 20 : 12,
            right: 24,
            bottom: 56,
            left: isNarrow(width) ? 16 : 190,
          }}
          padding={isNarrow(width) ? 0.5 : 0.25}
          layers={
            isNarrow(width)
              ? ["grid", "axes", "bars", "markers", DriverLabelsAbove]
              : ["grid", "axes", "bars", "markers"]
          }
          innerPadding={2}
          valueScale={{ type: "linear", min: -reach * 1.05, max: reach * 1.05 }}
          enableLabel={false}
          enableGridX
          enableGridY={false}
          animate={false}
          markers={[
            {
              axis: "x",
              value: 0,
              lineStyle: { stroke: CHART_COLORS.operatingPoint, strokeWidth: 1.5 },
            },
          ]}
          axisLeft={isNarrow(width) ? null : { tickSize: 0, tickPadding: 8 }}
          axisBottom={{
            legend: `Change in NPV [${currency}]`,
            legendOffset: 42,
            legendPosition: "middle",
            tickValues: isNarrow(width) ? 3 : 6,
            format: (v) => formatMoneyCompact(Number(v), currency),
          }}
          tooltip={({ id, indexValue, data: datum }) => {
            const row = view.rows.find((r) => r.label === indexValue);
            const change = id === lowKey ? row?.lowChange : row?.highChange;
            return (
              <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
                <strong>{String(datum.driver)}</strong>, {String(id).toLowerCase()}:{" "}
                {change ? formatMoneyChange(change, currency) : ""}
              </div>
            );
          }}
          role="img"
          ariaLabel="Change in NPV when each driver is lowered or raised"
        />
      )}
    </ChartPanel>
  );
}

// On a phone the driver names would leave no room for the bars; they go above each row instead.
function DriverLabelsAbove({ bars, yScale }: BarCustomLayerProps<BarDatum>) {
  const band = yScale as (value: string) => number;
  const labels = [...new Set(bars.map((b) => String(b.data.indexValue)))];
  return (
    <g>
      {labels.map((label) => (
        <text
          key={label}
          x={0}
          y={band(label) - 5}
          style={{
            fontSize: 12,
            fontWeight: 700,
            fill: CHART_COLORS.text,
            stroke: "#ffffff",
            strokeWidth: 4,
            paintOrder: "stroke",
          }}
        >
          {label}
        </text>
      ))}
    </g>
  );
}

function TornadoTable({
  view,
  currency,
  swing,
}: {
  view: Tornado;
  currency: string;
  swing: string;
}) {
  return (
    <Table caption={`NPV and payback with each driver lowered and raised by ${swing} %`}>
      <thead>
        <tr>
          <Th>Driver</Th>
          <Th className="text-right">NPV, lowered [{currency}]</Th>
          <Th className="text-right">Change [{currency}]</Th>
          <Th className="text-right">NPV, raised [{currency}]</Th>
          <Th className="text-right">Change [{currency}]</Th>
          <Th className="text-right">Payback, lowered</Th>
          <Th className="text-right">Payback, raised</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {view.rows.map((r) => (
          <tr key={r.driver}>
            <Td>{r.label}</Td>
            <NumberTd>{formatMoney(r.lowNpv, currency)}</NumberTd>
            <NumberTd>{formatMoneyChange(r.lowChange, currency)}</NumberTd>
            <NumberTd>{formatMoney(r.highNpv, currency)}</NumberTd>
            <NumberTd>{formatMoneyChange(r.highChange, currency)}</NumberTd>
            <Td className="whitespace-nowrap text-right">{formatPayback(r.lowPaybackYears)}</Td>
            <Td className="whitespace-nowrap text-right">{formatPayback(r.highPaybackYears)}</Td>
          </tr>
        ))}
        <tr className="bg-steel-50 font-bold">
          <Td>As modelled</Td>
          <NumberTd colSpan={6}>NPV {formatMoney(view.baseNpv, currency)}</NumberTd>
        </tr>
      </tbody>
    </Table>
  );
}
