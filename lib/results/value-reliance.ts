import type Decimal from "decimal.js";
import type { CaseResult, ParsedCase, Scenario, ValueSource } from "@/lib/engine";
import { eventCost } from "@/lib/engine/fleet";
import { Money, parseMoney } from "@/lib/engine/money";
import {
  evidenceFieldLabel,
  evidenceKey,
  type EvidenceIndex,
  type EvidenceSubject,
} from "@/lib/evidence/subjects";
import { VALUE_SOURCE_LABELS } from "./engine-v2";

/**
 * Where each value source's figures come from: typed for this case (event costs and counts,
 * added output margin, maintenance and service figures on the case rows) or computed by the
 * engine from the machines' physics (energy, cooling). Tax follows from the others and so
 * counts for neither side (docs/model.md (The business case)).
 */
export const SOURCE_ORIGIN: Record<ValueSource, "typed" | "computed" | null> = {
  energy: "computed",
  cooling: "computed",
  reliability: "typed",
  maintenance: "typed",
  throughput: "typed",
  service: "typed",
  tax: null,
};

export interface ValueReliance {
  /** Share (0..100, whole percent) of the pre-tax value over the horizon resting on typed figures. */
  typedPct: number;
  /** Labels of the typed sources that carry value, largest first. */
  typedSources: string[];
  /** More than half of the value rests on typed figures. */
  mostlyTyped: boolean;
}

/**
 * `part` of `whole` in whole percent, as the sentences state it: rounded, except that a part
 * short of the whole never reads 100 % and a part above nothing never reads 0 %, so "100 % rests
 * on typed figures" is only said when nothing rests on computed ones.
 */
export function wholePercent(part: Decimal, whole: Decimal): number {
  const pct = part.div(whole).times(100).toDecimalPlaces(0).toNumber();
  if (pct === 100 && part.lessThan(whole)) return 99;
  if (pct === 0 && part.greaterThan(0)) return 1;
  return pct;
}

/** A scenario's pre-tax value over the horizon that adds value, and the typed part of it. */
function typedAndTotal(bySource: Scenario["bySource"]) {
  let typed: Decimal = new Money(0);
  let total: Decimal = new Money(0);
  const carried: { label: string; amount: Decimal }[] = [];
  for (const [source, origin] of Object.entries(SOURCE_ORIGIN) as [ValueSource, string | null][]) {
    if (origin === null) continue;
    const amount = (bySource[source] ?? []).reduce<Decimal>((acc, y) => acc.plus(y), new Money(0));
    if (!amount.greaterThan(0)) continue;
    total = total.plus(amount);
    if (origin === "typed") {
      typed = typed.plus(amount);
      carried.push({ label: VALUE_SOURCE_LABELS[source], amount });
    }
  }
  return { typed, total, carried };
}

/**
 * Splits a scenario's pre-tax value over the horizon into typed and computed parts. Only
 * sources that add value count (a negative service cost lowers the value but is not a figure
 * the value rests on). Null when the scenario has no value by source or no positive value.
 */
export function valueReliance(scenario: Scenario): ValueReliance | null {
  const bySource = (scenario as Partial<Scenario>).bySource;
  if (!bySource) return null;
  const { typed, total, carried } = typedAndTotal(bySource);
  if (!total.greaterThan(0)) return null;
  const share = typed.div(total);
  return {
    typedPct: wholePercent(typed, total),
    typedSources: carried.sort((a, b) => b.amount.comparedTo(a.amount)).map((c) => c.label),
    mostlyTyped: share.greaterThan(0.5),
  };
}

/** The same share unrounded, as a fraction (the workbook's Summary states it as a formula). */
export function typedShare(scenario: Scenario): number | null {
  const bySource = (scenario as Partial<Scenario>).bySource;
  if (!bySource) return null;
  const { typed, total } = typedAndTotal(bySource);
  return total.greaterThan(0) ? typed.div(total).toNumber() : null;
}

/** The sentence shown under the results, e.g. "62 % of the value … : step-loss events avoided and added output". */
export function relianceSentence(reliance: ValueReliance): string {
  if (reliance.typedSources.length === 0)
    return "All of the value over the horizon rests on figures the engine computed: energy and cooling.";
  const names = reliance.typedSources.map((s) => s.toLowerCase());
  const list =
    names.length === 1
      ? names[0]
      : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
  return `${reliance.typedPct} % of the value over the horizon rests on figures typed for this case: ${list}.`;
}

/** One part of a typed source's yearly value and the typed figures it is the product of. */
interface ValuePart {
  source: ValueSource;
  amount: Decimal;
  /** evidenceKey of each figure, with the words naming it. */
  figures: Figure[];
}

/** One typed figure of one subject: its evidence key, its words, and what it is of. */
interface Figure {
  key: string;
  words: string;
  /** "axis:stepLossEventsPerYear": figures of many subjects with one field group under it. */
  group: string;
}

