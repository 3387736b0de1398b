import Decimal from "decimal.js";
import type { CaseInput } from "@/lib/engine";
import type { WhatIfInput } from "@/lib/validations/what-if";

/** The most running hours a year can hold (a leap year), as lib/fields/bounds.ts allows. */
const MAX_HOURS_PER_YEAR = 8784;

const times = (money: Decimal.Value | undefined, f: number) =>
  money === undefined ? undefined : new Decimal(money).times(f).toFixed();

/**
 * A new CaseInput with the reviewer's figures; the proposal's frozen input is never changed
 * (everything touched is a fresh object), so the stored snapshot stays as it was sent.
 */
export function applyWhatIf(input: CaseInput, w: WhatIfInput): CaseInput {
  const finance = { ...input.finance };
  if (w.tariffPerKWh !== undefined) finance.tariffPerKWh = w.tariffPerKWh;
  if (w.tariffEscalationPct !== undefined) finance.tariffEscalationPct = w.tariffEscalationPct;
  if (w.discountRatePct !== undefined) finance.discountRatePct = w.discountRatePct;
  if (w.horizonYears !== undefined) finance.horizonYears = w.horizonYears;
  if (w.taxRatePct !== undefined) finance.taxRatePct = w.taxRatePct;

  const hours = w.runningHoursFactor ?? 1;
  const events = w.stepLossEventsFactor ?? 1;
  const cost = w.costPerEventFactor ?? 1;
  const output = w.extraOutputFactor ?? 1;

  const axes = input.axes.map((axis) => {
    const reliability = axis.reliability ? { ...axis.reliability } : undefined;
    if (reliability) {
      if (typeof reliability.stepLossEventsPerYear === "number")
        reliability.stepLossEventsPerYear *= events;
      reliability.costPerEvent = times(reliability.costPerEvent, cost);
      if (reliability.costPerEvent === undefined) delete reliability.costPerEvent;
      if (reliability.event) {
        // Every part of an event's cost is linear in these three, so scaling them scales the cost.
        const e = reliability.event;
        reliability.event = {
          ...e,
          downtimeMinutes: e.downtimeMinutes === undefined ? undefined : e.downtimeMinutes * cost,
          scrapParts: e.scrapParts === undefined ? undefined : e.scrapParts * cost,
          restartLaborHours:
            e.restartLaborHours === undefined ? undefined : e.restartLaborHours * cost,
        };
      }
    }
    const duty = { ...axis.duty };
    if (typeof duty.hoursPerYear === "number")
      duty.hoursPerYear = Math.min(MAX_HOURS_PER_YEAR, duty.hoursPerYear * hours);
    return { ...axis, duty, ...(reliability ? { reliability } : {}) };
  });

  const machines = input.machines.map((m) => ({
    ...m,
    ...(typeof m.throughputGainPct === "number"
      ? { throughputGainPct: m.throughputGainPct * output }
      : {}),
  }));

  return { ...input, finance, machines, axes };
}
