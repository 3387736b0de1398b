import Decimal from "decimal.js";
import type { CaseInput, CaseResult } from "../engine";
import { roundMoney } from "../engine/money";
import { revenueColumns, vendorRevenue } from "./revenue";
import { OPEN_STAGES, type QuoteStage } from "./stages";

/**
 * What a quote copies from its frozen proposal once: value (the customer's investment, the
 * engine's up-front cost), currency, payback, top discount, and the vendor's revenue with its
 * parts (lib/pipeline/revenue.ts), which the pipeline then reads instead of the frozen input.
 */
export function quoteFigures(input: CaseInput, result: CaseResult) {
  return {
    value: result.totals.capex,
    currency: result.currency,
    paybackYears: result.scenarios.physics.paybackYears,
    maxDiscountPct: Math.max(0, ...input.axes.map((a) => a.retrofit.discountPct ?? 0)),
    ...revenueColumns(vendorRevenue(input)),
  };
}

/** An amount (the vendor's revenue) × the stage's probability, rounded half-even to the currency's minor unit. */
export function weightedValue(value: string, probabilityPct: number, currency: string): string {
  return roundMoney(new Decimal(value).times(probabilityPct).dividedBy(100).toFixed(), currency);
}

export type StageTotal = {
  stage: QuoteStage;
  currency: string;
  count: number;
  /** The customer's investment. */
  value: string;
  /** The vendor's revenue, which `weighted` weights. */
  revenue: string;
  weighted: string;
};

/**
 * Sums per stage and currency of the quotes given, in Decimal: the totals are exactly the sum
 * of the rows shown (amounts in different currencies are never added together). Per stage the
 * weighted sum is that stage's own rows; the headline weighted total uses openWeighted().
 */
export function stageTotals(
  quotes: {
    stage: QuoteStage;
    currency: string;
    value: string;
    vendorRevenue: string;
    weighted: string;
  }[],
  stages: readonly QuoteStage[],
): StageTotal[] {
  const currencies = [...new Set(quotes.map((q) => q.currency))].sort();
  return currencies.flatMap((currency) =>
    stages.map((stage) => {
      const rows = quotes.filter((q) => q.currency === currency && q.stage === stage);
      return {
        stage,
        currency,
        count: rows.length,
        value: sum(rows.map((r) => r.value)),
        revenue: sum(rows.map((r) => r.vendorRevenue)),
        weighted: sum(rows.map((r) => r.weighted)),
      };
    }),
  );
}

/**
 * The weighted value of the open quotes among those given: a decided or replaced quote is no
 * longer a chance of revenue, so it counts nothing here.
 */
export function openWeighted(quotes: { stage: QuoteStage; weighted: string }[]): string {
  return sum(quotes.filter((q) => OPEN_STAGES.includes(q.stage)).map((q) => q.weighted));
}

export function sum(values: string[]): string {
  return values.reduce((s, v) => s.plus(v), new Decimal(0)).toFixed();
}

/** Win rate of decided quotes: accepted over accepted plus declined, by count; null when none. */
export function winRate(decided: { stage: QuoteStage }[]) {
  const won = decided.filter((q) => q.stage === "accepted").length;
  const lost = decided.filter((q) => q.stage === "declined").length;
  return { won, lost, ratePct: won + lost === 0 ? null : (100 * won) / (won + lost) };
}
