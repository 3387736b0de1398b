import type { ParsedCase, Scenario } from "@/lib/engine";
import { MAX_HORIZON_YEARS } from "./layout";

/**
 * The values the Cash flow sheet's formulas evaluate to, stored beside them as cached results
 * so that a viewer that does not calculate still shows the engine's numbers. They are the
 * engine's flows in doubles; every other figure is recomputed by the spreadsheet.
 */

export const BEYOND_HORIZON = "beyond the horizon";
export const NO_SIGN_CHANGE = "no sign change";
export const NO_RATE_FOUND = "no rate found";
export const NOT_APPLICABLE = "n/a";

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
  const flows = scenario.cashFlows.map(Number);
  return flows.some((f) => f > 0) && flows.some((f) => f < 0) ? NO_RATE_FOUND : NO_SIGN_CHANGE;
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
