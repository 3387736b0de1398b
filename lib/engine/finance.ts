import type Decimal from "decimal.js";
import { Money, ONE, ZERO } from "./money";

/** NPV = CF_0 + Σ CF_t/(1+r)^t, the first flow at t = 0 (numpy-financial convention). */
export function npv(rate: Decimal, flows: readonly Decimal[]): Decimal {
  const growth = ONE.plus(rate);
  let factor = ONE;
  let total = ZERO;
  for (const flow of flows) {
    total = total.plus(flow.div(factor));
    factor = factor.times(growth);
  }
  return total;
}

/** Flows discounted to t = 0, one by one. */
export function discountedFlows(rate: Decimal, flows: readonly Decimal[]): Decimal[] {
  const growth = ONE.plus(rate);
  let factor = ONE;
  return flows.map((flow) => {
    const present = flow.div(factor);
    factor = factor.times(growth);
    return present;
  });
}

/** NPV in doubles, for root finding: the IRR is a rate, not money. */
function npvNumber(rate: number, flows: readonly number[]): number {
  const growth = 1 + rate;
  let total = 0;
  for (let t = flows.length - 1; t >= 0; t--) total = total / growth + flows[t];
  return total;
}

const IRR_LOW = -0.99;
/** The highest rate the IRR is sought at: 10 = 1,000 % (ENGINE.md §8). */
export const IRR_HIGHEST_RATE = 10;
const IRR_HIGH = IRR_HIGHEST_RATE;
const IRR_SCAN_STEPS = 2000;
const IRR_TOLERANCE = 1e-13;

/**
 * IRR: a root of NPV(r) on (−0.99, 10) (ENGINE.md §8). The interval is scanned for sign changes,
 * each bracket refined by bisection far below the 1e-9 the spec asks for; of several roots, the
 * one closest to 0 is returned, as numpy-financial's irr does. null when the flows do not change
 * sign or NPV has no root in the interval.
 */
export function irr(flows: readonly Decimal[]): number | null {
  const values = flows.map((f) => f.toNumber());
  if (!values.some((v) => v > 0) || !values.some((v) => v < 0)) return null;

  let best: number | null = null;
  const consider = (root: number) => {
    if (best === null || Math.abs(root) < Math.abs(best)) best = root;
  };
  // The scan is uniform in log(1 + r): roots crowd towards −1, where NPV changes fastest.
  const logLow = Math.log1p(IRR_LOW);
  const logStep = (Math.log1p(IRR_HIGH) - logLow) / IRR_SCAN_STEPS;
  let prevRate = IRR_LOW;
  let prevValue = npvNumber(prevRate, values);
  for (let i = 1; i <= IRR_SCAN_STEPS; i++) {
    const rate = i === IRR_SCAN_STEPS ? IRR_HIGH : Math.expm1(logLow + i * logStep);
    const value = npvNumber(rate, values);
    if (value === 0 && rate < IRR_HIGH) consider(rate);
    else if (prevValue !== 0 && Math.sign(value) === -Math.sign(prevValue))
      consider(bisect(values, prevRate, rate, prevValue));
    prevRate = rate;
    prevValue = value;
  }
  return best;
}

function bisect(values: readonly number[], lo: number, hi: number, valueAtLo: number): number {
  let fLo = valueAtLo;
  while (hi - lo > IRR_TOLERANCE) {
    const mid = (lo + hi) / 2;
    if (mid === lo || mid === hi) break;
    const fMid = npvNumber(mid, values);
    if (fMid === 0) return mid;
    if (Math.sign(fMid) === Math.sign(fLo)) {
      lo = mid;
      fLo = fMid;
    } else {
      hi = mid;
    }
  }
  return (lo + hi) / 2;
}

/**
 * Payback in years (ENGINE.md §8): 0 without capex; else the first t ≥ 1 whose cumulative flow
 * reaches 0, interpolated within that year; null when not reached within the flows given.
 */
export function paybackYears(flows: readonly Decimal[], capex: Decimal): number | null {
  if (capex.isZero()) return 0;
  let cumulative = flows[0];
  for (let t = 1; t < flows.length; t++) {
    const next = cumulative.plus(flows[t]);
    if (next.greaterThanOrEqualTo(0)) {
      return new Money(t - 1).plus(cumulative.negated().div(flows[t])).toNumber();
    }
    cumulative = next;
  }
  return null;
}

/** ROI % = 100·(Σ_(t≥1) CF_t + CF_0)/Capex, null without capex. */
export function roiPct(flows: readonly Decimal[], capex: Decimal): number | null {
  if (capex.isZero()) return null;
  return flows
    .reduce((sum, f) => sum.plus(f), ZERO)
    .times(100)
    .div(capex)
    .toNumber();
}
