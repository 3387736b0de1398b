import { EVENT_FIELDS } from "../../lib/fields";
import type { EvidenceField } from "../../lib/evidence/subjects";
import type { Db } from "../client";
import { valueEvidence, type Axis, type Machine } from "../schema";
import { dateAfterDays } from "../queries/quote-open";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** Where one typed figure comes from, as a demo case records it: a note, who gave it, how long ago. */
export type DemoSource = { note: string; givenBy: string; daysAgo: number };

/**
 * The sources a demo case records for its typed figures (db/schema/evidence.ts), by field: each
 * axis source is recorded on every axis of the case that has step-loss events, each machine
 * source on every machine of the case with a throughput gain. A field left out stays without
 * a source, as it would in a plant that has not yet found one.
 */
export type DemoEvidence = {
  axis?: Partial<Record<EvidenceField<"axis">, DemoSource>>;
  machine?: Partial<Record<EvidenceField<"machine">, DemoSource>>;
  case?: Partial<Record<EvidenceField<"case">, DemoSource>>;
};

// The packaging plant's cartoner case, the one the demo's reviewer is sent: most of its value
// (step-loss events and added output) has a source, so a newcomer sees what a well-evidenced
// case looks like beside the others, which have none. Invented documents and roles, no real
// people. The maintenance saving is left without one on purpose: a small figure still open.
export const CARTONER_CASE_SOURCES: DemoEvidence = {
  axis: {
    stepLossEventsPerYear: {
      note: "Fault log of the carton line, last twelve months: stops with a lost position, counted per axis",
      givenBy: "Shift lead, North hall",
      daysAgo: 34,
    },
    avoidedPct: {
      note: "Eight-week closed-loop trial on one cartoner: no lost-position stop on the trial axes; the rest kept as a margin",
      givenBy: "Maintenance planner, North hall",
      daysAgo: 21,
    },
    costPerEvent: {
      note: "Line-stop cost from the plant's downtime tracking: restart time, cartons scrapped and the fitter's call-out",
      givenBy: "Plant controller, Cartonia",
      daysAgo: 28,
    },
  },
  machine: {
    throughputGainPct: {
      note: "Line speed study during the trial: speed raised until the first fault, half the gain kept",
      givenBy: "Production engineer, North hall",
      daysAgo: 19,
    },
    marginPerOutputHour: {
      note: "Contribution margin per cartoner hour from this year's budget, sold-out lines only",
      givenBy: "Plant controller, Cartonia",
      daysAgo: 28,
    },
  },
};

/**
 * Records a demo case's sources. Like the rest of the seed, it writes no audit lines: the audit
 * log starts with what people do in the app (db/queries/evidence.ts writes one per source).
 */
export function seedDemoEvidence(
  tx: Tx,
  evidence: DemoEvidence,
  c: { accountId: number; caseId: number; ownerId: number; axes: Axis[]; machines: Machine[] },
) {
  const rows: (typeof valueEvidence.$inferInsert)[] = [];
  const record = (
    subjectType: "axis" | "machine" | "case",
    subjectId: number,
    sources: Partial<Record<string, DemoSource>> | undefined,
    applies: (field: string) => boolean = () => true,
  ) => {
    for (const [field, source] of Object.entries(sources ?? {}))
      if (source && applies(field))
        rows.push({
          accountId: c.accountId,
          subjectType,
          subjectId,
          field,
          note: source.note,
          givenOn: dateAfterDays(-source.daysAgo),
          givenBy: source.givenBy,
          updatedById: c.ownerId,
        });
  };
  for (const axis of c.axes)
    if (axis.stepLossEventsPerYear > 0)
      // An event's cost is either one typed figure or built up from what it causes, never both.
      record("axis", axis.id, evidence.axis, (field) =>
        axis.event ? field !== "costPerEvent" : !Object.hasOwn(EVENT_FIELDS, field),
      );
  for (const machine of c.machines)
    if (machine.throughputGainPct > 0) record("machine", machine.id, evidence.machine);
  record("case", c.caseId, evidence.case);
  if (rows.length > 0) tx.insert(valueEvidence).values(rows).run();
}
