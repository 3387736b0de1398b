import type { CaseResult, ParsedCase } from "@/lib/engine";
import { axisBandText } from "./band";
import { namesById } from "./case-view";
import { holdingView, type HoldingView } from "./engine-v2";
import { loopStatus, type LoopStatusView } from "./status";
import { explainAnyWarning, WARNING_CODES, type ExplainedWarning } from "./warnings";

export interface AxisRow {
  axisId: string;
  label: string;
  machineName: string;
  quantity: number;
  openLoop: LoopStatusView;
  closedLoop: LoopStatusView;
  /** Per unit (docs/model.md: per-axis loop figures are for one unit). */
  torqueFreedNm: number;
  torqueFreedPct: number | null;
  speedHeadroomPct: number | null;
  /** All units of the axis together. */
  energySavedKWhPerYear: number;
  energyPct: number | null;
  bandText: string;
  tempDropK: number | null;
  /** Null for results of engine 1.0.0, which did not compute it. */
  holding: HoldingView | null;
  warnings: ExplainedWarning[];
}

export function axisRows(result: CaseResult, input: ParsedCase | null): AxisRow[] {
  const names = namesById(input);
  const enteredHold = new Map(input?.axes.map((a) => [a.id, a.duty.holdTorqueNm]) ?? []);
  return result.axes.map((axis) => ({
    axisId: axis.id,
    label: names.axis(axis.id),
    machineName: names.machine(axis.machineId),
    quantity: axis.quantity,
    openLoop: loopStatus(axis.openLoop, input?.margins.openLoopRequiredPct ?? null),
    closedLoop: loopStatus(axis.closedLoop, input?.margins.closedLoopRequiredPct ?? null),
    torqueFreedNm: axis.savings.torqueFreedNm,
    torqueFreedPct: axis.savings.torqueFreedPct,
    speedHeadroomPct: axis.savings.speedHeadroomPct,
    energySavedKWhPerYear: axis.totals.energySavedKWhPerYear,
    energyPct: axis.savings.energyPct,
    bandText: axisBandText(axis.savings.band),
    tempDropK: axis.savings.tempDropK,
    holding: holdingView(axis, enteredHold.get(axis.id) ?? null),
    warnings: axis.warnings.map(explainAnyWarning),
  }));
}

export interface WarningGroup extends ExplainedWarning {
  /** Names of the axes (with their machine) or machines it concerns, in the result's order. */
  concerns: string[];
  /** "axis" or "machine": what `concerns` names. */
  scope: "axis" | "machine";
}

/**
 * Each warning of the case once, with what it means, what to do and which axes or machines it
 * concerns: the axis table then needs only the warning's title. Safety warnings come first.
 */
export function warningGroups(result: CaseResult, input: ParsedCase | null): WarningGroup[] {
  const names = namesById(input);
  const groups = new Map<string, WarningGroup>();
  const add = (code: string, name: string, scope: WarningGroup["scope"]) => {
    const group = groups.get(code) ?? { ...explainAnyWarning(code), concerns: [], scope };
    group.concerns.push(name);
    groups.set(code, group);
  };
  for (const axis of result.axes) {
    // Axis labels repeat from machine to machine ("Backing rewind"); the machine tells them apart.
    const name = names.axisWithMachine(axis.id, axis.machineId);
    for (const w of axis.warnings) add(w, name, "axis");
  }
  for (const machine of result.machines)
    for (const w of machine.warnings) add(w, names.machine(machine.id), "machine");
  const order = (g: WarningGroup) => {
    const i = WARNING_CODES.indexOf(g.code);
    return (g.safety ? 0 : 1000) + (i < 0 ? 999 : i);
  };
  return [...groups.values()].sort((a, b) => order(a) - order(b));
}

export interface MachineWarningRow {
  machineId: string;
  name: string;
  warnings: ExplainedWarning[];
}

export function machineWarnings(result: CaseResult, input: ParsedCase | null): MachineWarningRow[] {
  const names = namesById(input);
  return result.machines
    .filter((m) => m.warnings.length > 0)
    .map((m) => ({
      machineId: m.id,
      name: names.machine(m.id),
      warnings: m.warnings.map(explainAnyWarning),
    }));
}
