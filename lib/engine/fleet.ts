import type Decimal from "decimal.js";
import { HUNDRED, Money, ZERO, moneyString, parseMoney } from "./money";
import type { ParsedAxis, ParsedCase } from "./schema";
import type { MachineResult } from "./types";

/** Money of one axis that does not depend on the physics. */
export interface AxisMoney {
  /** One unit: price after discount + install labor + commissioning. */
  capexUnit: Decimal;
  capexTotal: Decimal;
  /** capexUnit and capexTotal as the CaseResult prints them, made once per distinct combination. */
  capexUnitText: string;
  capexTotalText: string;
  /** quantity·price·(1 − discount): the part the kit-price driver scales. */
  kitTotal: Decimal;
  /** quantity·installHours: the part the labor-rate driver scales. */
  laborHoursTotal: Decimal;
  /** quantity·events·avoided·cost of an event, counted only where the axis avoids events. */
  reliabilityIfServed: Decimal;
  /**
   * The part of reliabilityIfServed that is restart labour (event.restartLaborHours·laborRate):
   * the labor-rate driver of docs/model.md (The business case) scales it with the rate.
   */
  reliabilityLaborIfServed: Decimal;
  maintenanceTotal: Decimal;
}

/** The inputs axisMoney reads, in a fixed order: equal tuples give equal money. */
const moneyInputs = ({ quantity, retrofit, reliability }: ParsedAxis) =>
  [
    quantity,
    retrofit.kit.price,
    retrofit.discountPct,
    retrofit.installHours,
    retrofit.commissioningCost,
    retrofit.maintenanceSavingPerYear,
    reliability.stepLossEventsPerYear,
    reliability.avoidedPct,
    reliability.costPerEvent ?? "0",
    reliability.event?.downtimeMinutes ?? 0,
    reliability.event?.scrapParts ?? 0,
    reliability.event?.scrapCostPerPart ?? "0",
    reliability.event?.restartLaborHours ?? 0,
  ] as const;

type MoneyMemo = Map<number | string, MoneyMemo | AxisMoney>;

/**
 * The money of every axis. Fleets repeat the same few kits, labor and costs on thousands of
 * axes, so each distinct combination is computed once and shared (Decimals are immutable). The
 * memo is a tree of Maps, one level per input, rather than one Map on a joined key: building
 * and hashing that key string for every axis cost more than the lookups.
 */
export function axesMoney(
  axes: readonly ParsedAxis[],
  laborRatePerHour: Decimal,
  downtimeCostPerHour: Decimal,
): AxisMoney[] {
  const memo: MoneyMemo = new Map();
  return axes.map((axis) => {
    const inputs = moneyInputs(axis);
    let level = memo;
    for (let k = 0; k < inputs.length - 1; k++) {
      let next = level.get(inputs[k]) as MoneyMemo | undefined;
      if (next === undefined) {
        next = new Map();
        level.set(inputs[k], next);
      }
      level = next;
    }
    const last = inputs[inputs.length - 1];
    let money = level.get(last) as AxisMoney | undefined;
    if (money === undefined) {
      money = axisMoney(axis, laborRatePerHour, downtimeCostPerHour);
      level.set(last, money);
    }
    return money;
  });
}

/**
 * The cost of one step-loss event (docs/model.md (The business case)): costPerEvent when given, else built from
 * what the event causes — downtime, scrap and restart labour. The schema refuses both at once.
 * `labor` is the restart-labour part alone.
 */
export function eventCost(
  reliability: ParsedAxis["reliability"],
  laborRatePerHour: Decimal,
  downtimeCostPerHour: Decimal,
): { total: Decimal; labor: Decimal } {
  const { costPerEvent, event } = reliability;
  if (event === undefined)
    return {
      total: costPerEvent === undefined ? ZERO : parseMoney(costPerEvent),
      labor: ZERO,
    };
  const downtime =
    event.downtimeMinutes === 0
      ? ZERO
      : new Money(event.downtimeMinutes).div(60).times(downtimeCostPerHour);
  const scrap =
    event.scrapParts === 0
      ? ZERO
      : new Money(event.scrapParts).times(parseMoney(event.scrapCostPerPart));
  const labor =
    event.restartLaborHours === 0
      ? ZERO
      : new Money(event.restartLaborHours).times(laborRatePerHour);
  return { total: downtime.plus(scrap).plus(labor), labor };
}

