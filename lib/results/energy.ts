import type { CaseResult, ParsedCase } from "@/lib/engine";
import { namesById } from "./case-view";

export interface MachineEnergyRow {
  machineId: string;
  name: string;
  /** Drive energy of every axis of the machine, open loop today, kWh per year. */
  beforeKWhPerYear: number;
  /** The same axes closed loop. */
  afterKWhPerYear: number;
  savedKWhPerYear: number;
  axisCount: number;
}

/**
 * Drive energy before and after per machine: per-axis figures are for one unit (docs/model.md),
 * so each counts quantity times. Machines appear in the order of the result, those without
 * axes included (with zeros), so the chart lists every machine of the case.
 */
export function energyByMachine(result: CaseResult, input: ParsedCase | null): MachineEnergyRow[] {
  const names = namesById(input);
  const rows = new Map<string, MachineEnergyRow>();
  const rowFor = (machineId: string) => {
    let row = rows.get(machineId);
    if (!row) {
      row = {
        machineId,
        name: names.machine(machineId),
        beforeKWhPerYear: 0,
        afterKWhPerYear: 0,
        savedKWhPerYear: 0,
        axisCount: 0,
      };
      rows.set(machineId, row);
    }
    return row;
  };
  for (const machine of result.machines) rowFor(machine.id);
  for (const axis of result.axes) {
    const row = rowFor(axis.machineId);
    row.beforeKWhPerYear += axis.quantity * axis.openLoop.energyKWhPerYear;
    row.afterKWhPerYear += axis.quantity * axis.closedLoop.energyKWhPerYear;
    row.axisCount += axis.quantity;
  }
  for (const row of rows.values()) row.savedKWhPerYear = row.beforeKWhPerYear - row.afterKWhPerYear;
  return [...rows.values()];
}
