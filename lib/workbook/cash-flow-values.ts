import {
  VALUE_SOURCES,
  type CaseResult,
  type ParsedCase,
  type PaybackStatus,
  type Scenario,
  type ValueSource,
} from "@/lib/engine";
import {
  IRR_ABOVE_SEARCH_WORDS,
  IRR_NO_RATE_WORDS,
  irrWithoutRate,
} from "@/lib/results/format";
import { MAX_HORIZON_YEARS, type ScenarioKey } from "./layout";

/**
 * The values the Cash flow sheet's formulas evaluate to, stored beside them as cached results
 * so that a viewer that does not calculate still shows the engine's numbers. They are the
 * engine's flows in doubles; every other figure is recomputed by the spreadsheet.
 */

export const BEYOND_HORIZON = "beyond the horizon";
// The IRR cell's words when there is no rate: the same as the results pages (lib/results/format.ts).
export const NO_SIGN_CHANGE = IRR_NO_RATE_WORDS;
export const NO_RATE_FOUND = IRR_NO_RATE_WORDS;
export const IRR_ABOVE_SEARCH = IRR_ABOVE_SEARCH_WORDS;
export const NOT_APPLICABLE = "n/a";
/** A break-even value the engine reports as null: NPV does not rise with it, or it is negative. */
export const NO_BREAK_EVEN = "none";

export interface YearValues {
  flow: number;
  cumulative: number;
  discounted: number;
  discountedCumulative: number;
  payback: number | "";
  discountedPayback: number | "";
}

export function yearValues(input: ParsedCase, scenario: Scenario): YearValues[] {
  const { horizonYears, discountRatePct } = input.finance;
  const growth = 1 + discountRatePct / 100;
  const rows: YearValues[] = [];
  for (let t = 0; t <= MAX_HORIZON_YEARS; t++) {
    const flow = t <= horizonYears ? Number(scenario.cashFlows[t]) : 0;
    const discounted = flow / growth ** t;
    const before = rows[t - 1];
    const cumulative = (before?.cumulative ?? 0) + flow;
    const discountedCumulative = (before?.discountedCumulative ?? 0) + discounted;
    const crossed = (prev: number | undefined, now: number, f: number) =>
      t >= 1 && t <= horizonYears && prev !== undefined && prev < 0 && now >= 0
        ? t - 1 - prev / f
        : "";
    rows.push({
      flow,
      cumulative,
      discounted,
      discountedCumulative,
      payback: crossed(before?.cumulative, cumulative, flow),
      discountedPayback: crossed(before?.discountedCumulative, discountedCumulative, discounted),
    });
  }
  return rows;
}

export function irrValue(scenario: Scenario): number | string {
  if (scenario.irr !== null) return scenario.irr;
  return irrWithoutRate(scenario.cashFlows);
}

/** The IRR search's starting point, as the Cash flow sheet computes it (see there). */
export function irrGuess(scenario: Scenario): number {
  const flows = scenario.cashFlows.map(Number);
  const later = flows.slice(1);
  const total = later.reduce((a, b) => a + b, 0);
  if (!(flows[0] < 0) || later.some((f) => f < 0) || !(total > 0)) return 0.1;
  const meanYear = later.reduce((sum, f, i) => sum + (i + 1) * f, 0) / total;
  return (total / -flows[0]) ** (1 / meanYear) - 1;
}

export const paybackValue = (years: number | null): number | string => years ?? BEYOND_HORIZON;

export const roiValue = (pct: number | null): number | string => pct ?? NOT_APPLICABLE;

export function tariffInYear(input: ParsedCase, t: number): number {
  return (
    Number(input.finance.tariffPerKWh) * (1 + input.finance.tariffEscalationPct / 100) ** (t - 1)
  );
}

/** Today's cabinet cooling energy of the fleet: the band scenarios take their fraction of it. */
export function coolingOpenLoop(result: CaseResult, input: ParsedCase): number {
  let total = 0;
  result.axes.forEach(
    (axis, i) => (total += input.axes[i].quantity * axis.openLoop.coolingKWhPerYear),
  );
  return total;
}

/** The drive and cooling energy (kWh/yr) a scenario counts (docs/model.md (The business case)). */
export function scenarioKWh(
  input: ParsedCase,
  result: CaseResult,
  scenario: ScenarioKey,
): { energy: number; cooling: number } {
  const { totals } = result;
  if (scenario === "physics")
    return { energy: totals.energySavedKWhPerYear, cooling: totals.coolingSavedKWhPerYear };
  const share = (scenario === "bandLow" ? input.band.lowPct : input.band.highPct) / 100;
  return {
    energy: share * totals.energyOpenLoopKWhPerYear,
    cooling: share * coolingOpenLoop(result, input),
  };
}

/** Years 1..30 of each source: 0 beyond the horizon. */
export type SourceValues = Record<ValueSource, number[]>;

/**
 * The value by source the block's formulas evaluate to: the engine's own (engine v2), or, for a
 * result stored by engine v1 (no value by source), the same terms worked out in doubles from its
 * totals — v1 had no inflation or tax, and a v1 input parses with both at 0.
 */
