import type Decimal from "decimal.js";
import { axesMoney, sumShared } from "./fleet";
import { Money, ZERO, moneyString, parseMoney } from "./money";
import { cashFlowSeries, type YearlyTerms } from "./scenarios";
import type { ParsedCase } from "./schema";
import { VALUE_SOURCES, type CaseResult, type ValueSource } from "./types";

/** Years 1..N of one part of the fleet, by source, as decimal strings (as Scenario.bySource). */
export type SourceYears = Record<ValueSource, string[]>;

export interface MachineValue {
  machineId: string;
  bySource: SourceYears;
}

/** One scenario's value by source split into the machines and what belongs to the case as a whole. */
export interface ScenarioValueSplit {
  machines: MachineValue[];
  /**
   * What no machine carries: the annual service cost, and the tax on it less the shield of the
   * case's one-time project cost.
   */
  caseWide: SourceYears;
}

export type ScenarioKey = keyof CaseResult["scenarios"];
export type ValueByMachine = Record<ScenarioKey, ScenarioValueSplit>;

/** What one machine adds to the yearly terms of docs/model.md (The business case). */
interface MachinePart {
  energyOpenKWh: number;
  energyClosedKWh: number;
  coolingOpenKWh: number;
  coolingClosedKWh: number;
  reliability: Decimal[];
  maintenance: Decimal[];
  capex: Decimal[];
}

/**
 * The value by source of every scenario, split by machine. Nothing is derived a second way:
 * each machine's figures are the engine's own — the per-axis energies and cooling of the result,
 * the per-axis money of lib/engine/fleet.ts (step-loss events counted only where the result says
 * the axis avoids them), the throughput of each machine — and they go through the same
 * cashFlowSeries (lib/engine/scenarios.ts) as the fleet. Every term of that series is linear
 * in its inputs (the tax included, since its shield is used by the rest of the business), so a
 * machine's series, with the machine's own installed cost as its depreciation, plus the
 * case-wide series (service cost, one-time project cost) add up to the fleet's, source by source
 * and year by year: exactly, up to the rounding of the floating-point kWh sums and of Decimal at
 * 40 digits, far below a cent (tests/integration/value-by-machine.test.ts).
 *
 * `result` must be the evaluation of `input` (same axes in the same order).
 */
export function valueByMachine(result: CaseResult, input: ParsedCase): ValueByMachine {
  const { finance } = input;
  const laborRate = parseMoney(finance.laborRatePerHour);
  const downtimeCost = parseMoney(finance.downtimeCostPerHour);
  const money = axesMoney(input.axes, laborRate, downtimeCost);

  const parts = new Map<string, MachinePart>(
    input.machines.map((m) => [
      m.id,
      {
        energyOpenKWh: 0,
        energyClosedKWh: 0,
        coolingOpenKWh: 0,
        coolingClosedKWh: 0,
        reliability: [],
        maintenance: [],
        // The machine's downtime for the retrofit is part of the up-front cost (lib/engine/prepared-case.ts).
        capex: m.downtimeHours === 0 ? [] : [new Money(m.downtimeHours).times(downtimeCost)],
      },
    ]),
  );
  result.axes.forEach((axis, i) => {
    const source = input.axes[i];
    if (source === undefined || source.id !== axis.id)
      throw new Error(`valueByMachine: the result's axis ${i} is not the input's`);
    const part = parts.get(axis.machineId);
    if (part === undefined) throw new Error(`valueByMachine: no machine ${axis.machineId}`);
    const q = axis.quantity;
    part.energyOpenKWh += q * axis.openLoop.energyKWhPerYear;
    part.energyClosedKWh += q * axis.closedLoop.energyKWhPerYear;
    part.coolingOpenKWh += q * axis.openLoop.coolingKWhPerYear;
    part.coolingClosedKWh += q * axis.closedLoop.coolingKWhPerYear;
    // stepLossEventsAvoided is 0 exactly where the axis avoids no events (lib/engine/axis.ts);
    // where it is 0 for want of events, the money of the events is 0 as well.
    if (axis.savings.stepLossEventsAvoided > 0) part.reliability.push(money[i].reliabilityIfServed);
    part.maintenance.push(money[i].maintenanceTotal);
    part.capex.push(money[i].capexTotal);
  });
  const throughput = new Map(result.machines.map((m) => [m.id, parseMoney(m.throughputPerYear)]));

  const base: Omit<
    YearlyTerms,
    "capex" | "energyKWh" | "coolingKWh" | "reliability" | "maintenance" | "throughput" | "service"
  > = {
    tariffPerKWh: parseMoney(finance.tariffPerKWh),
    tariffEscalationPct: finance.tariffEscalationPct,
    inflationPct: finance.inflationPct,
    taxRatePct: finance.taxRatePct,
    depreciationYears: finance.depreciationYears,
    horizonYears: finance.horizonYears,
  };
  const series = (terms: YearlyTerms): SourceYears => {
    const { bySource } = cashFlowSeries(terms);
    return Object.fromEntries(
      VALUE_SOURCES.map((s) => [s, bySource[s].map(moneyString)]),
    ) as SourceYears;
  };
  const caseWide = series({
    ...base,
    capex: parseMoney(finance.projectOneTimeCost),
    energyKWh: 0,
    coolingKWh: 0,
    reliability: ZERO,
    maintenance: ZERO,
    throughput: ZERO,
    service: parseMoney(finance.annualServiceCost),
  });

  // Which energies each scenario counts, as lib/engine/evaluate.ts has them for the fleet.
  const counted: Record<ScenarioKey, (p: MachinePart) => { energy: number; cooling: number }> = {
    physics: (p) => ({
      energy: p.energyOpenKWh - p.energyClosedKWh,
      cooling: p.coolingOpenKWh - p.coolingClosedKWh,
    }),
    bandLow: (p) => ({
      energy: (input.band.lowPct / 100) * p.energyOpenKWh,
      cooling: (input.band.lowPct / 100) * p.coolingOpenKWh,
    }),
    bandHigh: (p) => ({
      energy: (input.band.highPct / 100) * p.energyOpenKWh,
      cooling: (input.band.highPct / 100) * p.coolingOpenKWh,
    }),
  };
  const split = (key: ScenarioKey): ScenarioValueSplit => ({
    machines: input.machines.map((m) => {
      const part = parts.get(m.id) as MachinePart;
      const { energy, cooling } = counted[key](part);
      return {
        machineId: m.id,
        bySource: series({
          ...base,
          capex: sumShared(part.capex),
          energyKWh: energy,
          coolingKWh: cooling,
          reliability: sumShared(part.reliability),
          maintenance: sumShared(part.maintenance),
          throughput: throughput.get(m.id) ?? ZERO,
          service: ZERO,
        }),
      };
    }),
    caseWide,
  });
  return { physics: split("physics"), bandLow: split("bandLow"), bandHigh: split("bandHigh") };
}
