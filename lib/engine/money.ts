import Decimal from "decimal.js";

/**
 * The engine's own Decimal constructor, so that the app's other uses of decimal.js keep their
 * settings. docs/model.md asks for precision ≥ 30; 40 significant digits leave room for 30 years
 * of compounding without touching the cents. Half-even is the rounding of docs/contracts.md (Numbers and money) for display.
 */
export const Money = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_EVEN });
export type Money = Decimal;

export const ZERO = new Money(0);
export const ONE = new Money(1);
export const HUNDRED = new Money(100);

/**
 * Money in a CaseResult is the unrounded Decimal in plain notation (never exponent notation):
 * docs/contracts.md (Numbers and money) rounds only for display and export, and the workbook and reviewers recompute from these.
 * A negative zero prints as "0".
 */
export function moneyString(value: Decimal): string {
  return value.isZero() ? "0" : value.toFixed();
}

/** ISO 4217 minor units of the currencies that do not use two decimals. */
const MINOR_UNITS: Record<string, number> = {
  BIF: 0,
  CLP: 0,
  DJF: 0,
  GNF: 0,
  ISK: 0,
  JPY: 0,
  KMF: 0,
  KRW: 0,
  PYG: 0,
  RWF: 0,
  UGX: 0,
  UYI: 0,
  VND: 0,
  VUV: 0,
  XAF: 0,
  XOF: 0,
  XPF: 0,
  BHD: 3,
  IQD: 3,
  JOD: 3,
  KWD: 3,
  LYD: 3,
  OMR: 3,
  TND: 3,
  CLF: 4,
  UYW: 4,
};

export function currencyMinorUnits(currency: string): number {
  return MINOR_UNITS[currency.toUpperCase()] ?? 2;
}

/** Rounds for display and export: half-even to the currency's minor unit (docs/model.md). */
export function roundMoney(value: Decimal | string, currency: string): string {
  const places = currencyMinorUnits(currency);
  // abs() of a zero drops the sign that toFixed would print for a rounded-away negative ("-0.00").
  const rounded = new Money(value).toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN);
  return (rounded.isZero() ? rounded.abs() : rounded).toFixed(places);
}

/**
 * Decimal of a validated money string. Decimals are immutable, so equal amounts share one
 * instance: fleets repeat the same prices and costs on thousands of axes.
 */
const parsed = new Map<string, Decimal>();
const PARSED_LIMIT = 4096;

export function parseMoney(amount: string): Decimal {
  let value = parsed.get(amount);
  if (value === undefined) {
    value = new Money(amount);
    if (parsed.size >= PARSED_LIMIT) parsed.clear();
    parsed.set(amount, value);
  }
  return value;
}
