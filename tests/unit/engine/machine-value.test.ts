import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import {
  VALUE_SOURCES,
  caseInputSchema,
  evaluateCase,
  valueByMachine,
  type CaseResult,
} from "@/lib/engine";
import { rawCase } from "../results/fixture";

const cents = (d: Decimal.Value) => new Decimal(d).toFixed(2);
const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;

function evaluated(raw: unknown) {
  const input = caseInputSchema.parse(raw);
  const result = evaluateCase(raw);
  return { input, result, split: valueByMachine(result, input) };
}

/** Machines plus case-wide, source by source and year by year, against the fleet's own figures. */
function expectPartsAddUp(result: CaseResult, split: ReturnType<typeof valueByMachine>) {
  for (const key of SCENARIOS) {
    const fleet = result.scenarios[key].bySource;
    for (const source of VALUE_SOURCES) {
      fleet[source].forEach((year, t) => {
        const parts = split[key].machines
          .reduce((acc, m) => acc.plus(m.bySource[source][t]), new Decimal(0))
          .plus(split[key].caseWide[source][t]);
        expect(cents(parts), `${key} ${source} year ${t + 1}`).toBe(cents(year));
      });
    }
  }
}

describe("value by source split by machine (lib/engine/machine-value.ts)", () => {
  it("adds up to the fleet's value by source in every scenario, year and source, to the cent", () => {
    const { result, split } = evaluated(rawCase());
    expectPartsAddUp(result, split);
  });

  it("also with tax: each machine is taxed on its own value less its own depreciation", () => {
    const raw = rawCase();
    raw.finance.taxRatePct = 25;
    raw.finance.depreciationYears = 5;
    const { result, split } = evaluated(raw);
    expectPartsAddUp(result, split);
    // Worked by hand: case-wide the year-1 flow is −120 of service; the one-time project cost of
    // 1500 depreciates by 300 a year, so tax = −0.25·(−120 − 300) = +105.
    expect(cents(split.physics.caseWide.service[0])).toBe("-120.00");
    expect(cents(split.physics.caseWide.tax[0])).toBe("105.00");
  });

  it("keeps physics on the machines and the service cost off them", () => {
    const { input, result, split } = evaluated(rawCase());
    const [m1, m2] = split.physics.machines;
    expect(split.physics.machines.map((m) => m.machineId)).toEqual(["M1", "M2"]);
    // Year 1 of a machine's energy is its axes' saved kWh times the tariff of 0.24.
    const savedKWh = (machineId: string) =>
      result.axes
        .filter((a) => a.machineId === machineId)
        .reduce((kWh, a) => kWh + a.totals.energySavedKWhPerYear, 0);
    expect(cents(m1.bySource.energy[0])).toBe(cents(new Decimal(savedKWh("M1")).times("0.24")));
    expect(cents(m2.bySource.energy[0])).toBe(cents(new Decimal(savedKWh("M2")).times("0.24")));
    // Extra output is the machine's own figure from the result.
    expect(m1.bySource.throughput[0]).toBe(result.machines[0].throughputPerYear);
    expect(m2.bySource.throughput[0]).toBe("0");
    // Nothing of the case's service cost lands on a machine; no physics lands case-wide.
    for (const m of split.physics.machines)
      expect(m.bySource.service.every((y) => y === "0")).toBe(true);
    for (const s of ["energy", "cooling", "reliability", "maintenance", "throughput"] as const)
      expect(
        split.physics.caseWide[s].every((y) => y === "0"),
        s,
      ).toBe(true);
    // Maintenance: 2 units of M1-X save 25 a year each.
    expect(cents(m1.bySource.maintenance[0])).toBe("50.00");
    expect(input.finance.horizonYears).toBe(m1.bySource.energy.length);
  });

  it("counts a machine's step-loss events only where the result says its axes avoid them", () => {
    const { result, split } = evaluated(rawCase());
    const m2 = result.axes.find((a) => a.id === "M2-FEED")!;
    // Worked by hand when the axis avoids events: 3 units · 2 events · 80 % · 90 = 432.
    const expected = m2.savings.stepLossEventsAvoided > 0 ? "432.00" : "0.00";
    expect(cents(split.physics.machines[1].bySource.reliability[0])).toBe(expected);
  });

  it("refuses a result that is not the evaluation of the input", () => {
    const { input, result } = evaluated(rawCase());
    const shuffled = { ...result, axes: [...result.axes].reverse() };
    expect(() => valueByMachine(shuffled, input)).toThrow(/not the input's/);
  });
});