/** Whose figure it is, in words: "axis X1 on Mill 2", "machine Mill 2", "this case". */
type Names = { axis: (id: string) => string; machine: (id: string) => string };

const figure = (
  subject: EvidenceSubject,
  id: string | number,
  field: string,
  whose: string,
): Figure => ({
  key: evidenceKey(subject, id, field),
  group: `${subject}:${field}`,
  words: `${evidenceFieldLabel(subject, field).toLowerCase()} ${whose}`,
});

/**
 * The yearly value of each typed source split into parts, each with the figures it rests on
 * (docs/model.md (The business case)): a step-loss event's cost per axis — typed as one figure,
 * or built from downtime (priced at the case's downtime cost), scrap and restart labour (at its
 * labour rate) — times the events avoided; each machine's added output; the case's maintenance
 * saving. A part rests on its events, avoided share and cost figures together, so it counts as
 * evidenced only when every one of them has a source.
 */
function valueParts(result: CaseResult, input: ParsedCase, caseId: number | null): ValuePart[] {
  const labor = parseMoney(input.finance.laborRatePerHour);
  const downtime = parseMoney(input.finance.downtimeCostPerHour);
  const machineName = new Map(input.machines.map((m) => [m.id, m.name]));
  const axisResult = new Map(result.axes.map((a) => [a.id, a]));
  // Maps, not finds: a fleet case holds up to 100,000 axes.
  const axisById = new Map(input.axes.map((a) => [a.id, a]));
  const names: Names = {
    axis: (id) => {
      const axis = axisById.get(id);
      return `on axis ${axis?.label ?? id} of ${machineName.get(axis?.machineId ?? "") ?? "its machine"}`;
    },
    machine: (id) => `of machine ${machineName.get(id) ?? id}`,
  };
  // Without a case (a bare input), a case's figure can have no source: its key matches none.
  const caseFigure = (field: string) => figure("case", caseId ?? "none", field, "of this case");
  const parts: ValuePart[] = [];

  for (const axis of input.axes) {
    const avoided = axisResult.get(axis.id)?.savings.stepLossEventsAvoided ?? 0;
    if (avoided === 0) continue;
    const events = new Money(axis.quantity).times(avoided);
    const whose = names.axis(axis.id);
    const base = [
      figure("axis", axis.id, "stepLossEventsPerYear", whose),
      figure("axis", axis.id, "avoidedPct", whose),
    ];
    const { event } = axis.reliability;
    const costParts: { amount: Decimal; figures: Figure[] }[] =
      event === undefined
        ? [
            {
              amount: eventCost(axis.reliability, labor, downtime).total,
              figures: [figure("axis", axis.id, "costPerEvent", whose)],
            },
          ]
        : [
            {
              amount: new Money(event.downtimeMinutes).div(60).times(downtime),
              figures: [
                figure("axis", axis.id, "downtimeMinutes", whose),
                caseFigure("downtimeCostPerHour"),
              ],
            },
            {
              amount: new Money(event.scrapParts).times(parseMoney(event.scrapCostPerPart)),
              figures: [
                figure("axis", axis.id, "scrapParts", whose),
                figure("axis", axis.id, "scrapCostPerPart", whose),
              ],
            },
            {
              amount: new Money(event.restartLaborHours).times(labor),
              figures: [
                figure("axis", axis.id, "restartLaborHours", whose),
                caseFigure("laborRatePerHour"),
              ],
            },
          ];
    for (const part of costParts)
      if (part.amount.greaterThan(0))
        parts.push({
          source: "reliability",
          amount: events.times(part.amount),
          figures: [...base, ...part.figures],
        });
  }

  for (const machine of result.machines) {
    // A result frozen by engine 1.0.0 may carry no added output per machine.
    const amount = parseMoney(machine.throughputPerYear ?? "0");
    if (!amount.greaterThan(0)) continue;
    const whose = names.machine(machine.id);
    parts.push({
      source: "throughput",
      amount,
      figures: [
        figure("machine", machine.id, "throughputGainPct", whose),
        figure("machine", machine.id, "marginPerOutputHour", whose),
      ],
    });
  }

  const maintenance = input.axes.reduce<Decimal>(
    (sum, a) =>
      sum.plus(new Money(a.quantity).times(parseMoney(a.retrofit.maintenanceSavingPerYear))),
    new Money(0),
  );
  if (maintenance.greaterThan(0)) {
    parts.push({
      source: "maintenance",
      amount: maintenance,
      figures: [caseFigure("maintenanceSavingPerYear")],
    });
  }
  return parts;
}

export interface EvidencedReliance extends ValueReliance {
  /** Share (0..100, whole percent) of the pre-tax value resting on typed figures with a recorded source. */
  evidencedPct: number;
  /** Share (0..100, whole percent) resting on typed figures at least one of which has no source. */
  unevidencedPct: number;
  /** The typed figures with no source that value rests on, in plain words, most value first. */
  unevidencedFigures: string[];
  /** More than half of the value rests on typed figures without a source. */
  mostlyUnevidenced: boolean;
  /** The value over the horizon (plain, not discounted) on evidenced and on unevidenced typed figures. */
  evidenced: string;
  unevidenced: string;
}

