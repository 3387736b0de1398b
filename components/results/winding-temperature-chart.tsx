"use client";

import { ResponsiveBar, type BarCustomLayerProps, type BarDatum } from "@nivo/bar";
import { useMemo } from "react";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { useNarrowScreen } from "@/lib/hooks/use-narrow-screen";
import { formatNumber, formatTempC } from "@/lib/results/format";
import { windingTemperatures, type WindingTemperatureRow } from "@/lib/results/thermal";
import { ChartPanel, LineLegend, SwatchLegend } from "./chart-panel";
import { CHART_COLORS, chartTheme } from "./chart-theme";

const BEFORE = "Open loop today";
const AFTER = "Closed loop";
// Enough bars to compare; the table lists every axis.
const CHART_AXES = 16;

const hottestFirst = (a: WindingTemperatureRow, b: WindingTemperatureRow) =>
  (b.beforeC ?? Infinity) - (a.beforeC ?? Infinity);

function limitLayer(rows: Map<string, WindingTemperatureRow>) {
  return function ClassLimits({ bars, yScale, xScale }: BarCustomLayerProps<BarDatum>) {
    const y = yScale as (v: number) => number;
    const band = xScale as ((v: string) => number) & { bandwidth?: () => number };
    return (
      <g>
        {bars.map((bar) => {
          const row = rows.get(String(bar.data.indexValue));
          const limit = bar.data.id === BEFORE ? row?.beforeLimitC : row?.afterLimitC;
          if (limit == null) return null;
          return (
            <line
              key={bar.key}
              x1={bar.x - 3}
              x2={bar.x + bar.width + 3}
              y1={y(limit)}
              y2={y(limit)}
              stroke={CHART_COLORS.limit}
              strokeWidth={2}
              strokeDasharray="5 3"
            />
          );
        })}
        {[...rows.values()].flatMap((row) => {
          const x0 = band(row.axisId);
          const width = band.bandwidth?.() ?? 0;
          const missing = [
            row.beforeC === null ? "today" : null,
            row.afterC === null ? "closed loop" : null,
          ].filter(Boolean);
          if (missing.length === 0 || Number.isNaN(x0)) return [];
          return [
            <text
              key={`${row.axisId}-runaway`}
              x={x0 + width / 2}
              y={y(0) - 8}
              textAnchor="middle"
              style={{ fontSize: 11, fontWeight: 700, fill: CHART_COLORS.limit }}
            >
              no steady state {missing.join(", ")}
            </text>,
          ];
        })}
      </g>
    );
  };
}

