import type Decimal from "decimal.js";
import { Money, ZERO, moneyString } from "@/lib/engine/money";

export interface MonthRow {
  /** 0 is the investment; months 1..12·horizon follow. */
  month: number;
  /** The year t of docs/model.md (The business case) the month belongs to (0 for the investment). */
  year: number;
  flow: string;
  cumulative: string;
}

export interface MonthlyCashFlow {
  rows: MonthRow[];
  /** First month whose cumulative cash reaches 0; null when the horizon ends first. */
  paybackMonth: number | null;
}

const TWELVE = new Money(12);

/**
 * The physics scenario month by month. Each year's flow CF_t is spread evenly over its twelve
 * months: the energy saved, the reliability, maintenance and throughput terms and the service
 * cost accrue as the machines run, and the tariff escalation of docs/model.md (The business case) steps once a year, so within
 * a year every month is CF_t/12. The months of a year add up to CF_t (to the 40 digits of the
 * engine's Decimal), the NPV stays the engine's
 * (yearly flows, year-end discounting), and the month the cumulative cash turns non-negative is
 * the month in which the engine's simple payback — interpolated within the year on exactly this
 * even-spread assumption — falls.
 */
export function monthlyCashFlow(yearlyFlows: readonly string[]): MonthlyCashFlow {
  const flows = yearlyFlows.map((f) => new Money(f));
  let cumulative: Decimal = flows[0] ?? ZERO;
  const rows: MonthRow[] = [
    { month: 0, year: 0, flow: moneyString(cumulative), cumulative: moneyString(cumulative) },
  ];
  let paybackMonth: number | null = cumulative.gte(0) ? 0 : null;
  for (let t = 1; t < flows.length; t++) {
    const monthly = flows[t].div(TWELVE);
    for (let m = 1; m <= 12; m++) {
      const month = (t - 1) * 12 + m;
      cumulative = cumulative.plus(monthly);
      rows.push({
        month,
        year: t,
        flow: moneyString(monthly),
        cumulative: moneyString(cumulative),
      });
      if (paybackMonth === null && cumulative.gte(0)) paybackMonth = month;
    }
  }
  return { rows, paybackMonth };
}
