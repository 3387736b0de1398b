import type Decimal from "decimal.js";
import {
  economicsAtLoad,
  economicsOf,
  evaluateAxisPhysics,
  type AxisContext,
  type AxisPhysics,
} from "./axis";
import { axesMoney, fleetTotals, sumShared, type AxisMoney, type FleetTotals } from "./fleet";
import { HUNDRED, Money, ONE, ZERO, moneyString, parseMoney } from "./money";
import { cashFlows, rateOf, scenario } from "./scenarios";
import { caseInputSchema, type ParsedCase } from "./schema";
import { sensitivity } from "./sensitivity";
import type { AxisResult, CaseResult } from "./types";
import { ENGINE_VERSION } from "./version";

/**
 * Evaluates a case given as raw JSON-like input: it is parsed with caseInputSchema first, so
 * defaults and unit conversions apply; invalid input throws the ZodError (format it with
 * formatIssues). Parsed input is accepted as well — parsing it again changes nothing.
 */
export function evaluateCase(input: unknown): CaseResult {
  return evaluateParsedCase(caseInputSchema.parse(input));
}

function axisContext(input: ParsedCase): AxisContext {
  return {
    margins: input.margins,
    band: input.band,
    coolingCop: input.finance.coolingCop,
    lifeHalvingK: input.thermal.lifeHalvingK,
  };
}

/** For input that already went through caseInputSchema (e.g. from safeParse). */
export function evaluateParsedCase(input: ParsedCase): CaseResult {
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

  const flowsFor = (
    totals: FleetTotals,
    energySavedKWh: number,
    overrides: { tariff?: Decimal; capex?: Decimal } = {},
  ) =>
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
  const physicsSaving = (t: FleetTotals) => t.energySavedKWh + t.coolingSavedKWh;
  // Band scenarios: the trade's claimed fraction of today's drive and cooling energy (§8).
  const bandSaving = (pct: number) =>
    (pct / 100) * (base.energyOpenLoopKWh + base.coolingOpenLoopKWh);

  // The gain each machine puts a value on; absent where throughput is worth nothing.
  const valuedGainPct = new Map(
    input.machines
      .filter((m) => m.throughputGainPct > 0 && !parseMoney(m.marginPerOutputHour).isZero())
      .map((m) => [m.id, m.throughputGainPct]),
  );
  const kitTotal = sumShared(money.map((m) => m.kitTotal));
  const laborTotal = sumShared(money.map((m) => m.laborHoursTotal)).times(laborRate);

  const rows = sensitivity(input.sensitivity.swingPct, (driver, factor) => {
    const f = factor.toNumber();
    let totals = base;
    let overrides: { tariff?: Decimal; capex?: Decimal } = {};
    let rate = rateOf(finance.discountRatePct);
    switch (driver) {
      case "tariff":
        overrides = { tariff: tariff.times(factor) };
        break;
      case "hoursPerYear":
        totals = withHoursScaled(base, factor);
        break;
      case "loadTorque":
        totals = fleetTotals(input, money, (i) =>
          economicsAtLoad(
            input.axes[i],
            physics[i],
            ctx,
            f,
            valuedGainPct.get(input.axes[i].machineId),
          ),
        );
        break;
      case "kitPrice":
        overrides = { capex: capex.plus(kitTotal.times(factor.minus(ONE))) };
        break;
      case "laborRate":
        overrides = { capex: capex.plus(laborTotal.times(factor.minus(ONE))) };
        break;
      case "stepLossEvents":
        totals = { ...base, reliabilityPerYear: base.reliabilityPerYear.times(factor) };
        break;
      case "discountRate":
        rate = new Money(finance.discountRatePct).times(factor).div(HUNDRED);
        break;
    }
    return {
      flows: flowsFor(totals, physicsSaving(totals), overrides),
      capex: overrides.capex ?? capex,
      rate,
    };
  });

  const energyAndCooling = physicsSaving(base);
  return {
    engineVersion: ENGINE_VERSION,
    currency: input.currency,
    axes: physics.map((axis, i) => axisResult(axis, money[i])),
    machines: base.machines,
    totals: {
      capex: moneyString(capex),
      energyOpenLoopKWhPerYear: base.energyOpenLoopKWh,
      energyClosedLoopKWhPerYear: base.energyClosedLoopKWh,
      energySavedKWhPerYear: base.energySavedKWh,
      coolingSavedKWhPerYear: base.coolingSavedKWh,
      reliabilityPerYear: moneyString(base.reliabilityPerYear),
      maintenancePerYear: moneyString(maintenance),
      throughputPerYear: moneyString(base.throughputPerYear),
      co2TonnesPerYear: (energyAndCooling * finance.gridKgCo2PerKWh) / 1000,
    },
    scenarios: {
      physics: scenario(flowsFor(base, energyAndCooling), capex, finance.discountRatePct),
      bandLow: scenario(
        flowsFor(base, bandSaving(input.band.lowPct)),
        capex,
        finance.discountRatePct,
      ),
      bandHigh: scenario(
        flowsFor(base, bandSaving(input.band.highPct)),
        capex,
        finance.discountRatePct,
      ),
    },
    sensitivity: rows,
  };
}

/**
 * Every axis's hours scaled alike: energy and cooling are linear in hours (§6), and so is the
 * throughput value, through the largest hoursPerYear of each machine (§8).
 */
function withHoursScaled(totals: FleetTotals, factor: Decimal): FleetTotals {
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

function axisResult(axis: AxisPhysics, money: AxisMoney): AxisResult {
  return {
    id: axis.id,
    machineId: axis.machineId,
    quantity: axis.quantity,
    warnings: axis.warnings,
    geometry: axis.geometry,
    openLoop: axis.openLoop,
    closedLoop: axis.closedLoop,
    savings: axis.savings,
    capex: money.capexUnitText,
    totals: {
      capex: money.capexTotalText,
      energySavedKWhPerYear: axis.quantity * axis.savings.energyKWhPerYear,
      coolingSavedKWhPerYear: axis.quantity * axis.savings.coolingKWhPerYear,
    },
  };
}
