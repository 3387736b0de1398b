"use client";

import { useMemo, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { axisRows, type AxisRow } from "@/lib/results/axis-rows";
import { formatKWh, formatNumber, formatPct } from "@/lib/results/format";
import type { LoopStatusView } from "@/lib/results/status";

// Long fleets render in pages of this size until the reader asks for all of them.
const FIRST_ROWS = 50;

/** Per-axis results: each loop's status in words and colour, what the retrofit frees and saves. */
export function AxisResultsTable({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const rows = useMemo(() => axisRows(result, input), [result, input]);
  // Engine 1.0.0 did not compute what the drive holds: its proposals show no such column.
  const showHolding = rows.some((r) => r.holding !== null);
  const [showAll, setShowAll] = useState(false);
  const visible = showAll ? rows : rows.slice(0, FIRST_ROWS);
  return (
    <Panel title="Results by axis">
      <p className="mb-3 text-small text-steel-700">
        Torque, speed and temperature are per unit; energy counts every unit of the axis.
      </p>
      <Table caption="Results of each axis with its warnings: loop status, torque freed, speed headroom, energy saved, temperature drop and what today's drive holds at standstill">
        <thead>
          <tr>
            <Th>Axis</Th>
            <Th>Open loop today</Th>
            <Th>Closed loop</Th>
            <Th className="text-right">Torque freed [N·m]</Th>
            <Th className="text-right">Speed headroom [%]</Th>
            <Th className="text-right">Energy saved</Th>
            <Th className="text-right">Temperature drop [K]</Th>
            {showHolding ? <Th className="text-right">Holds today [N·m]</Th> : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {visible.map((row) => (
            <AxisResultRow key={row.axisId} row={row} showHolding={showHolding} />
          ))}
        </tbody>
      </Table>
      {rows.length > FIRST_ROWS ? (
        <div className="mt-3">
          <Button variant="secondary" size="sm" onClick={() => setShowAll((v) => !v)}>
            {showAll ? `Show the first ${FIRST_ROWS} axes` : `Show all ${rows.length} axes`}
          </Button>
        </div>
      ) : null}
    </Panel>
  );
}

function AxisResultRow({ row, showHolding }: { row: AxisRow; showHolding: boolean }) {
  return (
    <tr className="align-top">
      <Td className="min-w-44 align-top">
        <span className="font-bold">{row.label}</span>
        <span className="block text-caption text-steel-600">
          {row.machineName}
          {row.quantity > 1 ? ` · ${row.quantity} units` : ""}
        </span>
        {row.warnings.length > 0 ? (
          <ul aria-label="Warnings" className="mt-1.5 flex flex-col items-start gap-1">
            {row.warnings.map((w) => (
              <li key={w.code}>
                <Badge tone={w.safety ? "danger" : "caution"}>{w.title}</Badge>
              </li>
            ))}
          </ul>
        ) : null}
      </Td>
      <Td className="align-top">
        <LoopStatus status={row.openLoop} />
      </Td>
      <Td className="align-top">
        <LoopStatus status={row.closedLoop} />
      </Td>
      <Td className="min-w-28 text-right align-top tabular-nums">
        {formatNumber(row.torqueFreedNm, 3)}
        <span className="block text-caption text-steel-600">
          {row.torqueFreedPct === null
            ? "no usable torque today"
            : `${formatPct(row.torqueFreedPct, 0)} more`}
        </span>
      </Td>
      <Td className="text-right align-top tabular-nums">
        {row.speedHeadroomPct === null ? "—" : formatPct(row.speedHeadroomPct, 0)}
      </Td>
      <Td className="min-w-36 text-right align-top tabular-nums">
        <span className="whitespace-nowrap">{formatKWh(row.energySavedKWhPerYear)}</span>
        <span className="block text-caption text-steel-600">
          {row.energyPct === null ? "" : `${formatPct(row.energyPct, 0)} · `}
          {row.bandText.toLowerCase()}
        </span>
      </Td>
      <Td className="text-right align-top tabular-nums">
        {row.tempDropK === null ? "—" : formatNumber(row.tempDropK, 0)}
      </Td>
      {showHolding ? <HoldingCell row={row} /> : null}
    </tr>
  );
}

function HoldingCell({ row }: { row: AxisRow }) {
  const holding = row.holding;
  if (!holding) return <Td className="text-right align-top">—</Td>;
  return (
    <Td className="min-w-28 text-right align-top tabular-nums">
      {formatNumber(holding.capabilityNm, 3)}
      <span
        className={`block text-caption ${holding.slips ? "font-bold text-danger-700" : "text-steel-600"}`}
      >
        {!holding.loadKnown
          ? holding.slips
            ? "slips under its load"
            : ""
          : holding.loadNm === null
            ? "no load at rest"
            : holding.slips
              ? `load ${formatNumber(holding.loadNm, 3)}: slips`
              : `load ${formatNumber(holding.loadNm, 3)}: held`}
      </span>
    </Td>
  );
}

function LoopStatus({ status }: { status: LoopStatusView }) {
  return (
    <>
      <span className="whitespace-nowrap">
        <Badge tone={status.tone} term="loop-status">
          {status.words}
        </Badge>
      </span>
      <span className="mt-0.5 block whitespace-nowrap text-caption text-steel-600">
        {status.detail}
      </span>
    </>
  );
}
