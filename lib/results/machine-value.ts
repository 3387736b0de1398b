import type Decimal from "decimal.js";
import {
  VALUE_SOURCES,
  valueByMachine,
  type CaseResult,
  type ParsedCase,
  type SourceYears,
  type ValueByMachine,
  type ValueSource,
} from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { namesById } from "./case-view";
import { sourceTotals } from "./source-totals";

export type ScenarioKey = keyof CaseResult["scenarios"];

/** The three ways a source's money is read: year 1, over the horizon, and over the horizon discounted. */
export const VALUE_MEASURES = ["year1", "horizon", "discounted"] as const;
export type ValueMeasure = (typeof VALUE_MEASURES)[number];

export const VALUE_MEASURE_LABELS: Record<ValueMeasure, string> = {
  year1: "Year 1",
  horizon: "Over the horizon",
  discounted: "Over the horizon, discounted",
};

/** One row of the table: each source and all of them together, in each measure (unrounded Decimals). */
export interface MachineValueRow {
  key: string;
  name: string;
  kind: "machine" | "case-wide" | "total";
  values: Record<ValueMeasure, Record<ValueSource, Decimal>>;
  all: Record<ValueMeasure, Decimal>;
}

export interface MachineValueTable {
  scenario: ScenarioKey;
  rows: MachineValueRow[];
  /** Sources that are not zero for the fleet in any year of the scenario; the others carry nothing. */
  sources: ValueSource[];
}

export const CASE_WIDE_LABEL = "Case-wide";
export const FLEET_TOTAL_LABEL = "Case total";

function rowOf(
  key: string,
  name: string,
  kind: MachineValueRow["kind"],
  bySource: SourceYears,
  discountRatePct: number,
): MachineValueRow {
  const totals = sourceTotals({ bySource }, discountRatePct);
  const values = {
    year1: {} as Record<ValueSource, Decimal>,
    horizon: {} as Record<ValueSource, Decimal>,
    discounted: {} as Record<ValueSource, Decimal>,
  };
  for (const t of totals) {
    values.year1[t.source] = new Money(bySource[t.source][0] ?? 0);
    values.horizon[t.source] = t.sum;
    values.discounted[t.source] = t.discounted;
  }
  const all = Object.fromEntries(
    VALUE_MEASURES.map((m) => [
      m,
      VALUE_SOURCES.reduce<Decimal>((acc, s) => acc.plus(values[m][s]), new Money(0)),
    ]),
  ) as Record<ValueMeasure, Decimal>;
  return { key, name, kind, values, all };
}

/**
 * Rows per machine (by name), the case-wide row and the total row of one scenario. The total is
 * the scenario's own value by source as the engine gives it for the fleet — not the sum of the
 * rows above it — so that a reader can check that they add up (tests/integration/value-by-machine.test.ts).
 * `split` can be passed when it has been computed already (it covers every scenario).
 */
export function machineValueTable(
  result: CaseResult,
  input: ParsedCase,
  scenario: ScenarioKey,
  split: ValueByMachine = valueByMachine(result, input),
): MachineValueTable {
  const rate = input.finance.discountRatePct;
  const names = namesById(input);
  const part = split[scenario];
  const fleet = result.scenarios[scenario].bySource;
  const rows = [
    ...part.machines.map((m) =>
      rowOf(m.machineId, names.machine(m.machineId), "machine", m.bySource, rate),
    ),
    rowOf("case-wide", CASE_WIDE_LABEL, "case-wide", part.caseWide, rate),
    rowOf("total", FLEET_TOTAL_LABEL, "total", fleet, rate),
  ];
  const sources = VALUE_SOURCES.filter((s) => fleet[s].some((y) => !new Money(y).isZero()));
  return { scenario, rows, sources };
}
