import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import {
  VALUE_SOURCES,
  caseInputSchema,
  type CaseResult,
  type SourceYears,
  type ValueSource,
} from "@/lib/engine";
import { VALUE_MEASURES, machineValueTable } from "@/lib/results/machine-value";
import { sourceTotals } from "@/lib/results/source-totals";
import { caseResultWithValueByMachineJson } from "@/server/cases/results";
import { caller } from "../support/callers";

const manager = () => caller("manager@example.com");
const cents = (d: Decimal.Value) => new Decimal(d).toFixed(2);
const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;

interface Served {
  result: CaseResult;
  valueByMachine: Record<
    (typeof SCENARIOS)[number],
    {
      machines: { machineId: string; name: string; bySource: SourceYears }[];
      caseWide: SourceYears;
    }
  >;
}

// The body GET /api/v1/cases/{id}/result?include=value-by-machine serves is this function's text.
describe("value by source per machine, for every seeded demo case", () => {
  const cases = listCases(manager());

  it("the served parts add up to the fleet's value by source in every scenario, year and source, to the cent", () => {
    expect(cases.length).toBeGreaterThan(0);
    for (const c of cases) {
      const served = JSON.parse(caseResultWithValueByMachineJson(manager(), c.id)) as Served;
      const input = caseInputSchema.parse(buildCaseInput(manager(), c.id));
      for (const key of SCENARIOS) {
        const split = served.valueByMachine[key];
        // Machines are named as the case names them, never by an id alone.
        expect(split.machines.map((m) => m.name)).toEqual(input.machines.map((m) => m.name));
        const fleet = served.result.scenarios[key].bySource;
        for (const source of VALUE_SOURCES)
          fleet[source].forEach((year, t) => {
            const parts = split.machines
              .reduce((acc, m) => acc.plus(m.bySource[source][t]), new Decimal(0))
              .plus(split.caseWide[source][t]);
            expect(cents(parts), `case ${c.id} ${key} ${source} year ${t + 1}`).toBe(cents(year));
          });
      }
    }
  });

  it("the table's rows add up to its total row, which is the engine's, in each measure; discounted totals give back NPV", () => {
    for (const c of cases) {
      const served = JSON.parse(caseResultWithValueByMachineJson(manager(), c.id)) as Served;
      const input = caseInputSchema.parse(buildCaseInput(manager(), c.id));
      for (const key of SCENARIOS) {
        const scenario = served.result.scenarios[key];
        const table = machineValueTable(served.result, input, key);
        const total = table.rows.find((r) => r.kind === "total")!;
        const parts = table.rows.filter((r) => r.kind !== "total");
        for (const measure of VALUE_MEASURES) {
          for (const source of VALUE_SOURCES as readonly ValueSource[]) {
            const added = parts.reduce(
              (acc, r) => acc.plus(r.values[measure][source]),
              new Decimal(0),
            );
            expect(cents(added), `case ${c.id} ${key} ${measure} ${source}`).toBe(
              cents(total.values[measure][source]),
            );
          }
        }
        // The total row is the scenario's own figures (lib/results/source-totals.ts on the fleet).
        const fleet = sourceTotals(scenario, input.finance.discountRatePct);
        for (const t of fleet) expect(cents(total.values.horizon[t.source])).toBe(cents(t.sum));
        // Year 1 of every source together is the year-1 cash flow, and the discounted total of
        // all sources plus the up-front flow is the scenario's NPV.
        expect(cents(total.all.year1), `case ${c.id} ${key} year 1`).toBe(
          cents(scenario.cashFlows[1]),
        );
        expect(
          cents(total.all.discounted.plus(scenario.cashFlows[0])),
          `case ${c.id} ${key} NPV`,
        ).toBe(cents(scenario.npv));
      }
    }
  });
});
