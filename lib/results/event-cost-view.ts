import { eventCost } from "../engine/fleet";
import { Money, parseMoney } from "../engine/money";
import type { ParsedAxis } from "../engine/schema";
import { formatMoney } from "./format";

/** A case's rates that price a step-loss event built up from what it causes. */
export interface EventPricing {
  caseName: string;
  currency: string;
  downtimeCostPerHour: string;
  laborRatePerHour: string;
}

/** What one event causes, as the axis form holds it (numbers may still be unparsed). */
export interface EventParts {
  downtimeMinutes: unknown;
  scrapParts: unknown;
  scrapCostPerPart: unknown;
  restartLaborHours: unknown;
}

const nonNegative = (v: unknown): number | null => {
  const n = typeof v === "number" ? v : typeof v === "string" && v.trim() !== "" ? Number(v) : 0;
  return Number.isFinite(n) && n >= 0 ? n : null;
};

const moneyText = (v: unknown): string | null => {
  const text = typeof v === "string" ? v.trim() || "0" : typeof v === "number" ? String(v) : "0";
  return /^\d+(\.\d+)?$/.test(text) ? text : null;
};

/**
 * The cost of one step-loss event built from downtime, scrap and restart labour, priced with one
 * case's rates by the engine's own eventCost (lib/engine/fleet.ts), in words: "€362.50 per event:
 * downtime 30 min at €600.00/h €300.00, scrap 2 × €5.00 €10.00, restart 0.5 h at €45.00/h €22.50".
 * Null while a box holds something that is not a number yet.
 */
export function eventCostSentence(parts: EventParts, pricing: EventPricing): string | null {
  const minutes = nonNegative(parts.downtimeMinutes);
  const scrap = nonNegative(parts.scrapParts);
  const hours = nonNegative(parts.restartLaborHours);
  const perPart = moneyText(parts.scrapCostPerPart);
  if (minutes === null || scrap === null || hours === null || perPart === null) return null;
  const downtimeRate = parseMoney(pricing.downtimeCostPerHour);
  const laborRate = parseMoney(pricing.laborRatePerHour);
  // eventCost reads the event alone; the axis's counts do not enter the cost of one event.
  const reliability = {
    event: {
      downtimeMinutes: minutes,
      scrapParts: scrap,
      scrapCostPerPart: perPart,
      restartLaborHours: hours,
    },
  } as ParsedAxis["reliability"];
  const { total } = eventCost(reliability, laborRate, downtimeRate);
  const m = (d: { toFixed(): string } | string) =>
    formatMoney(typeof d === "string" ? d : d.toFixed(), pricing.currency);
  const downtime = new Money(minutes).div(60).times(downtimeRate);
  const scrapCost = new Money(scrap).times(perPart);
  const labor = new Money(hours).times(laborRate);
  return (
    `${m(total)} per event: downtime ${minutes} min at ${m(pricing.downtimeCostPerHour)}/h ${m(downtime)}, ` +
    `scrap ${scrap} × ${m(perPart)} ${m(scrapCost)}, ` +
    `restart ${hours} h at ${m(pricing.laborRatePerHour)}/h ${m(labor)}`
  );
}
