import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import { caseResultJson } from "@/server/cases/results";
import { VALUE_SOURCES, type CaseResult } from "@/lib/engine";
import { sourceTotals } from "@/lib/results/source-totals";
import { caller } from "../support/callers";

const manager = () => caller("manager@example.com");
const cents = (d: Decimal.Value) => new Decimal(d).toFixed(2);

// The JSON the result route serves (GET /api/v1/cases/{id}/result) is caseResultJson's text.
describe("value by source in the served result", () => {
  it("adds up to each year's flow and to the horizon's totals to the cent in every scenario of every case", () => {
    const cases = listCases(manager());
    expect(cases.length).toBeGreaterThan(0);
    for (const c of cases) {
      const result = JSON.parse(caseResultJson(manager(), c.id)) as CaseResult;
      for (const [key, scenario] of Object.entries(result.scenarios)) {
        const yearly = scenario.cashFlows.slice(1);
        yearly.forEach((flow, t) => {
          const parts = VALUE_SOURCES.reduce(
            (acc, s) => acc.plus(scenario.bySource[s][t]),
            new Decimal(0),
          );
          expect(cents(parts), `case ${c.id} ${key} year ${t + 1}`).toBe(cents(flow));
        });
        const totals = sourceTotals(scenario, 0);
        const horizon = totals.reduce((acc, p) => acc.plus(p.sum), new Decimal(0));
        expect(cents(horizon), `case ${c.id} ${key}`).toBe(
          cents(yearly.reduce((acc, f) => acc.plus(f), new Decimal(0))),
        );
      }
      // The physics scenario discounted at the case's rate gives back its NPV plus the up-front cost.
      const rate = buildCaseInput(manager(), c.id).finance.discountRatePct ?? 0;
      const physics = result.scenarios.physics;
      const present = sourceTotals(physics, rate).reduce(
        (acc, p) => acc.plus(p.discounted),
        new Decimal(0),
      );
      expect(cents(present.plus(physics.cashFlows[0])), `case ${c.id} npv`).toBe(
        cents(physics.npv),
      );
    }
  });
});
