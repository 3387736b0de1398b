import Decimal from "decimal.js";
import { currencyMinorUnits } from "@/lib/engine/money";

/**
 * A price in the currency's minor unit, as the provider's API takes it (ISO 4217 minor units).
 * The amount is a validated decimal with no more places than the currency has, so the result
 * is an exact integer.
 */
export function minorUnits(amount: string, currency: string): number {
  const minor = new Decimal(amount).times(new Decimal(10).pow(currencyMinorUnits(currency)));
  if (!minor.isInteger())
    throw new Error(`${amount} ${currency} has more places than the currency`);
  return minor.toNumber();
}