/**
 * valueReliance with the typed value split by evidence (db/schema/evidence.ts): each typed
 * source's value over the horizon is shared between its parts in proportion to their yearly
 * value, and a part is evidenced when every figure it rests on has a source. A figure no
 * screen can give a source for (a rate of a case not named: caseId null) leaves its part
 * unevidenced.
 */
export function evidencedReliance(
  scenario: Scenario,
  result: CaseResult,
  input: ParsedCase,
  evidence: EvidenceIndex,
  caseId: number | null,
): EvidencedReliance | null {
  const base = valueReliance(scenario);
  if (!base) return null;
  const bySource = scenario.bySource;
  let total: Decimal = new Money(0);
  for (const [source, origin] of Object.entries(SOURCE_ORIGIN) as [ValueSource, unknown][]) {
    if (origin === null) continue;
    const amount = sumYears(bySource[source]);
    if (amount.greaterThan(0)) total = total.plus(amount);
  }
  const parts = valueParts(result, input, caseId);
  let evidenced: Decimal = new Money(0);
  let unevidenced: Decimal = new Money(0);
  const missing = new Map<string, { first: Figure; subjects: Set<string>; value: Decimal }>();
  for (const source of ["reliability", "maintenance", "throughput"] as const) {
    const amount = sumYears(bySource[source]);
    if (!amount.greaterThan(0)) continue;
    const own = parts.filter((p) => p.source === source);
    const yearly = own.reduce<Decimal>((s, p) => s.plus(p.amount), new Money(0));
    if (!yearly.greaterThan(0)) {
      unevidenced = unevidenced.plus(amount);
      continue;
    }
    for (const part of own) {
      const share = amount.times(part.amount).div(yearly);
      const lacking = part.figures.filter((f) => evidence[f.key] === undefined);
      if (lacking.length === 0 && part.figures.length > 0) {
        evidenced = evidenced.plus(share);
        continue;
      }
      unevidenced = unevidenced.plus(share);
      for (const f of lacking) {
        const seen = missing.get(f.group);
        if (seen) {
          seen.subjects.add(f.key);
          seen.value = seen.value.plus(share);
        } else missing.set(f.group, { first: f, subjects: new Set([f.key]), value: share });
      }
    }
  }
  const pct = (d: Decimal) => wholePercent(d, total);
  return {
    ...base,
    evidencedPct: pct(evidenced),
    unevidencedPct: pct(unevidenced),
    unevidencedFigures: [...missing.values()]
      .map((m) => ({ words: groupWords(m.first, m.subjects.size), value: m.value }))
      .sort((a, b) => b.value.comparedTo(a.value) || a.words.localeCompare(b.words))
      .map((m) => m.words),
    mostlyUnevidenced: unevidenced.div(total).greaterThan(0.5),
    evidenced: evidenced.toFixed(),
    unevidenced: unevidenced.toFixed(),
  };
}

const SUBJECT_PLURAL: Record<EvidenceSubject, string> = {
  axis: "on {n} axes",
  machine: "of {n} machines",
  case: "of this case",
};

/** One figure in words, or the field's figures of several subjects: "margin per output hour of 14 machines". */
function groupWords(first: Figure, count: number): string {
  if (count === 1) return first.words;
  const [subject, field] = first.group.split(":") as [EvidenceSubject, string];
  return `${evidenceFieldLabel(subject, field).toLowerCase()} ${SUBJECT_PLURAL[subject].replace("{n}", String(count))}`;
}

const sumYears = (years: readonly string[] | undefined): Decimal =>
  (years ?? []).reduce<Decimal>((acc, y) => acc.plus(y), new Money(0));

/** One typed figure the value rests on, with the yearly value of the parts resting on it. */
export interface TypedValueFigure {
  key: string;
  words: string;
  /** Yearly value (physics scenario, before escalation) of the parts that rest on it. */
  valuePerYear: string;
}

/**
 * Every typed figure the case's value rests on, most value first: what the results list beside
 * each figure's recorded source (components/results/evidence-sources.tsx).
 */
export function typedValueFigures(
  result: CaseResult,
  input: ParsedCase,
  caseId: number | null,
): TypedValueFigure[] {
  const byKey = new Map<string, { words: string; value: Decimal }>();
  for (const part of valueParts(result, input, caseId))
    for (const f of part.figures) {
      const seen = byKey.get(f.key);
      if (seen) seen.value = seen.value.plus(part.amount);
      else byKey.set(f.key, { words: f.words, value: part.amount });
    }
  return [...byKey.entries()]
    .sort((a, b) => b[1].value.comparedTo(a[1].value) || a[1].words.localeCompare(b[1].words))
    .map(([key, { words, value }]) => ({ key, words, valuePerYear: value.toFixed() }));
}
