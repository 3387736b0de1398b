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
/** The highest rate the IRR is sought at: 10 = 1,000 % (docs/model.md (The business case)). */
export const IRR_HIGHEST_RATE = 10;
const IRR_HIGH = IRR_HIGHEST_RATE;
const IRR_TOLERANCE = 1e-12;

/**
 * IRR as docs/model.md (The business case) (engine v2) defines it, so that any other implementation lands on the
 * same rate: no rate unless the first flow is negative, a later one positive and NPV changes sign
 * between −0.99 and 10; then halve that bracket, always keeping the half over which NPV changes
 * sign, until it is 1e-12 wide; the answer is its midpoint (a midpoint where NPV is exactly 0 ends the search).
 * With several roots this picks one deterministically. Engine v1 scanned the interval and took
 * the root closest to 0; for flows with one sign change (one root) both give the same rate.
 */
export function irr(flows: readonly Decimal[]): number | null {
  const values = flows.map((f) => f.toNumber());
  if (!(values[0] < 0) || !values.slice(1).some((v) => v > 0)) return null;
  let lo = IRR_LOW;
  let hi = IRR_HIGH;
  let fLo = npvNumber(lo, values);
  const fHi = npvNumber(hi, values);
  if (!(fLo * fHi < 0)) return null;
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
 * Payback in years (docs/model.md (The business case)): 0 without capex; else the first t ≥ 1 whose cumulative flow
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
