import type { PreparedCase } from "@/lib/engine";
import { Money, moneyString } from "@/lib/engine/money";

/** Steps of the two-way table, in % of the case's own tariff and hours. */
export const GRID_STEPS_PCT = [-30, -20, -10, 0, 10, 20, 30] as const;

export interface PaybackGrid {
  tariffPct: number[];
  hoursPct: number[];
  /** The tariff of each row, per kWh. */
  tariffs: string[];
  /** Simple payback in years; rows by tariff, columns by hours; null beyond the horizon. */
  paybackYears: (number | null)[][];
}

/** Simple payback of the physics scenario over tariff × hours per year (every axis's hours alike). */
export function paybackGrid(prepared: PreparedCase): PaybackGrid {
  const factor = (pct: number) => new Money(pct).div(100).plus(1);
  return {
    tariffPct: [...GRID_STEPS_PCT],
    hoursPct: [...GRID_STEPS_PCT],
    tariffs: GRID_STEPS_PCT.map((t) => moneyString(prepared.tariff.times(factor(t)))),
    paybackYears: GRID_STEPS_PCT.map((t) =>
      GRID_STEPS_PCT.map(
        (h) => prepared.at({ tariff: factor(t), hoursPerYear: factor(h) }).paybackYears,
      ),
    ),
  };
}
