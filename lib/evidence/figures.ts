import type { StoredStepLossEvent } from "../engine/stored";
import { EVIDENCE_FIELDS } from "./subjects";

/** One typed figure as the evidence panel lists it (components/evidence/evidence-panel.tsx). */
export interface EvidenceFigureView {
  field: string;
  label: string;
  value: string;
}

const view = (fields: Record<string, string>, field: string, value: string) => ({
  field,
  label: fields[field],
  value,
});

/**
 * An axis's typed value figures: its events, the share avoided and the cost of one event —
 * one figure, or downtime, scrap and restart labour when the cost is built up.
 */
export function axisEvidenceFigures(
  axis: {
    stepLossEventsPerYear: number;
    avoidedPct: number;
    costPerEvent: string;
    event: StoredStepLossEvent | null;
  },
  currency: string,
): EvidenceFigureView[] {
  const f = EVIDENCE_FIELDS.axis;
  const figures = [
    view(f, "stepLossEventsPerYear", `${axis.stepLossEventsPerYear} a year`),
    view(f, "avoidedPct", `${axis.avoidedPct} %`),
  ];
  if (!axis.event) return [...figures, view(f, "costPerEvent", `${axis.costPerEvent} ${currency}`)];
  const e = axis.event;
  return [
    ...figures,
    view(f, "downtimeMinutes", `${e.downtimeMinutes} min`),
    view(f, "scrapParts", `${e.scrapParts}`),
    view(f, "scrapCostPerPart", `${e.scrapCostPerPart} ${currency}`),
    view(f, "restartLaborHours", `${e.restartLaborHours} h`),
  ];
}

export function machineEvidenceFigures(
  machine: { throughputGainPct: number; marginPerOutputHour: string },
  currency: string,
): EvidenceFigureView[] {
  const f = EVIDENCE_FIELDS.machine;
  return [
    view(f, "throughputGainPct", `${machine.throughputGainPct} %`),
    view(f, "marginPerOutputHour", `${machine.marginPerOutputHour} ${currency}`),
  ];
}

/** A case's typed figures: the rates that price an event, the maintenance saving, the service cost. */
export function caseEvidenceFigures(
  finance: { downtimeCostPerHour: string; laborRatePerHour: string; annualServiceCost: string },
  maintenanceSavingPerYear: string,
  currency: string,
): EvidenceFigureView[] {
  const f = EVIDENCE_FIELDS.case;
  return [
    view(f, "downtimeCostPerHour", `${finance.downtimeCostPerHour} ${currency}/h`),
    view(f, "laborRatePerHour", `${finance.laborRatePerHour} ${currency}/h`),
    view(
      f,
      "maintenanceSavingPerYear",
      `${maintenanceSavingPerYear} ${currency} a year over the case's axes`,
    ),
    view(f, "annualServiceCost", `${finance.annualServiceCost} ${currency} a year`),
  ];
}
