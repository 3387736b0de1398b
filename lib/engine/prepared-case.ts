import type Decimal from "decimal.js";
import {
  economicsAtScale,
  economicsOf,
  evaluateAxisPhysics,
  type AxisContext,
  type AxisPhysics,
} from "./axis";
import { npv, paybackYears } from "./finance";
import {
  axesMoney,
  fleetTotals,
  sumShared,
  throughputOf,
  type AxisMoney,
  type FleetTotals,
} from "./fleet";
import { HUNDRED, Money, ONE, ZERO, parseMoney } from "./money";
import { cashFlowSeries, rateOf, type YearlyTerms } from "./scenarios";
import type { ParsedCase } from "./schema";
import type { PhysicsScenarioOutcome } from "./sensitivity";
import type { SensitivityDriver } from "./types";

/**
 * Factors on the drivers of docs/model.md (The business case)'s sensitivity, any number of them at once: the
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
 * tariff, the hours, the step-loss events, kit price, labor rate, discount rate and throughput
 * gain enter the flows linearly or through the per-machine cap (docs/model.md (Energy and cooling), docs/model.md (The business case)); only a changed load
 * torque or idle current solves the axes again (economicsAtScale). evaluateParsedCase builds
 * its scenarios, sensitivity and break-even values through the same functions.
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
  /** The yearly terms of a scenario that counts these energies, with the fleet totals given. */
  termsFor(
    totals: FleetTotals,
    energyKWh: number,
    coolingKWh: number,
    overrides?: { tariff?: Decimal; capex?: Decimal },
  ): YearlyTerms;
  /** The yearly terms and discount rate of the physics scenario with the given drivers scaled. */
  termsAt(factors: DriverFactors): { terms: YearlyTerms; rate: Decimal };
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
  const downtimeCost = parseMoney(finance.downtimeCostPerHour);
  const money = axesMoney(input.axes, laborRate, downtimeCost);
  const base = fleetTotals(input, money, (i) => economicsOf(physics[i]));

  const downtimeHours = input.machines.reduce(
    (hours, m) => (m.downtimeHours === 0 ? hours : hours.plus(m.downtimeHours)),
    ZERO,
  );
  const downtime = downtimeHours.times(downtimeCost);
  const capex = sumShared(money.map((m) => m.capexTotal))
    .plus(downtime)
    .plus(parseMoney(finance.projectOneTimeCost));
  const maintenance = sumShared(money.map((m) => m.maintenanceTotal));
  const service = parseMoney(finance.annualServiceCost);
  const tariff = parseMoney(finance.tariffPerKWh);

  const termsFor: PreparedCase["termsFor"] = (totals, energyKWh, coolingKWh, overrides = {}) => ({
    capex: overrides.capex ?? capex,
    energyKWh,
    coolingKWh,
    tariffPerKWh: overrides.tariff ?? tariff,
    tariffEscalationPct: finance.tariffEscalationPct,
    reliability: totals.reliabilityPerYear,
    maintenance,
    throughput: totals.throughputPerYear,
    service,
    inflationPct: finance.inflationPct,
    taxRatePct: finance.taxRatePct,
    depreciationYears: finance.depreciationYears,
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

  const termsAt = (factors: DriverFactors): { terms: YearlyTerms; rate: Decimal } => {
    let totals = base;
    let capexAt = capex;
    let rate = rateOf(finance.discountRatePct);
    const gainFactor = factors.throughputGain?.toNumber() ?? 1;
    // Load and idle current first: they solve the axes again, and the hours, events and gain
    // factors then scale what that run adds up to.
    if (factors.loadTorque !== undefined || factors.idleCurrent !== undefined) {
      const scale = {
        loadTorque: factors.loadTorque?.toNumber() ?? 1,
        idleCurrent: factors.idleCurrent?.toNumber() ?? 1,
      };
      totals = fleetTotals(input, money, (i) => {
        const valued = valuedGainPct.get(input.axes[i].machineId);
        return economicsAtScale(
          input.axes[i],
          physics[i],
          ctx,
          scale,
          valued === undefined ? undefined : valued * gainFactor,
        );
      });
    }
    if (factors.throughputGain !== undefined) {
      const { machines, total } = throughputOf(input, totals.machineStats, gainFactor);
      totals = { ...totals, machines, throughputPerYear: total };
    }
    if (factors.hoursPerYear !== undefined) totals = withHoursScaled(totals, factors.hoursPerYear);
    if (factors.laborRate !== undefined) {
      laborTotal ??= sumShared(money.map((m) => m.laborHoursTotal)).times(laborRate);
      const change = factors.laborRate.minus(ONE);
      capexAt = capexAt.plus(laborTotal.times(change));
      // docs/model.md (The business case): the labor rate also prices the restart labour of each step-loss event.
      totals = {
        ...totals,
        reliabilityPerYear: totals.reliabilityPerYear.plus(
          totals.reliabilityLaborPerYear.times(change),
        ),
        reliabilityLaborPerYear: totals.reliabilityLaborPerYear.times(factors.laborRate),
      };
    }
    if (factors.stepLossEvents !== undefined)
      totals = {
        ...totals,
        reliabilityPerYear: totals.reliabilityPerYear.times(factors.stepLossEvents),
        reliabilityLaborPerYear: totals.reliabilityLaborPerYear.times(factors.stepLossEvents),
      };
    if (factors.kitPrice !== undefined) {
      kitTotal ??= sumShared(money.map((m) => m.kitTotal));
      capexAt = capexAt.plus(kitTotal.times(factors.kitPrice.minus(ONE)));
    }
    if (factors.discountRate !== undefined)
      rate = new Money(finance.discountRatePct).times(factors.discountRate).div(HUNDRED);
    const terms = termsFor(totals, totals.energySavedKWh, totals.coolingSavedKWh, {
      tariff: factors.tariff === undefined ? tariff : tariff.times(factors.tariff),
      capex: capexAt,
    });
    return { terms, rate };
  };

  const at = (factors: DriverFactors): DriverOutcome => {
    const { terms, rate } = termsAt(factors);
    const { flows } = cashFlowSeries(terms);
    return {
      flows,
      capex: terms.capex,
      rate,
      npv: npv(rate, flows),
      paybackYears: paybackYears(flows, terms.capex),
    };
  };

  return {
    input,
    ctx,
    physics,
    money,
    base,
    capex,
    maintenance,
    tariff,
    termsFor,
    termsAt,
    at,
  };
}

/**
 * Every axis's hours scaled alike: energy and cooling are linear in hours (docs/model.md (Energy and cooling)), and so is the
 * throughput value, through the largest hoursPerYear of each machine (docs/model.md (The business case)).
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