/** Steady winding temperature of each axis before and after, against its insulation limit. */
export function WindingTemperatureChart({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const rows = useMemo(() => windingTemperatures(result, input), [result, input]);
  const shown = useMemo(() => [...rows].sort(hottestFirst).slice(0, CHART_AXES), [rows]);
  const byId = useMemo(() => new Map(shown.map((r) => [r.axisId, r])), [shown]);
  const labelOf = (id: string) => byId.get(id)?.name ?? "";
  const layers = useMemo(
    () => ["grid", "axes", "bars", limitLayer(byId), "markers"] as const,
    [byId],
  );
  const data = shown.map((r) => ({ axis: r.axisId, [BEFORE]: r.beforeC, [AFTER]: r.afterC }));
  const top = Math.max(
    ...shown.flatMap((r) => [
      r.beforeC ?? 0,
      r.afterC ?? 0,
      r.beforeLimitC ?? 0,
      r.afterLimitC ?? 0,
    ]),
    40,
  );
  // Ticks name the axis with its machine ("Backing rewind (Labeler 02)"), about 6 px a character
  // at the tick's size. Slanted when they would not fit side by side on a phone's width, with
  // margins that grow with the longest name so that every tick stays whole.
  const longest = Math.max(0, ...shown.map((r) => r.name.length)) * 6;
  const narrow = useNarrowScreen();
  const crowded = shown.length > (narrow ? 3 : 6) || shown.length * longest > 300;
  const slant = Math.PI / 4;
  const bottom = crowded ? Math.ceil(24 + longest * Math.sin(slant)) : 56;
  const left = crowded ? Math.max(64, Math.ceil(longest * Math.cos(slant)) - 12) : 64;
  return (
    <ChartPanel
      title="Winding temperature before and after"
      description={`Steady winding temperature over the duty mix, estimated from datasheet values, not measured; the dashed line on each bar is the limit of that motor's insulation class (IEC 60085).${rows.length > CHART_AXES ? ` The chart shows the ${CHART_AXES} hottest of ${rows.length} axes; the table lists all.` : ""}`}
      height={crowded ? 260 + bottom : 320}
      legend={
        <div className="flex flex-wrap gap-x-5 gap-y-1">
          <SwatchLegend
            items={[
              { label: BEFORE, color: CHART_COLORS.openLoop },
              { label: AFTER, color: CHART_COLORS.closedLoop },
            ]}
          />
          <LineLegend
            items={[{ label: "Insulation class limit", color: CHART_COLORS.limit, dash: "5 3" }]}
          />
        </div>
      }
      table={<TemperatureTable rows={rows} />}
    >
      <ResponsiveBar
        data={data as BarDatum[]}
        keys={[BEFORE, AFTER]}
        indexBy="axis"
        groupMode="grouped"
        layers={layers}
        theme={chartTheme}
        colors={[CHART_COLORS.openLoop, CHART_COLORS.closedLoop]}
        margin={{ top: 16, right: 16, bottom, left }}
        padding={0.3}
        innerPadding={2}
        valueScale={{ type: "linear", min: 0, max: Math.ceil((top * 1.08) / 10) * 10 }}
        enableLabel={false}
        animate={false}
        axisBottom={{
          legend: "Axis",
          legendOffset: bottom - 12,
          legendPosition: "middle",
          tickRotation: crowded ? -45 : 0,
          format: (id) => labelOf(String(id)),
        }}
        axisLeft={{
          legend: "Winding temperature [°C]",
          legendOffset: -50,
          legendPosition: "middle",
        }}
        tooltip={({ id, value, indexValue }) => (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            <strong>{labelOf(String(indexValue))}</strong>, {id}: {formatNumber(value, 0)} °C
          </div>
        )}
        role="img"
        ariaLabel="Winding temperature before and after the retrofit, by axis"
      />
    </ChartPanel>
  );
}

function TemperatureTable({ rows }: { rows: WindingTemperatureRow[] }) {
  const limit = (cls: string | null, c: number | null) =>
    cls === null || c === null ? "—" : `class ${cls}, ${c} °C`;
  const over = (flag: boolean) =>
    flag ? <span className="font-bold text-danger-700"> — above the limit</span> : null;
  return (
    <Table caption="Winding temperature per axis before and after the retrofit, in °C">
      <thead>
        <tr>
          <Th>Axis</Th>
          <Th className="text-right">Open loop today [°C]</Th>
          <Th>Limit today</Th>
          <Th className="text-right">Closed loop [°C]</Th>
          <Th>Limit after</Th>
          <Th className="text-right">Drop [K]</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {rows.map((r) => (
          <tr key={r.axisId}>
            <Td>
              {r.label}
              <span className="block text-caption text-steel-600">{r.machineName}</span>
            </Td>
            <NumberTd>
              {formatTempC(r.beforeC)}
              {over(r.beforeOverLimit)}
            </NumberTd>
            <Td>{limit(r.beforeClass, r.beforeLimitC)}</Td>
            <NumberTd>
              {formatTempC(r.afterC)}
              {over(r.afterOverLimit)}
            </NumberTd>
            <Td>{limit(r.afterClass, r.afterLimitC)}</Td>
            <NumberTd>{r.dropK === null ? "—" : formatNumber(r.dropK, 0)}</NumberTd>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
