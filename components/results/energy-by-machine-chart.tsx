"use client";

import { ResponsiveBar } from "@nivo/bar";
import { useMemo } from "react";
import { useNarrowScreen } from "@/lib/hooks/use-narrow-screen";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { energyByMachine, type MachineEnergyRow } from "@/lib/results/energy";
import { formatNumber, formatPct } from "@/lib/results/format";
import { ChartPanel, SwatchLegend } from "./chart-panel";
import { CHART_COLORS, chartTheme } from "./chart-theme";

const BEFORE = "Open loop today";
const AFTER = "Closed loop";

/** Drive energy per year of each machine's axes, today and after the retrofit. */
export function EnergyByMachineChart({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const rows = useMemo(() => energyByMachine(result, input), [result, input]);
  const data = rows.map((r) => ({
    // Indexed by id: two machines may share a name, and the ticks show the name anyway.
    machine: r.machineId,
    [BEFORE]: r.beforeKWhPerYear,
    [AFTER]: r.afterKWhPerYear,
  }));
  const nameOf = new Map(rows.map((r) => [r.machineId, r.name]));
  const narrow = useNarrowScreen();
  const crowded = rows.length > (narrow ? 3 : 6);
  return (
    <ChartPanel
      title="Energy before and after, by machine"
      description="Electrical energy the drives of each machine draw in a year, all units of every axis counted. Cabinet cooling is not included here."
      height={crowded ? 380 : 320}
      legend={
        <SwatchLegend
          items={[
            { label: BEFORE, color: CHART_COLORS.openLoop },
            { label: AFTER, color: CHART_COLORS.closedLoop },
          ]}
        />
      }
      table={<EnergyTable rows={rows} />}
    >
      <ResponsiveBar
        data={data}
        keys={[BEFORE, AFTER]}
        indexBy="machine"
        groupMode="grouped"
        theme={chartTheme}
        colors={[CHART_COLORS.openLoop, CHART_COLORS.closedLoop]}
        margin={{ top: 16, right: 16, bottom: crowded ? 110 : 56, left: 72 }}
        padding={0.3}
        innerPadding={2}
        valueScale={{ type: "linear", min: 0 }}
        enableLabel={false}
        animate={false}
        axisBottom={{
          legend: "Machine",
          legendOffset: crowded ? 96 : 42,
          legendPosition: "middle",
          tickRotation: crowded ? -35 : 0,
          format: (id) => nameOf.get(String(id)) ?? String(id),
        }}
        axisLeft={{
          legend: "Energy [kWh/yr]",
          legendOffset: -60,
          legendPosition: "middle",
          format: (v) => formatNumber(Number(v)),
        }}
        tooltip={({ id, value, indexValue }) => (
          <div className="rounded bg-white px-2 py-1 text-small shadow-panel">
            <strong>{nameOf.get(String(indexValue))}</strong>, {id}: {formatNumber(value, 1)} kWh/yr
          </div>
        )}
        role="img"
        ariaLabel="Energy per year before and after the retrofit, by machine"
      />
    </ChartPanel>
  );
}

function EnergyTable({ rows }: { rows: MachineEnergyRow[] }) {
  const before = rows.reduce((s, r) => s + r.beforeKWhPerYear, 0);
  const after = rows.reduce((s, r) => s + r.afterKWhPerYear, 0);
  const pct = (b: number, a: number) => (b > 0 ? formatPct((100 * (b - a)) / b) : "—");
  return (
    <Table caption="Drive energy per year by machine, before and after the retrofit">
      <thead>
        <tr>
          <Th>Machine</Th>
          <Th className="text-right">Axes</Th>
          <Th className="text-right">Open loop today [kWh/yr]</Th>
          <Th className="text-right">Closed loop [kWh/yr]</Th>
          <Th className="text-right">Saved [kWh/yr]</Th>
          <Th className="text-right">Saved [%]</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {rows.map((r) => (
          <tr key={r.machineId}>
            <Td>{r.name}</Td>
            <NumberTd>{r.axisCount}</NumberTd>
            <NumberTd>{formatNumber(r.beforeKWhPerYear, 1)}</NumberTd>
            <NumberTd>{formatNumber(r.afterKWhPerYear, 1)}</NumberTd>
            <NumberTd>{formatNumber(r.savedKWhPerYear, 1)}</NumberTd>
            <NumberTd>{pct(r.beforeKWhPerYear, r.afterKWhPerYear)}</NumberTd>
          </tr>
        ))}
        <tr className="bg-steel-50 font-bold">
          <Td>All machines</Td>
          <NumberTd>{rows.reduce((s, r) => s + r.axisCount, 0)}</NumberTd>
          <NumberTd>{formatNumber(before, 1)}</NumberTd>
          <NumberTd>{formatNumber(after, 1)}</NumberTd>
          <NumberTd>{formatNumber(before - after, 1)}</NumberTd>
          <NumberTd>{pct(before, after)}</NumberTd>
        </tr>
      </tbody>
    </Table>
  );
}
