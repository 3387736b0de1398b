import type Decimal from "decimal.js";
import { discountedFlows, irr, npv, paybackYears, roiPct } from "./finance";
import { HUNDRED, Money, ONE, ZERO, moneyString } from "./money";
import { VALUE_SOURCES, type PaybackStatus, type Scenario, type ValueSource } from "./types";

/** The yearly inputs of one cash-flow series (docs/model.md (The business case)), all per year, fleet totals. */
export interface YearlyTerms {
  capex: Decimal;
  /** Drive energy saved (kWh/yr) that the scenario counts. */
  energyKWh: number;
  /** Cabinet cooling energy saved (kWh/yr) that the scenario counts. */
  coolingKWh: number;
  tariffPerKWh: Decimal;
  tariffEscalationPct: number;
  reliability: Decimal;
  maintenance: Decimal;
  throughput: Decimal;
  /** The annual service cost: a positive amount that the flows subtract. */
  service: Decimal;
  inflationPct: number;
  taxRatePct: number;
  depreciationYears: number;
  horizonYears: number;
}

export interface CashFlowSeries {
  /** CF_0 = −Capex, then CF_1..CF_N. */
  flows: Decimal[];
  /** Years 1..N by source; for each t the seven, added in VALUE_SOURCES order, are CF_t. */
  bySource: Record<ValueSource, Decimal[]>;
}

export const rateOf = (pct: number): Decimal => new Money(pct).div(HUNDRED);

/**
 * The flows of docs/model.md (The business case) and their value by source. Before tax, year t:
 * P_t = energy + cooling (each kWh·tariff·(1+esc)^(t−1)) + (reliability + maintenance +
 * throughput − service)·(1+infl)^(t−1). Tax: dep_t = Capex/depreciationYears while
 * t ≤ depreciationYears (nothing after the horizon is modelled), tax_t = −rate·(P_t − dep_t) —
 * negative P_t − dep_t gives a shield the rest of the business uses (common practice in project
 * appraisal) — and CF_t = P_t + tax_t.
 *
 * CF_t is built as the sum of its seven sources in VALUE_SOURCES order, so that those sources
 * add up to it exactly in Decimal, not merely to the cent: finance reconciles every flow.
 * With taxRatePct = 0 the tax source is 0 and CF_t = P_t, the pre-tax flow of engine v1.
 */
export function cashFlowSeries(terms: YearlyTerms): CashFlowSeries {
  const energyValue = new Money(terms.energyKWh).times(terms.tariffPerKWh);
  const coolingValue = new Money(terms.coolingKWh).times(terms.tariffPerKWh);
  const escalation = ONE.plus(rateOf(terms.tariffEscalationPct));
  const inflation = ONE.plus(rateOf(terms.inflationPct));
  const taxRate = rateOf(terms.taxRatePct);
  const taxed = !taxRate.isZero();
  const depreciation = terms.capex.div(terms.depreciationYears);
  const service = terms.service.negated();

  const bySource = Object.fromEntries(VALUE_SOURCES.map((s) => [s, [] as Decimal[]])) as Record<
    ValueSource,
    Decimal[]
  >;
  const flows: Decimal[] = [terms.capex.negated()];
  // Zero terms stay the shared ZERO: a product with it is exact but not free, and most cases
  // leave several terms at 0.
  const grow = (amount: Decimal, factor: Decimal) =>
    amount.isZero() ? ZERO : amount.times(factor);
  let esc = ONE;
  let infl = ONE;
  for (let t = 1; t <= terms.horizonYears; t++) {
    const parts: Record<ValueSource, Decimal> = {
      energy: grow(energyValue, esc),
      cooling: grow(coolingValue, esc),
      reliability: grow(terms.reliability, infl),
      maintenance: grow(terms.maintenance, infl),
      throughput: grow(terms.throughput, infl),
      service: grow(service, infl),
      tax: ZERO,
    };
    const beforeTax = parts.energy
      .plus(parts.cooling)
      .plus(parts.reliability)
      .plus(parts.maintenance)
      .plus(parts.throughput)
      .plus(parts.service);
    if (taxed) {
      const taxable = t <= terms.depreciationYears ? beforeTax.minus(depreciation) : beforeTax;
      parts.tax = taxable.times(taxRate).negated();
    }
    // beforeTax is the left-to-right sum of the first six, so this is the sum of all seven.
    flows.push(parts.tax.isZero() ? beforeTax : beforeTax.plus(parts.tax));
    for (const source of VALUE_SOURCES) bySource[source].push(parts[source]);
    esc = esc.times(escalation);
    infl = infl.times(inflation);
  }
  return { flows, bySource };
}

/**
 * "reached" when the simple payback falls within the horizon; otherwise "beyond-horizon" when
 * the last flow is still positive (it would pay back later), else "never" (docs/model.md (The business case)).
 */
export function paybackStatus(
  flows: readonly Decimal[],
  simplePaybackYears: number | null,
): PaybackStatus {
  if (simplePaybackYears !== null) return "reached";
  return flows.length > 1 && flows[flows.length - 1].greaterThan(0) ? "beyond-horizon" : "never";
}

export function scenario(
  series: CashFlowSeries,
  capex: Decimal,
  discountRatePct: number,
): Scenario {
  const { flows } = series;
  const rate = rateOf(discountRatePct);
  const payback = paybackYears(flows, capex);
  return {
    cashFlows: flows.map(moneyString),
    npv: moneyString(npv(rate, flows)),
    irr: irr(flows),
    paybackYears: payback,
    discountedPaybackYears: paybackYears(discountedFlows(rate, flows), capex),
    roiPct: roiPct(flows, capex),
    paybackStatus: paybackStatus(flows, payback),
    bySource: Object.fromEntries(
      VALUE_SOURCES.map((s) => [s, series.bySource[s].map(moneyString)]),
    ) as Record<ValueSource, string[]>,
  };
}
