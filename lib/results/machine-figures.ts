import Decimal from "decimal.js";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { energyByMachine, type MachineEnergyRow } from "./energy";

export interface MachineFigures extends MachineEnergyRow {
  /** Installed cost of the machine's retrofit, every unit counted (decimal string). */
  capex: string;
  /** Margin of the extra output closed loop frees, per year (decimal string). */
  throughputPerYear: string;
}

/** Per machine: what its retrofit costs and what it saves, for the proposal's reader. */
export function machineFigures(result: CaseResult, input: ParsedCase | null): MachineFigures[] {
  const capex = new Map<string, Decimal>();
  for (const axis of result.axes)
    capex.set(
      axis.machineId,
      (capex.get(axis.machineId) ?? new Decimal(0)).plus(axis.totals.capex),
    );
  const throughput = new Map(result.machines.map((m) => [m.id, m.throughputPerYear]));
  return energyByMachine(result, input).map((row) => ({
    ...row,
    capex: (capex.get(row.machineId) ?? new Decimal(0)).toFixed(),
    throughputPerYear: throughput.get(row.machineId) ?? "0",
  }));
}
