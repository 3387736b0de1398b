import type Decimal from "decimal.js";
import { npv, paybackYears } from "./finance";
import { HUNDRED, Money, ONE, moneyString } from "./money";
import type { SensitivityDriver, SensitivityRow } from "./types";

/** The drivers of ENGINE.md §8, in the order listed there (the tie-break of the sort). */
export const SENSITIVITY_DRIVERS: readonly SensitivityDriver[] = [
  "tariff",
  "hoursPerYear",
  "loadTorque",
  "kitPrice",
  "laborRate",
  "stepLossEvents",
  "discountRate",
];

export interface PhysicsScenarioOutcome {
  flows: Decimal[];
  capex: Decimal;
  rate: Decimal;
}

/** Evaluates the physics scenario with one driver multiplied by `factor`. */
export type ScenarioAtDriver = (
  driver: SensitivityDriver,
  factor: Decimal,
) => PhysicsScenarioOutcome;

/**
 * NPV and simple payback with each driver at (1 ∓ swing), sorted by |NPV_high − NPV_low|,
 * largest first; Array.prototype.sort is stable, so ties keep the listed order. Swings within a
 * relative 1e-9 count as ties: tariff and hours, for one, move NPV by the same amount in exact
 * arithmetic, and float noise in the physics must not decide their order.
 */
export function sensitivity(swingPct: number, at: ScenarioAtDriver): SensitivityRow[] {
  const rows = SENSITIVITY_DRIVERS.map((driver) => {
    // Decimal factors, so that a swing of 7 % scales money by exactly 0.93 and 1.07.
    const swing = new Money(swingPct).div(HUNDRED);
    const low = at(driver, ONE.minus(swing));
    const high = at(driver, ONE.plus(swing));
    const lowNpv = npv(low.rate, low.flows);
    const highNpv = npv(high.rate, high.flows);
    return {
      swing: highNpv.minus(lowNpv).abs(),
      row: {
        driver,
        low: { npv: moneyString(lowNpv), paybackYears: paybackYears(low.flows, low.capex) },
        high: { npv: moneyString(highNpv), paybackYears: paybackYears(high.flows, high.capex) },
      },
    };
  });
  return rows.sort((a, b) => compareSwings(b.swing, a.swing)).map((r) => r.row);
}

const TIE_TOLERANCE = new Money("1e-9");

function compareSwings(a: Decimal, b: Decimal): number {
  const scale = Money.max(a.abs(), b.abs(), 1);
  return a.minus(b).abs().lte(scale.times(TIE_TOLERANCE)) ? 0 : a.comparedTo(b);
}
