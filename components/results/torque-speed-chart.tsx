"use client";

import { namesById } from "@/lib/results/case-view";
import { ResponsiveLine, type LineCustomSvgLayerProps } from "@nivo/line";
import { useId, useMemo, useState } from "react";
import { Field, Select } from "@/components/ui/field";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { formatNumber } from "@/lib/results/format";
import { axisMotion } from "@/lib/results/engine-v2";
import {
  torqueSpeedTable,
  torqueSpeedView,
  type TorqueSpeedView,
} from "@/lib/results/torque-speed";
import { ChartPanel, isNarrow, LineLegend } from "./chart-panel";
import { CHART_COLORS, chartTheme } from "./chart-theme";
import { styledLinesLayer } from "./styled-lines";

type TorqueSeries = { id: string; data: { x: number; y: number }[] };

const DASH = "7 5";
const SERIES_STYLE: Record<string, { color: string; dash?: string }> = {
  "Open loop, capability": { color: CHART_COLORS.openLoop },
  "Open loop, usable": { color: CHART_COLORS.openLoop, dash: DASH },
  "Closed loop, capability": { color: CHART_COLORS.closedLoop },
  "Closed loop, usable": { color: CHART_COLORS.closedLoop, dash: DASH },
};

function seriesOf(view: TorqueSpeedView): TorqueSeries[] {
  const points = (curve: { rpm: number; torqueNm: number }[]) =>
    curve.map((p) => ({ x: p.rpm, y: p.torqueNm }));
  return [
    { id: "Open loop, capability", data: points(view.open) },
    { id: "Open loop, usable", data: points(view.openUsable) },
    { id: "Closed loop, capability", data: points(view.closed) },
    { id: "Closed loop, usable", data: points(view.closedUsable) },
  ];
}

const StyledLines = styledLinesLayer<TorqueSeries>(SERIES_STYLE);

function operatingPointLayer(point: { speedRpm: number; peakTorqueNm: number }) {
  return function OperatingPoint({
    xScale,
    yScale,
    innerWidth,
  }: LineCustomSvgLayerProps<TorqueSeries>) {
    const x = xScale(point.speedRpm);
    const y = yScale(point.peakTorqueNm);
    const labelLeft = x > innerWidth * 0.7;
    return (
      <g transform={`translate(${x},${y})`}>
        <circle r={6} fill={CHART_COLORS.operatingPoint} stroke="#ffffff" strokeWidth={2} />
        <text
          x={labelLeft ? -10 : 10}
          y={-10}
          textAnchor={labelLeft ? "end" : "start"}
          // A white halo keeps the label readable where it crosses a curve.
          style={{
            fontSize: 12,
            fontWeight: 700,
            fill: CHART_COLORS.operatingPoint,
            stroke: "#ffffff",
            strokeWidth: 4,
            paintOrder: "stroke",
          }}
        >
          Operating point
        </text>
      </g>
    );
  };
}

