import fc from "fast-check";
import { irr as referenceIrr, npv as referenceNpv } from "financial";
import { describe, expect, it } from "vitest";
import { discountedFlows, irr, npv, paybackYears, roiPct } from "@/lib/engine/finance";
import { Money } from "@/lib/engine/money";

const toMoney = (values: number[]) => values.map((v) => new Money(v));

/** A conventional project: an outlay first, then returns with at least one positive year. */
const conventionalFlows = fc
  .tuple(
    fc.integer({ min: 1_000, max: 1_000_000 }),
    fc.array(fc.integer({ min: 0, max: 500_000 }), { minLength: 1, maxLength: 30 }),
  )
  .filter(([, returns]) => returns.some((r) => r > 0))
  .map(([outlay, returns]) => [-outlay, ...returns]);

describe("npm package financial (a port of numpy-financial) as an independent reference", () => {
  it("NPV agrees on random flows and rates", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -1_000_000, max: 1_000_000 }), { minLength: 1, maxLength: 31 }),
        fc.double({ min: -0.5, max: 2, noNaN: true }),
        (values, rate) => {
          const ours = npv(new Money(rate), toMoney(values)).toNumber();
          const theirs = referenceNpv(rate, values);
          expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(
            1e-9 * Math.max(1, ...values.map(Math.abs)),
          );
        },
      ),
    );
  });

  it("IRR agrees wherever the reference converges (its tolerance is 1e-6)", () => {
    let compared = 0;
    fc.assert(
      fc.property(conventionalFlows, (values) => {
        const theirs = referenceIrr(values);
        const ours = irr(toMoney(values));
        // One sign change: exactly one root on (−1, ∞), so both must find the same one.
        if (Number.isNaN(theirs) || theirs <= -0.99 || theirs >= 10) return;
        compared++;
        expect(ours).not.toBeNull();
        expect(Math.abs((ours as number) - theirs)).toBeLessThanOrEqual(
          1e-5 * Math.max(1, Math.abs(theirs)),
        );
      }),
      { numRuns: 300 },
    );
    expect(compared).toBeGreaterThan(100);
  });

  it("our IRR is a root of NPV to 1e-9 in the rate", () => {
    fc.assert(
      fc.property(conventionalFlows, (values) => {
        const rate = irr(toMoney(values));
        if (rate === null) return;
        const f = (r: number) => referenceNpv(r, values);
        expect(Math.sign(f(rate - 1e-9)) * Math.sign(f(rate + 1e-9))).toBeLessThanOrEqual(0);
      }),
    );
  });

  it("without a sign change both give no IRR (the reference returns NaN, ours null)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 1000 }), { minLength: 2, maxLength: 10 }),
        (values) => {
          expect(Number.isNaN(referenceIrr(values))).toBe(true);
          expect(irr(toMoney(values))).toBeNull();
          expect(irr(toMoney(values.map((v) => -v)))).toBeNull();
        },
      ),
    );
  });
});

describe("payback and ROI (docs/model.md (The business case))", () => {
  it("interpolates within the year the cumulative flow turns non-negative", () => {
    // cumulative −100, −60, −10, +40 → (3 − 1) + 10/50 = 2.2 years
    expect(paybackYears(toMoney([-100, 40, 50, 50]), new Money(100))).toBeCloseTo(2.2, 12);
  });
  it("is null when not reached within the horizon, 0 without capex", () => {
    expect(paybackYears(toMoney([-100, 10, 10]), new Money(100))).toBeNull();
    expect(paybackYears(toMoney([0, 10, 10]), new Money(0))).toBe(0);
  });
  it("discounted payback uses the discounted flows", () => {
    const flows = toMoney([-100, 60, 60]);
    const discounted = discountedFlows(new Money("0.1"), flows);
    // 60/1.1 = 54.5454…, 60/1.21 = 49.5867…: 1 + (100 − 54.5454)/49.5867 = 1.9166…
    expect(paybackYears(discounted, new Money(100))).toBeCloseTo(
      1 + (100 - 60 / 1.1) / (60 / 1.21),
      12,
    );
  });
  it("ROI is the sum of all flows over capex, null without capex", () => {
    expect(roiPct(toMoney([-100, 60, 60]), new Money(100))).toBeCloseTo(20, 12);
    expect(roiPct(toMoney([0, 60]), new Money(0))).toBeNull();
  });
  it("IRR of flows whose NPV has no root in (−0.99, 10) is null", () => {
    // NPV(r) = −1 + 100/(1+r) > 0 up to r = 99, beyond the interval
    expect(irr(toMoney([-1, 100]))).toBeNull();
  });
});
