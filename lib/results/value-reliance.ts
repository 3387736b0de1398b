import type Decimal from "decimal.js";
import type { Scenario, ValueSource } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
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
 * Splits a scenario's pre-tax value over the horizon into typed and computed parts. Only
 * sources that add value count (a negative service cost lowers the value but is not a figure
 * the value rests on). Null when the scenario has no value by source or no positive value.
 */
export function valueReliance(scenario: Scenario): ValueReliance | null {
  const bySource = (scenario as Partial<Scenario>).bySource;
  if (!bySource) return null;
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
  if (!total.greaterThan(0)) return null;
  const share = typed.div(total);
  return {
    typedPct: share.times(100).toDecimalPlaces(0).toNumber(),
    typedSources: carried.sort((a, b) => b.amount.comparedTo(a.amount)).map((c) => c.label),
    mostlyTyped: share.greaterThan(0.5),
  };
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
