import type { AxisPhysics } from "./axis";
import type { AxisMoney } from "./fleet";
import { moneyString } from "./money";
import { prepareCase, type PreparedCase } from "./prepared-case";
import { scenario } from "./scenarios";
import { caseInputSchema, type ParsedCase } from "./schema";
import { sensitivity } from "./sensitivity";
import type { AxisResult, CaseResult, SensitivityRow } from "./types";
import { ENGINE_VERSION } from "./version";

/**
 * Evaluates a case given as raw JSON-like input: it is parsed with caseInputSchema first, so
 * defaults and unit conversions apply; invalid input throws the ZodError (format it with
 * formatIssues). Parsed input is accepted as well — parsing it again changes nothing.
 */
export function evaluateCase(input: unknown): CaseResult {
  return evaluateParsedCase(caseInputSchema.parse(input));
}

/** For input that already went through caseInputSchema (e.g. from safeParse). */
export function evaluateParsedCase(input: ParsedCase): CaseResult {
  return resultOf(prepareCase(input));
}

/** The sensitivity of §8 at any swing, each driver moved alone (the dossier asks for several). */
export function sensitivityOf(prepared: PreparedCase, swingPct: number): SensitivityRow[] {
  return sensitivity(swingPct, (driver, factor) => prepared.at({ [driver]: factor }));
}

/** The CaseResult of a prepared case. */
export function resultOf(prepared: PreparedCase): CaseResult {
  const { input, base, capex, maintenance, flowsFor, physics, money } = prepared;
  const { finance } = input;
  const physicsSaving = base.energySavedKWh + base.coolingSavedKWh;
  // Band scenarios: the trade's claimed fraction of today's drive and cooling energy (§8).
  const bandSaving = (pct: number) =>
    (pct / 100) * (base.energyOpenLoopKWh + base.coolingOpenLoopKWh);

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
      co2TonnesPerYear: (physicsSaving * finance.gridKgCo2PerKWh) / 1000,
    },
    scenarios: {
      physics: scenario(flowsFor(base, physicsSaving), capex, finance.discountRatePct),
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
    sensitivity: sensitivityOf(prepared, input.sensitivity.swingPct),
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
    motion: axis.motion,
    savings: axis.savings,
    capex: money.capexUnitText,
    totals: {
      capex: money.capexTotalText,
      energySavedKWhPerYear: axis.quantity * axis.savings.energyKWhPerYear,
      coolingSavedKWhPerYear: axis.quantity * axis.savings.coolingKWhPerYear,
    },
  };
}
