import { IRR_HIGHEST_RATE, npv } from "@/lib/engine/finance";
import { Money, roundMoney } from "@/lib/engine/money";

/**
 * Display formatting for the results view. Money arrives as decimal strings (docs/model.md) and is
 * rounded half-even to the currency's minor unit before Intl sees it, so the screen shows the
 * same cents as the workbook.
 */

const LOCALE = "en-GB";

const moneyFormats = new Map<string, Intl.NumberFormat>();
function moneyFormat(currency: string, compact: boolean): Intl.NumberFormat {
  const key = `${currency}:${compact}`;
  let format = moneyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(LOCALE, {
      style: "currency",
      currency,
      ...(compact ? { notation: "compact", maximumFractionDigits: 1 } : {}),
    });
    moneyFormats.set(key, format);
  }
  return format;
}

// Intl formats a numeric string without passing it through a double (ES2023 Intl.NumberFormat);
// older engines convert it to a number, which is harmless after rounding to the minor unit.
const formatNumeric = (format: Intl.NumberFormat, value: string) =>
  (format.format as unknown as (value: string) => string)(value);

/** "€5,649.10" — rounded to the currency's minor unit. */
export function formatMoney(amount: string, currency: string): string {
  return formatNumeric(moneyFormat(currency, false), roundMoney(amount, currency));
}

/**
 * A headline amount to the nearest hundred ("€59,600"): a forecast's cents are noise on a card.
 * Tables and the workbook keep full precision (formatMoney).
 */
export function formatMoneyHeadline(amount: string, currency: string): string {
  const hundreds = new Money(amount).dividedBy(100).toDecimalPlaces(0, Money.ROUND_HALF_EVEN).times(100);
  return new Intl.NumberFormat(LOCALE, { style: "currency", currency, maximumFractionDigits: 0 })
    .format(hundreds.toNumber())
    .replace(/^-/, "\u2212");
}

/** "€59.6K" — for chart ticks, where full cents would crowd the axis. */
export function formatMoneyCompact(amount: string | number, currency: string): string {
  const value = typeof amount === "number" ? String(amount) : roundMoney(amount, currency);
  return formatNumeric(moneyFormat(currency, true), value);
}

/** A signed amount: "+€1,200.00" / "−€300.00", for changes against a reference. */
export function formatMoneyChange(amount: string, currency: string): string {
  const rounded = roundMoney(amount, currency);
  if (/^0(\.0*)?$/.test(rounded)) return formatMoney(rounded, currency);
  const negative = rounded.startsWith("-");
  const magnitude = formatMoney(negative ? rounded.slice(1) : rounded, currency);
  return `${negative ? "\u2212" : "+"}${magnitude}`;
}

/**
 * A money string as a chart coordinate. Charts place pixels, so a double is enough here; the
 * figures a reader can copy come from formatMoney.
 */
export function moneyToChartNumber(amount: string, currency: string): number {
  return Number(roundMoney(amount, currency));
}

export function formatNumber(value: number, fractionDigits = 0): string {
  return new Intl.NumberFormat(LOCALE, {
    minimumFractionDigits: fractionDigits,
    maximumFractionDigits: fractionDigits,
  }).format(value);
}

/** "1,234 kWh/yr" */
export function formatKWh(value: number): string {
  return `${formatNumber(value, Math.abs(value) < 10 ? 1 : 0)} kWh/yr`;
}

/** Percentages that are already in percent ("32.7 %"); null reads as a dash with its reason elsewhere. */
export function formatPct(value: number | null, fractionDigits = 1): string {
  return value === null ? "—" : `${formatNumber(value, fractionDigits)} %`;
}

/** The IRR's words when there is no rate to show; the workbook's IRR cell says the same (lib/workbook/cash-flow-sheet.ts). */
export const IRR_ABOVE_SEARCH_WORDS = "over 1,000 %";
export const IRR_NO_RATE_WORDS = "no rate of return";

/**
 * The engine's IRR is a rate (0.12 = 12 %), sought between −99 % and 1,000 % (docs/model.md (The business case)). A
 * null there can mean a return beyond 1,000 %: an outlay repaid within weeks still has NPV > 0
 * at that rate, which reads very differently from flows that never repay. The workbook applies
 * the same rule with its own IRR() and NPV(), so the two never disagree in words.
 */
export function formatIrr(scenario: { irr: number | null; cashFlows: readonly string[] }): string {
  if (scenario.irr !== null) return formatPct(scenario.irr * 100, 1);
  return irrWithoutRate(scenario.cashFlows);
}

/** Why there is no IRR: a return above the search's ceiling, or none at all. */
export function irrWithoutRate(cashFlows: readonly string[]): string {
  const flows = cashFlows.map((f) => new Money(f));
  const outlayFirst = flows.length > 1 && flows[0].isNegative() && !flows[0].isZero();
  if (outlayFirst && npv(new Money(IRR_HIGHEST_RATE), flows).greaterThan(0)) return IRR_ABOVE_SEARCH_WORDS;
  return IRR_NO_RATE_WORDS;
}

/**
 * Payback in whole years and months, the one form used on every page: "7 months",
 * "1 year 4 months", "3 years". Null without a known reason reads as "not within the horizon";
 * lib/results/engine-v2.ts says "after the horizon" or "never" when the engine knows which.
 */
export function formatPayback(years: number | null, horizonYears?: number): string {
  if (years === null) {
    return horizonYears ? `not within ${horizonYears} years` : "not within the horizon";
  }
  if (years === 0) return "immediate";
  const months = Math.round(years * 12);
  if (months < 1) return "under 1 month";
  const plural = (n: number, unit: string) => `${n} ${unit}${n === 1 ? "" : "s"}`;
  if (months < 12) return plural(months, "month");
  const whole = Math.floor(months / 12);
  const rest = months % 12;
  return rest === 0 ? plural(whole, "year") : `${plural(whole, "year")} ${plural(rest, "month")}`;
}

export function formatTempC(value: number | null): string {
  return value === null ? "no steady state" : `${formatNumber(value, 0)} °C`;
}

export function formatTonnes(value: number): string {
  return `${formatNumber(value, value < 10 ? 2 : 1)} t CO₂/yr`;
}
