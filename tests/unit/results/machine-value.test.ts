import { describe, expect, it } from "vitest";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { CASE_WIDE_LABEL, FLEET_TOTAL_LABEL, machineValueTable } from "@/lib/results/machine-value";
import { sourceTotals } from "@/lib/results/source-totals";
import { input, rawCase, result } from "./fixture";

describe("machineValueTable", () => {
  it("names each machine, then the case-wide row, then the case's own total", () => {
    const table = machineValueTable(result, input, "physics");
    expect(table.rows.map((r) => r.name)).toEqual([
      "Invented pick-and-place cell",
      "Invented labeller",
      CASE_WIDE_LABEL,
      FLEET_TOTAL_LABEL,
    ]);
    // The total row is the scenario's value by source at the case's rate (8 %), not a sum of rows.
    const fleet = sourceTotals(result.scenarios.physics, 8);
    const total = table.rows[3];
    for (const t of fleet) {
      expect(total.values.horizon[t.source].toFixed(10)).toBe(t.sum.toFixed(10));
      expect(total.values.discounted[t.source].toFixed(10)).toBe(t.discounted.toFixed(10));
    }
    expect(total.values.year1.throughput.toFixed(2)).toBe(
      Number(result.scenarios.physics.bySource.throughput[0]).toFixed(2),
    );
  });

  it("lists only the sources that carry money for the case: no tax column without a tax rate", () => {
    expect(machineValueTable(result, input, "bandLow").sources).not.toContain("tax");
    const raw = rawCase();
    raw.finance.taxRatePct = 20;
    const taxed = caseInputSchema.parse(raw);
    expect(machineValueTable(evaluateCase(raw), taxed, "bandLow").sources).toContain("tax");
  });

  it("reads year 1 and the horizon of the service cost on the case-wide row, worked by hand", () => {
    const caseWide = machineValueTable(result, input, "physics").rows[2];
    // 120 a year without inflation over the fixture's 5 years.
    expect(caseWide.values.year1.service.toFixed(2)).toBe("-120.00");
    expect(caseWide.values.horizon.service.toFixed(2)).toBe("-600.00");
    // 120·(1/1.08 + … + 1/1.08⁵) = 120 · 3.99271… = 479.13.
    expect(caseWide.values.discounted.service.toFixed(2)).toBe("-479.13");
  });
});