export function axisMoney(
  axis: ParsedAxis,
  laborRatePerHour: Decimal,
  downtimeCostPerHour: Decimal,
): AxisMoney {
  const { retrofit, reliability } = axis;
  const quantity = new Money(axis.quantity);
  const price = parseMoney(retrofit.kit.price);
  const kitUnit =
    retrofit.discountPct === 0
      ? price
      : price.times(HUNDRED.minus(retrofit.discountPct)).div(HUNDRED);
  const laborHoursUnit = new Money(retrofit.installHours);
  const capexUnit = kitUnit
    .plus(laborHoursUnit.times(laborRatePerHour))
    .plus(parseMoney(retrofit.commissioningCost));
  const cost = eventCost(reliability, laborRatePerHour, downtimeCostPerHour);
  // Events avoided per year, all units: the factor both the cost and its labour part carry.
  const avoided =
    reliability.stepLossEventsPerYear === 0 || reliability.avoidedPct === 0
      ? ZERO
      : quantity
          .times(reliability.stepLossEventsPerYear)
          .times(reliability.avoidedPct)
          .div(HUNDRED);
  const served = avoided.isZero() || cost.total.isZero() ? ZERO : avoided.times(cost.total);
  const servedLabor = avoided.isZero() || cost.labor.isZero() ? ZERO : avoided.times(cost.labor);
  const capexTotal = capexUnit.times(quantity);
  return {
    capexUnit,
    capexTotal,
    capexUnitText: moneyString(capexUnit),
    capexTotalText: moneyString(capexTotal),
    kitTotal: kitUnit.times(quantity),
    laborHoursTotal: laborHoursUnit.times(quantity),
    reliabilityIfServed: served,
    reliabilityLaborIfServed: servedLabor,
    maintenanceTotal: quantity.times(parseMoney(retrofit.maintenanceSavingPerYear)),
  };
}

/** Σ of a money field over axes, each distinct Decimal multiplied once by how often it occurs. */
export function sumShared(values: Iterable<Decimal>): Decimal {
  const counts = new Map<Decimal, number>();
  for (const v of values) if (!v.isZero()) counts.set(v, (counts.get(v) ?? 0) + 1);
  let total = ZERO;
  for (const [value, count] of counts) total = total.plus(count === 1 ? value : value.times(count));
  return total;
}

/** Per unit of one axis: what the business case of docs/model.md (The business case) needs from the physics. */
export interface AxisEconomics {
  energyOpenLoopKWh: number;
  energyClosedLoopKWh: number;
  coolingOpenLoopKWh: number;
  coolingClosedLoopKWh: number;
  undersized: boolean;
  /** Not undersized and not a sensorless kit below its minimum speed (docs/model.md (Currents at the operating point), docs/model.md (The business case)). */
  avoidsEvents: boolean;
  speedHeadroomPct: number | null;
}

/** What the throughput cap of one machine depends on (docs/model.md (The business case)). */
export interface MachineStats {
  axes: number;
  /** An axis is undersized or has no headroom: the gain is capped to 0. */
  blocked: boolean;
  leastHeadroom: number;
  mostHours: number;
}

/** What one physics run of the whole fleet adds up to. */
export interface FleetTotals {
  energyOpenLoopKWh: number;
  energyClosedLoopKWh: number;
  energySavedKWh: number;
  coolingOpenLoopKWh: number;
  coolingSavedKWh: number;
  reliabilityPerYear: Decimal;
  /** The restart-labour part of reliabilityPerYear, for the labor-rate driver. */
  reliabilityLaborPerYear: Decimal;
  throughputPerYear: Decimal;
  machines: MachineResult[];
  machineStats: MachineStats[];
}

