import type Decimal from "decimal.js";
import { discountedFlows, irr, npv, paybackYears, roiPct } from "./finance";
import { HUNDRED, Money, ONE, moneyString } from "./money";
import type { Scenario } from "./types";

/** The yearly inputs of one cash-flow series (ENGINE.md §8). */
export interface CashFlowInputs {
  capex: Decimal;
  /** kWh per year saved, drive energy plus cabinet cooling, fleet total. */
  energySavedKWh: number;
  tariffPerKWh: Decimal;
  tariffEscalationPct: number;
  /** Reliability + maintenance + throughput − annual service, per year. */
  recurringPerYear: Decimal;
  horizonYears: number;
}

/** CF_0 = −Capex; CF_t = energy·tariff·(1+esc)^(t−1) + recurring. */
export function cashFlows(inputs: CashFlowInputs): Decimal[] {
  const energyValue = new Money(inputs.energySavedKWh).times(inputs.tariffPerKWh);
  const escalation = ONE.plus(new Money(inputs.tariffEscalationPct).div(HUNDRED));
  const flows: Decimal[] = [inputs.capex.negated()];
  let factor = ONE;
  for (let t = 1; t <= inputs.horizonYears; t++) {
    flows.push(energyValue.times(factor).plus(inputs.recurringPerYear));
    factor = factor.times(escalation);
  }
  return flows;
}

export const rateOf = (pct: number): Decimal => new Money(pct).div(HUNDRED);

export function scenario(flows: Decimal[], capex: Decimal, discountRatePct: number): Scenario {
  const rate = rateOf(discountRatePct);
  return {
    cashFlows: flows.map(moneyString),
    npv: moneyString(npv(rate, flows)),
    irr: irr(flows),
    paybackYears: paybackYears(flows, capex),
    discountedPaybackYears: paybackYears(discountedFlows(rate, flows), capex),
    roiPct: roiPct(flows, capex),
  };
}
