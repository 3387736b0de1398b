import type Decimal from "decimal.js";
import { VALUE_SOURCES, type Scenario, type ValueSource } from "@/lib/engine";
import { Money } from "@/lib/engine/money";

export interface SourceTotal {
  source: ValueSource;
  /** Years 1..N added as they stand. */
  sum: Decimal;
  /** Years 1..N each divided by (1 + rate)^t, as the engine's net present value does (lib/engine/finance.ts). */
  discounted: Decimal;
}

/**
 * Each value source over the horizon, plain and discounted at the case's rate. The discounted
 * parts add up to the net present value plus the up-front cost, since the engine builds each
 * year's flow as the sum of its sources (lib/engine/scenarios.ts).
 */
export function sourceTotals(
  scenario: Pick<Scenario, "bySource">,
  discountRatePct: number,
): SourceTotal[] {
  const growth = new Money(discountRatePct).div(100).plus(1);
  return VALUE_SOURCES.map((source) => {
    let sum: Decimal = new Money(0);
    let discounted: Decimal = new Money(0);
    let factor: Decimal = new Money(1);
    for (const year of scenario.bySource?.[source] ?? []) {
      factor = factor.times(growth);
      sum = sum.plus(year);
      discounted = discounted.plus(new Money(year).div(factor));
    }
    return { source, sum, discounted };
  });
}