/** Torque against speed of one axis, open and closed loop, with the usable torque and the duty. */
export function TorqueSpeedChart({ result, input }: { result: CaseResult; input: ParsedCase }) {
  const selectId = useId();
  const [picked, setPicked] = useState<string | null>(null);
  const axisId =
    picked !== null && input.axes.some((a) => a.id === picked) ? picked : (input.axes[0]?.id ?? "");
  const axis = input.axes.find((a) => a.id === axisId);
  const axisResult = result.axes.find((a) => a.id === axisId);
  const names = useMemo(() => namesById(input), [input]);
  const view = useMemo(
    () =>
      axis
        ? torqueSpeedView(axis, input.margins, axisResult ? axisMotion(axisResult) : null)
        : null,
    [axis, input.margins, axisResult],
  );
  const data = useMemo(() => (view ? seriesOf(view) : []), [view]);
  const layers = useMemo(
    () =>
      view
        ? (["grid", "axes", StyledLines, operatingPointLayer(view.operatingPoint), "mesh"] as const)
        : [],
    [view],
  );

  if (!axis || !view) return null;
  const yMax =
    Math.max(
      view.operatingPoint.peakTorqueNm,
      ...view.open.map((p) => p.torqueNm),
      ...view.closed.map((p) => p.torqueNm),
    ) * 1.1;

  return (
    <ChartPanel
      title="Torque against speed"
      description={`Capability of each loop at its hot winding resistance, and the usable torque once the required margin is kept back (open loop ${formatNumber(view.openRequiredPct)} %, closed loop ${formatNumber(view.closedRequiredPct)} %). The axis needs the operating point to sit under a usable line.`}
      height={340}
      controls={
        <div className="max-w-sm">
          <Field id={selectId} label="Axis">
            <Select id={selectId} value={axisId} onChange={(e) => setPicked(e.target.value)}>
              {input.axes.map((a) => (
                <option key={a.id} value={a.id}>
                  {names.axisWithMachine(a.id, a.machineId)}
                </option>
              ))}
            </Select>
          </Field>
        </div>
      }
      legend={
        <div className="space-y-1">
          <LineLegend
            items={[
              { label: "Open loop, capability", color: CHART_COLORS.openLoop },
              { label: "Open loop, usable", color: CHART_COLORS.openLoop, dash: DASH },
              { label: "Closed loop, capability", color: CHART_COLORS.closedLoop },
              { label: "Closed loop, usable", color: CHART_COLORS.closedLoop, dash: DASH },
              {
                label: `Operating point: ${formatNumber(view.operatingPoint.speedRpm)} rpm, ${formatNumber(view.operatingPoint.peakTorqueNm, 2)} N·m peak`,
                color: CHART_COLORS.operatingPoint,
                marker: true,
              },
            ]}
          />
          {axisResult ? (
            <p className="text-small text-steel-700">
              Highest speed with the margin kept: open loop{" "}
              {formatNumber(axisResult.openLoop.maxSpeedRpm)} rpm, closed loop{" "}
              {formatNumber(axisResult.closedLoop.maxSpeedRpm)} rpm.
            </p>
          ) : null}
        </div>
      }
      table={<TorqueSpeedTable view={view} />}
    >
      {({ width }) => (
        <ResponsiveLine<TorqueSeries>
          data={data}
          layers={layers}
          theme={chartTheme}
          margin={{ top: 16, right: 24, bottom: 52, left: 64 }}
          xScale={{ type: "linear", min: 0, max: view.maxRpm, nice: false }}
          yScale={{ type: "linear", min: 0, max: yMax, nice: false }}
          curve="linear"
          colors={data.map((s) => SERIES_STYLE[s.id]?.color ?? CHART_COLORS.reference)}
          enablePoints={false}
          useMesh
          animate={false}
          axisBottom={{
            legend: "Speed [rpm]",
            legendOffset: 40,
            legendPosition: "middle",
            tickValues: isNarrow(width) ? 4 : 8,
          }}
          axisLeft={{
            legend: "Torque [N·m]",
            legendOffset: -52,
            legendPosition: "middle",
            tickValues: 6,
            format: (v) => formatNumber(Number(v), 2),
          }}
          tooltip={({ point }) => (
            <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
              <strong>{point.seriesId}</strong>: {formatNumber(point.data.y, 3)} N·m at{" "}
              {formatNumber(point.data.x)} rpm
            </div>
          )}
          role="img"
          ariaLabel={`Torque against speed of axis ${names.axisWithMachine(axis.id, axis.machineId)}`}
        />
      )}
    </ChartPanel>
  );
}

/** The curves at round speeds and at the operating speed, in the units of the chart. */
function TorqueSpeedTable({ view }: { view: TorqueSpeedView }) {
  const rows = torqueSpeedTable(view);
  const cell = (v: number | null) => (v === null ? "not measured" : formatNumber(v, 3));
  return (
    <Table caption="Torque against speed, open and closed loop, in N·m">
      <thead>
        <tr>
          <Th>Speed [rpm]</Th>
          <Th className="text-right">Open loop capability [N·m]</Th>
          <Th className="text-right">Open loop usable [N·m]</Th>
          <Th className="text-right">Closed loop capability [N·m]</Th>
          <Th className="text-right">Closed loop usable [N·m]</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {rows.map((row) => {
          const operating = row.rpm === view.operatingPoint.speedRpm;
          return (
            <tr key={row.rpm} className={operating ? "bg-flux-50" : undefined}>
              <Td className={operating ? "font-bold" : undefined}>
                {formatNumber(row.rpm)}
                {operating
                  ? ` — operating speed, needs ${formatNumber(view.operatingPoint.peakTorqueNm, 3)} N·m peak`
                  : ""}
              </Td>
              <NumberTd>{cell(row.open)}</NumberTd>
              <NumberTd>{cell(row.openUsable)}</NumberTd>
              <NumberTd>{cell(row.closed)}</NumberTd>
              <NumberTd>{cell(row.closedUsable)}</NumberTd>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
