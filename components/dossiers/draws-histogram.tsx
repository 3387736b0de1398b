"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartPanel, SwatchLegend } from "@/components/results/chart-panel";
import { CHART_COLORS, chartTheme } from "@/components/results/chart-theme";
import { Table, Td, Th } from "@/components/ui/table";
import type { HistogramBin } from "@/lib/results/dossier";
import { formatMoneyCompact } from "@/lib/results/format";

/** How the 1,000 draws' NPVs spread: bins of equal width, P10/P50/P90 named beside. */
export function DrawsHistogram({
  bins,
  currency,
  percentiles,
}: {
  bins: HistogramBin[];
  currency: string;
  percentiles: { p: number; npv: number }[];
}) {
  const data = bins.map((b, i) => ({
    bin: String(i),
    label: `${formatMoneyCompact(b.from, currency)} to ${formatMoneyCompact(b.to, currency)}`,
    count: b.count,
    band: percentiles.find((q) => q.npv >= b.from && q.npv <= b.to)?.p ?? 0,
  }));
  const tick = Math.max(1, Math.ceil(bins.length / 6));
  return (
    <ChartPanel
      title="NPV over 1,000 draws"
      description={`How often each NPV came out when tariff, hours, load and step-loss events vary together within their ranges. Bins holding P10, P50 or P90 are darker. Amounts in ${currency}.`}
      height={280}
      legend={
        <SwatchLegend
          items={[
            { label: "Draws in the bin", color: CHART_COLORS.reference },
            { label: "Bin holding P10, P50 or P90", color: CHART_COLORS.closedLoop },
          ]}
        />
      }
      table={
        <Table caption="Draws per NPV bin">
          <thead>
            <tr>
              <Th>NPV from</Th>
              <Th>to</Th>
              <Th className="text-right">Draws</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {bins.map((b, i) => (
              <tr key={i}>
                <Td className="tabular-nums">{formatMoneyCompact(b.from, currency)}</Td>
                <Td className="tabular-nums">{formatMoneyCompact(b.to, currency)}</Td>
                <Td className="text-right tabular-nums">{b.count}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      }
    >
      <ResponsiveBar
        data={data}
        keys={["count"]}
        indexBy="bin"
        theme={chartTheme}
        margin={{ top: 12, right: 16, bottom: 52, left: 56 }}
        padding={0.08}
        colors={(bar) => (bar.data.band ? CHART_COLORS.closedLoop : CHART_COLORS.reference)}
        enableLabel={false}
        animate={false}
        axisBottom={{
          legend: `NPV [${currency}]`,
          legendOffset: 40,
          legendPosition: "middle",
          tickValues: data.filter((_, i) => i % tick === 0).map((d) => d.bin),
          format: (v) => formatMoneyCompact(bins[Number(v)]?.from ?? 0, currency),
        }}
        axisLeft={{ legend: "Draws", legendOffset: -44, legendPosition: "middle" }}
        tooltip={({ data: d }) => (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            {d.label}: {d.count} draws
          </div>
        )}
        role="img"
        ariaLabel="Histogram of the NPV over the draws"
      />
    </ChartPanel>
  );
}
