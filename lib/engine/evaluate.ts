import type { AxisPhysics } from "./axis";
import type { AxisMoney } from "./fleet";
import { npv } from "./finance";
import { ONE, ZERO, moneyString } from "./money";
import { prepareCase, type PreparedCase } from "./prepared-case";
import { cashFlowSeries, scenario } from "./scenarios";
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
  return assertFiniteResult(resultOf(prepareCase(input)));
}

/**
 * A figure of the result is NaN or infinite: the schema's bounds (FIELD_BOUNDS) are meant to
 * make this impossible, so it marks a gap in them. Callers answer 422 instead of publishing
 * "NaN" as an NPV (docs/contracts.md (Numbers and money): every figure is a finite number or a decimal string).
 */
export class NonFiniteResultError extends Error {
  readonly status = 422;
  constructor(readonly path: string) {
    super(`The case gives a figure out of range (${path}); check its inputs for extreme values`);
    this.name = "NonFiniteResultError";
  }
}

// Money strings come from decimal.js, which prints NaN and ±Infinity as words.
const NON_FINITE_TEXT = /^[+-]?(NaN|Infinity)$/;

/** Throws NonFiniteResultError at the first number or decimal string that is not finite. */
export function assertFiniteResult<T>(result: T): T {
  // A 10,000-axis result holds about a million values: the common, clean case is walked without
  // building a path for each; the path is worked out only once something is wrong.
  if (!isAllFinite(result)) throw new NonFiniteResultError(pathOfNonFinite(result, "") ?? "");
  return result;
}

function isNonFiniteText(value: string): boolean {
  // "NaN", "Infinity", "-Infinity": the regular expression runs only on strings ending as those do.
  const last = value.charCodeAt(value.length - 1);
  return (last === 78 /* N */ || last === 121) /* y */ && NON_FINITE_TEXT.test(value);
}

function isAllFinite(value: unknown): boolean {
  if (typeof value === "number") return value - value === 0;
  if (typeof value === "string") return !isNonFiniteText(value);
  if (typeof value !== "object" || value === null) return true;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) if (!isAllFinite(value[i])) return false;
    return true;
  }
  const record = value as Record<string, unknown>;
  for (const key in record) if (!isAllFinite(record[key])) return false;
  return true;
}

function pathOfNonFinite(value: unknown, path: string): string | null {
  if (typeof value === "object" && value !== null) {
    const entries = Array.isArray(value)
      ? value.map((item, i) => [`${path}[${i}]`, item] as const)
      : Object.entries(value).map(([key, item]) => [path ? `${path}.${key}` : key, item] as const);
    for (const [itemPath, item] of entries) {
      const found = pathOfNonFinite(item, itemPath);
      if (found !== null) return found;
    }
    return null;
  }
  return isAllFinite(value) ? null : path;
}

/** The sensitivity of docs/model.md (The business case) at any swing, each driver moved alone (the dossier asks for several). */
export function sensitivityOf(prepared: PreparedCase, swingPct: number): SensitivityRow[] {
  return sensitivity(swingPct, prepared.input.currency, (driver, factor) =>
    prepared.at({ [driver]: factor }),
  );
}

/** The CaseResult of a prepared case. */
export function resultOf(prepared: PreparedCase): CaseResult {
  const { input, base, capex, maintenance, termsFor, physics, money } = prepared;
  const { finance } = input;
  const physicsSaving = base.energySavedKWh + base.coolingSavedKWh;
  // Band scenarios: the trade's claimed fraction of today's drive and of today's cooling energy
  // (docs/model.md (The business case)); "energy" and "cooling" by source carry each.
  const band = (pct: number) =>
    scenario(
      cashFlowSeries(
        termsFor(base, (pct / 100) * base.energyOpenLoopKWh, (pct / 100) * base.coolingOpenLoopKWh),
      ),
      capex,
      finance.discountRatePct,
    );

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
      physics: scenario(
        cashFlowSeries(termsFor(base, base.energySavedKWh, base.coolingSavedKWh)),
        capex,
        finance.discountRatePct,
      ),
      bandLow: band(input.band.lowPct),
      bandHigh: band(input.band.highPct),
    },
    sensitivity: sensitivityOf(prepared, input.sensitivity.swingPct),
    breakEven: breakEven(prepared),
  };
}

/**
 * Where the physics scenario's NPV crosses 0 (docs/model.md (The business case)). NPV is affine in the tariff
 * and in a factor f on every axis's step-loss events (reliability is linear in f, and tax is
 * linear in the flow), so two evaluations give the line: tariff = t₀ − NPV(t₀)/(NPV(t₀+1) −
 * NPV(t₀)), factor = −NPV(0)/(NPV(1) − NPV(0)). Each is null when NPV does not rise with it
 * (slope ≤ 0) or the answer is negative.
 */
export function breakEven(prepared: PreparedCase): CaseResult["breakEven"] {
  const { terms, rate } = prepared.termsAt({});
  const npvOf = (t: typeof terms) => npv(rate, cashFlowSeries(t).flows);
  const atBase = npvOf(terms);

  const tariffSlope = npvOf({ ...terms, tariffPerKWh: terms.tariffPerKWh.plus(ONE) }).minus(atBase);
  const tariff = tariffSlope.lte(0) ? null : terms.tariffPerKWh.minus(atBase.div(tariffSlope));

  const withoutEvents = npvOf({ ...terms, reliability: ZERO });
  const eventSlope = atBase.minus(withoutEvents);
  const factor = eventSlope.lte(0) ? null : withoutEvents.negated().div(eventSlope);

  return {
    tariffPerKWh: tariff === null || tariff.isNegative() ? null : moneyString(tariff),
    stepLossFactor: factor === null || factor.isNegative() ? null : factor.toNumber(),
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
