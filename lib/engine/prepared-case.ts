import type Decimal from "decimal.js";
import {
  economicsAtScale,
  economicsOf,
  evaluateAxisPhysics,
  type AxisContext,
  type AxisPhysics,
} from "./axis";
import { npv, paybackYears } from "./finance";
import { axesMoney, fleetTotals, sumShared, type AxisMoney, type FleetTotals } from "./fleet";
import { HUNDRED, Money, ONE, ZERO, parseMoney } from "./money";
import { cashFlows, rateOf } from "./scenarios";
import type { ParsedCase } from "./schema";
import type { PhysicsScenarioOutcome } from "./sensitivity";
import type { SensitivityDriver } from "./types";

/**
 * Factors on the drivers of ENGINE.md §8's sensitivity, any number of them at once: the
 * sensitivity moves one at a time, the dossier's uncertainty analysis moves four together.
 * A driver left out stays at the case's own value.
 */
export type DriverFactors = Partial<Record<SensitivityDriver, Decimal>>;

/** The physics scenario of one set of factors, with its NPV and simple payback. */
export interface DriverOutcome extends PhysicsScenarioOutcome {
  npv: Decimal;
  paybackYears: number | null;
}

/**
 * A case with its physics evaluated once, from which the physics scenario can be recomputed
 * under changed drivers without repeating the per-axis work that does not depend on them: the
 * tariff, the hours, the step-loss events, kit price, labor rate and discount rate enter the
 * flows linearly (§6, §8); only a changed load torque solves the closed loop of every axis again
 * (economicsAtLoad). evaluateParsedCase builds its sensitivity through the same function.
 */
export interface PreparedCase {
  input: ParsedCase;
  ctx: AxisContext;
  physics: AxisPhysics[];
  money: AxisMoney[];
  base: FleetTotals;
  capex: Decimal;
  maintenance: Decimal;
  tariff: Decimal;
  flowsFor(
    totals: FleetTotals,
    energySavedKWh: number,
    overrides?: { tariff?: Decimal; capex?: Decimal },
  ): Decimal[];
  /** The physics scenario with the given drivers scaled. */
  at(factors: DriverFactors): DriverOutcome;
}

export function axisContext(input: ParsedCase): AxisContext {
  return {
    margins: input.margins,
    band: input.band,
    coolingCop: input.finance.coolingCop,
    lifeHalvingK: input.thermal.lifeHalvingK,
  };
}

export function prepareCase(input: ParsedCase): PreparedCase {
  const { finance } = input;
  const ctx = axisContext(input);
  const physics = input.axes.map((axis) => evaluateAxisPhysics(axis, ctx));
  const laborRate = parseMoney(finance.laborRatePerHour);
  const money = axesMoney(input.axes, laborRate);
  const base = fleetTotals(input, money, (i) => economicsOf(physics[i]));

  const downtimeHours = input.machines.reduce(
    (hours, m) => (m.downtimeHours === 0 ? hours : hours.plus(m.downtimeHours)),
    ZERO,
  );
  const downtime = downtimeHours.times(parseMoney(finance.downtimeCostPerHour));
  const capex = sumShared(money.map((m) => m.capexTotal))
    .plus(downtime)
    .plus(parseMoney(finance.projectOneTimeCost));
  const maintenance = sumShared(money.map((m) => m.maintenanceTotal));
  const service = parseMoney(finance.annualServiceCost);
  const tariff = parseMoney(finance.tariffPerKWh);

  const flowsFor: PreparedCase["flowsFor"] = (totals, energySavedKWh, overrides = {}) =>
    cashFlows({
      capex: overrides.capex ?? capex,
      energySavedKWh,
      tariffPerKWh: overrides.tariff ?? tariff,
      tariffEscalationPct: finance.tariffEscalationPct,
      recurringPerYear: totals.reliabilityPerYear
        .plus(maintenance)
        .plus(totals.throughputPerYear)
        .minus(service),
      horizonYears: finance.horizonYears,
    });

  // The gain each machine puts a value on; absent where throughput is worth nothing.
  const valuedGainPct = new Map(
    input.machines
      .filter((m) => m.throughputGainPct > 0 && !parseMoney(m.marginPerOutputHour).isZero())
      .map((m) => [m.id, m.throughputGainPct]),
  );
  let kitTotal: Decimal | undefined;
  let laborTotal: Decimal | undefined;

  const at = (factors: DriverFactors): DriverOutcome => {
    let totals = base;
    let capexAt = capex;
    let rate = rateOf(finance.discountRatePct);
    // Load first: the hours and events factors then scale the totals of the scaled load.
    if (factors.loadTorque !== undefined) {
      const f = factors.loadTorque.toNumber();
      totals = fleetTotals(input, money, (i) =>
        economicsAtScale(
          input.axes[i],
          physics[i],
          ctx,
          { loadTorque: f, idleCurrent: 1 },
          valuedGainPct.get(input.axes[i].machineId),
        ),
      );
    }
    if (factors.hoursPerYear !== undefined) totals = withHoursScaled(totals, factors.hoursPerYear);
    if (factors.stepLossEvents !== undefined)
      totals = {
        ...totals,
        reliabilityPerYear: totals.reliabilityPerYear.times(factors.stepLossEvents),
      };
    if (factors.kitPrice !== undefined) {
      kitTotal ??= sumShared(money.map((m) => m.kitTotal));
      capexAt = capexAt.plus(kitTotal.times(factors.kitPrice.minus(ONE)));
    }
    if (factors.laborRate !== undefined) {
      laborTotal ??= sumShared(money.map((m) => m.laborHoursTotal)).times(laborRate);
      capexAt = capexAt.plus(laborTotal.times(factors.laborRate.minus(ONE)));
    }
    if (factors.discountRate !== undefined)
      rate = new Money(finance.discountRatePct).times(factors.discountRate).div(HUNDRED);
    const flows = flowsFor(totals, totals.energySavedKWh + totals.coolingSavedKWh, {
      tariff: factors.tariff === undefined ? tariff : tariff.times(factors.tariff),
      capex: capexAt,
    });
    return {
      flows,
      capex: capexAt,
      rate,
      npv: npv(rate, flows),
      paybackYears: paybackYears(flows, capexAt),
    };
  };

  return { input, ctx, physics, money, base, capex, maintenance, tariff, flowsFor, at };
}

/**
 * Every axis's hours scaled alike: energy and cooling are linear in hours (§6), and so is the
 * throughput value, through the largest hoursPerYear of each machine (§8).
 */
export function withHoursScaled(totals: FleetTotals, factor: Decimal): FleetTotals {
  const f = factor.toNumber();
  return {
    ...totals,
    energyOpenLoopKWh: totals.energyOpenLoopKWh * f,
    energyClosedLoopKWh: totals.energyClosedLoopKWh * f,
    energySavedKWh: totals.energySavedKWh * f,
    coolingOpenLoopKWh: totals.coolingOpenLoopKWh * f,
    coolingSavedKWh: totals.coolingSavedKWh * f,
    throughputPerYear: totals.throughputPerYear.times(factor),
  };
}