export function sourceValues(
  input: ParsedCase,
  result: CaseResult,
  scenario: ScenarioKey,
): SourceValues {
  const { horizonYears } = input.finance;
  const stored = (result.scenarios[scenario] as Partial<Scenario>).bySource;
  const worked = stored ? undefined : workedSources(input, result, scenario);
  return Object.fromEntries(
    VALUE_SOURCES.map((source) => [
      source,
      Array.from({ length: MAX_HORIZON_YEARS }, (_, i) =>
        i >= horizonYears ? 0 : stored ? Number(stored[source][i]) : worked![source][i],
      ),
    ]),
  ) as SourceValues;
}

/** The yearly factors of the block's shared rows, in doubles, for years 1..30. */
export function yearFactors(
  input: ParsedCase,
  capex: number,
): {
  escalation: number[];
  inflation: number[];
  discount: number[];
  depreciation: number[];
} {
  const f = input.finance;
  const years = Array.from({ length: MAX_HORIZON_YEARS }, (_, i) => i + 1);
  const within = (t: number) => t <= f.horizonYears;
  return {
    escalation: years.map((t) => (within(t) ? (1 + f.tariffEscalationPct / 100) ** (t - 1) : 0)),
    inflation: years.map((t) => (within(t) ? (1 + f.inflationPct / 100) ** (t - 1) : 0)),
    discount: years.map((t) => 1 / (1 + f.discountRatePct / 100) ** t),
    depreciation: years.map((t) =>
      within(t) && t <= f.depreciationYears ? capex / f.depreciationYears : 0,
    ),
  };
}

function workedSources(input: ParsedCase, result: CaseResult, scenario: ScenarioKey): SourceValues {
  const { finance } = input;
  const { totals } = result;
  const factors = yearFactors(input, Number(totals.capex));
  const kWh = scenarioKWh(input, result, scenario);
  const tariff = Number(finance.tariffPerKWh);
  const tax = finance.taxRatePct / 100;
  const values = Object.fromEntries(VALUE_SOURCES.map((s) => [s, [] as number[]])) as SourceValues;
  for (let i = 0; i < MAX_HORIZON_YEARS; i++) {
    const esc = factors.escalation[i];
    const infl = factors.inflation[i];
    const parts: Record<ValueSource, number> = {
      energy: kWh.energy * tariff * esc,
      cooling: kWh.cooling * tariff * esc,
      reliability: Number(totals.reliabilityPerYear) * infl,
      maintenance: Number(totals.maintenancePerYear) * infl,
      throughput: Number(totals.throughputPerYear) * infl,
      service: -Number(finance.annualServiceCost) * infl,
      tax: 0,
    };
    const beforeTax =
      parts.energy +
      parts.cooling +
      parts.reliability +
      parts.maintenance +
      parts.throughput +
      parts.service;
    parts.tax = esc === 0 ? 0 : -tax * (beforeTax - factors.depreciation[i]);
    for (const source of VALUE_SOURCES) values[source].push(parts[source]);
  }
  return values;
}

/** The engine's payback status, or (engine v1) the same rule applied to its flows. */
export function paybackStatusValue(scenario: Scenario): PaybackStatus {
  const stored = (scenario as Partial<Scenario>).paybackStatus;
  if (stored) return stored;
  if (scenario.paybackYears !== null) return "reached";
  return Number(scenario.cashFlows[scenario.cashFlows.length - 1]) > 0 ? "beyond-horizon" : "never";
}

/**
 * How much the physics scenario's NPV moves per unit of tariff and per unit of the step-loss
 * factor: the flows are affine in both (docs/model.md (The business case)), with the slopes
 * (1 − tax)·kWh·Σ esc_t/(1+r)^t and (1 − tax)·reliability·Σ infl_t/(1+r)^t.
 */
export function breakEvenSlopes(
  input: ParsedCase,
  result: CaseResult,
): { tariff: number; stepLoss: number } {
  const factors = yearFactors(input, Number(result.totals.capex));
  const keep = 1 - input.finance.taxRatePct / 100;
  const kWh = scenarioKWh(input, result, "physics");
  let escalated = 0;
  let inflated = 0;
  for (let i = 0; i < MAX_HORIZON_YEARS; i++) {
    escalated += factors.escalation[i] * factors.discount[i];
    inflated += factors.inflation[i] * factors.discount[i];
  }
  return {
    tariff: keep * (kWh.energy + kWh.cooling) * escalated,
    stepLoss: keep * Number(result.totals.reliabilityPerYear) * inflated,
  };
}

/** The engine's break-even values, or (engine v1) the same lines worked out in doubles. */
export function breakEvenValues(
  input: ParsedCase,
  result: CaseResult,
): { tariff: number | string; stepLossFactor: number | string } {
  const stored = (result as Partial<CaseResult>).breakEven;
  if (stored)
    return {
      tariff: stored.tariffPerKWh === null ? NO_BREAK_EVEN : Number(stored.tariffPerKWh),
      stepLossFactor: stored.stepLossFactor ?? NO_BREAK_EVEN,
    };
  const npv = Number(result.scenarios.physics.npv);
  const slopes = breakEvenSlopes(input, result);
  const tariff = Number(input.finance.tariffPerKWh) - npv / slopes.tariff;
  const factor = 1 - npv / slopes.stepLoss;
  return {
    tariff: slopes.tariff > 0 && tariff >= 0 ? tariff : NO_BREAK_EVEN,
    stepLossFactor: slopes.stepLoss > 0 && factor >= 0 ? factor : NO_BREAK_EVEN,
  };
}
