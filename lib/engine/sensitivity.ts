import type Decimal from "decimal.js";
import { npv, paybackYears } from "./finance";
import { HUNDRED, Money, ONE, currencyMinorUnits, moneyString } from "./money";
import type { SensitivityDriver, SensitivityRow } from "./types";

/** The drivers of docs/model.md (The business case), in the order listed there (the tie-break of the sort). */
export const SENSITIVITY_DRIVERS: readonly SensitivityDriver[] = [
  "tariff",
  "hoursPerYear",
  "loadTorque",
  "kitPrice",
  "laborRate",
  "stepLossEvents",
  "discountRate",
  "throughputGain",
  "idleCurrent",
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
 * NPV and simple payback with each driver at (1 ∓ swing), sorted by the NPV swing
 * |NPV_high − NPV_low| rounded half-even to the currency's minor unit, largest first
 * (docs/model.md (The business case), engine v2). Array.prototype.sort is stable, so equal rounded swings keep
 * the listed order: tariff and hours, for one, move NPV by the same amount in exact arithmetic,
 * and float noise in the physics must not decide their order.
 */
export function sensitivity(
  swingPct: number,
  currency: string,
  at: ScenarioAtDriver,
): SensitivityRow[] {
  const places = currencyMinorUnits(currency);
  // Decimal factors, so that a swing of 7 % scales money by exactly 0.93 and 1.07.
  const swing = new Money(swingPct).div(HUNDRED);
  const rows = SENSITIVITY_DRIVERS.map((driver) => {
    const low = at(driver, ONE.minus(swing));
    const high = at(driver, ONE.plus(swing));
    const lowNpv = npv(low.rate, low.flows);
    const highNpv = npv(high.rate, high.flows);
    return {
      swing: highNpv.minus(lowNpv).abs().toDecimalPlaces(places, Money.ROUND_HALF_EVEN),
      row: {
        driver,
        low: { npv: moneyString(lowNpv), paybackYears: paybackYears(low.flows, low.capex) },
        high: { npv: moneyString(highNpv), paybackYears: paybackYears(high.flows, high.capex) },
      },
    };
  });
  return rows.sort((a, b) => b.swing.comparedTo(a.swing)).map((r) => r.row);
}
