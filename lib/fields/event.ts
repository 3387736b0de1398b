import type { FieldSpec } from "./types";

/**
 * docs/model.md (The business case): the cost of one step-loss event built up from what it
 * causes (the engine's reliability.event), priced with the case's downtime cost and labour rate.
 */
export const EVENT_FIELDS = {
  downtimeMinutes: {
    label: "Downtime per step-loss event",
    help: "Minutes the machine stands after one step-loss event; priced at the case's downtime cost per hour.",
    kind: "number",
    unit: "min",
    range: "downtimeMinutes",
    default: 0,
  },
  scrapParts: {
    label: "Scrap parts per step-loss event",
    help: "Parts scrapped by one step-loss event.",
    kind: "number",
    unit: null,
    range: "scrapParts",
    default: 0,
  },
  scrapCostPerPart: {
    label: "Cost per scrap part",
    help: "Cost of one scrapped part in the site's currency.",
    kind: "money",
    unit: null,
    default: "0",
  },
  restartLaborHours: {
    label: "Restart labour per step-loss event",
    help: "Hours of work to restart after one step-loss event; priced at the case's labour rate.",
    kind: "number",
    unit: "h",
    range: "restartLaborHours",
    default: 0,
  },
} as const satisfies Record<string, FieldSpec>;

export type EventFieldKey = keyof typeof EVENT_FIELDS;