/**
 * Adds up one physics run, axis by axis, without keeping per-axis objects: the sensitivity runs
 * pass through here too.
 */
export function fleetTotals(
  input: ParsedCase,
  money: readonly AxisMoney[],
  economicsOf: (axisIndex: number) => AxisEconomics,
): FleetTotals {
  let energyOpen = 0;
  let energyClosed = 0;
  let coolingOpen = 0;
  let coolingClosed = 0;
  const served: Decimal[] = [];
  const servedLabor: Decimal[] = [];
  const machineIndex = new Map(input.machines.map((m, i) => [m.id, i]));
  const perMachine: MachineStats[] = input.machines.map(() => ({
    axes: 0,
    blocked: false,
    leastHeadroom: Infinity,
    mostHours: 0,
  }));

  input.axes.forEach((axis, i) => {
    const e = economicsOf(i);
    const q = axis.quantity;
    energyOpen += q * e.energyOpenLoopKWh;
    energyClosed += q * e.energyClosedLoopKWh;
    coolingOpen += q * e.coolingOpenLoopKWh;
    coolingClosed += q * e.coolingClosedLoopKWh;
    if (e.avoidsEvents) {
      served.push(money[i].reliabilityIfServed);
      servedLabor.push(money[i].reliabilityLaborIfServed);
    }

    const m = perMachine[machineIndex.get(axis.machineId) as number];
    m.axes++;
    if (e.undersized || e.speedHeadroomPct === null) m.blocked = true;
    else m.leastHeadroom = Math.min(m.leastHeadroom, e.speedHeadroomPct);
    m.mostHours = Math.max(m.mostHours, axis.duty.hoursPerYear);
  });

  const { machines, total } = throughputOf(input, perMachine);
  return {
    energyOpenLoopKWh: energyOpen,
    energyClosedLoopKWh: energyClosed,
    energySavedKWh: energyOpen - energyClosed,
    coolingOpenLoopKWh: coolingOpen,
    coolingSavedKWh: coolingOpen - coolingClosed,
    reliabilityPerYear: sumShared(served),
    reliabilityLaborPerYear: sumShared(servedLabor),
    throughputPerYear: total,
    machines,
    machineStats: perMachine,
  };
}

/**
 * Throughput per machine (docs/model.md (The business case)): gain = min(asked, cap), cap = max(0, least headroom
 * of its axes), 0 when one is undersized or has no headroom; value = gain/100 · margin per output
 * hour · the longest hours of its axes. `gainFactor` scales every machine's asked gain (the
 * throughput-gain driver), which stays capped.
 */
export function throughputOf(
  input: ParsedCase,
  stats: readonly MachineStats[],
  gainFactor = 1,
): { machines: MachineResult[]; total: Decimal } {
  let total = ZERO;
  const machines: MachineResult[] = input.machines.map((machine, i) => {
    const m = stats[i];
    // A machine without axes has nothing to speed up: it adds 0 and is not reported as capped.
    if (m.axes === 0)
      return { id: machine.id, throughputGainPct: 0, throughputPerYear: "0", warnings: [] };
    const asked =
      gainFactor === 1 ? machine.throughputGainPct : machine.throughputGainPct * gainFactor;
    const cap = m.blocked ? 0 : Math.max(0, m.leastHeadroom);
    const gain = Math.min(asked, cap);
    const value =
      gain === 0
        ? ZERO
        : new Money(gain)
            .div(HUNDRED)
            .times(parseMoney(machine.marginPerOutputHour))
            .times(m.mostHours);
    total = total.plus(value);
    return {
      id: machine.id,
      throughputGainPct: gain,
      throughputPerYear: moneyString(value),
      warnings: gain < asked ? ["THROUGHPUT_CAPPED"] : [],
    };
  });
  return { machines, total };
}
