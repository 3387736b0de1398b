import { AXIS_FIELDS, EVENT_FIELDS } from "../fields";
import { parseId } from "../validations/ids";

/**
 * What a typed value figure belongs to: an axis (its step-loss events and their cost), a machine
 * (its extra output) or a case (the rates that price an event, the maintenance saving and the
 * service cost). The schema stores these words (db/schema/evidence.ts).
 */
export const EVIDENCE_SUBJECTS = ["axis", "machine", "case"] as const;
export type EvidenceSubject = (typeof EVIDENCE_SUBJECTS)[number];

/**
 * The typed figures of each subject the value of a case rests on, with the one name every screen
 * prints. Axis labels are the field registry's (lib/fields); machine and case labels are the
 * forms' own words (components/installed-base/machine-form.tsx, components/cases/assumptions-form.tsx).
 */
export const EVIDENCE_FIELDS = {
  axis: {
    stepLossEventsPerYear: AXIS_FIELDS.stepLossEventsPerYear.label,
    avoidedPct: AXIS_FIELDS.avoidedPct.label,
    costPerEvent: AXIS_FIELDS.costPerEvent.label,
    downtimeMinutes: EVENT_FIELDS.downtimeMinutes.label,
    scrapParts: EVENT_FIELDS.scrapParts.label,
    scrapCostPerPart: EVENT_FIELDS.scrapCostPerPart.label,
    restartLaborHours: EVENT_FIELDS.restartLaborHours.label,
  },
  machine: {
    throughputGainPct: "Throughput gain the customer will use",
    marginPerOutputHour: "Margin per output hour",
  },
  case: {
    downtimeCostPerHour: "Downtime cost",
    laborRatePerHour: "Labour rate",
    maintenanceSavingPerYear: "Maintenance saving a year",
    annualServiceCost: "Annual service cost",
  },
} as const satisfies Record<EvidenceSubject, Record<string, string>>;

export type EvidenceField<S extends EvidenceSubject = EvidenceSubject> =
  keyof (typeof EVIDENCE_FIELDS)[S] & string;

export function isEvidenceField(subject: EvidenceSubject, field: string): boolean {
  return Object.hasOwn(EVIDENCE_FIELDS[subject], field);
}

export function evidenceFieldLabel(subject: EvidenceSubject, field: string): string {
  return (EVIDENCE_FIELDS[subject] as Record<string, string>)[field] ?? field;
}

/** The key one figure of one subject is found under in an EvidenceIndex. */
export const evidenceKey = (subject: EvidenceSubject, subjectId: number | string, field: string) =>
  `${subject}:${subjectId}:${field}`;

/** Where one figure comes from, as the screens show it. */
export interface EvidenceEntry {
  subjectType: EvidenceSubject;
  subjectId: number;
  field: string;
  note: string;
  /** YYYY-MM-DD */
  givenOn: string;
  givenBy: string;
}

/** The evidence of a case's subjects by evidenceKey: what the results and the headline read. */
export type EvidenceIndex = Record<string, EvidenceEntry>;

export function indexEvidence(entries: readonly EvidenceEntry[]): EvidenceIndex {
  const index: EvidenceIndex = {};
  for (const e of entries) index[evidenceKey(e.subjectType, e.subjectId, e.field)] = e;
  return index;
}

/** The axes and machines a frozen input names, as the record ids their sources are kept under. */
export function frozenSubjects(input: {
  axes?: readonly { id: string }[];
  machines?: readonly { id: string }[];
}): { axisIds: number[]; machineIds: number[] } {
  const ids = (list: readonly { id: string }[] | undefined) =>
    (list ?? []).map((x) => parseId(x.id)).filter((id): id is number => id !== null);
  return { axisIds: ids(input.axes), machineIds: ids(input.machines) };
}
