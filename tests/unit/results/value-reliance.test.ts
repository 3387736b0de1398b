import { describe, expect, it } from "vitest";
import type { Scenario } from "@/lib/engine";
import Decimal from "decimal.js";
import { relianceSentence, valueReliance, wholePercent } from "@/lib/results/value-reliance";

function scenario(bySource: Partial<Scenario["bySource"]>): Scenario {
  const zero = ["0", "0"];
  return {
    cashFlows: ["-100", "0", "0"],
    npv: "0",
    irr: null,
    paybackYears: null,
    discountedPaybackYears: null,
    roiPct: null,
    paybackStatus: "never",
    bySource: {
      energy: zero,
      cooling: zero,
      reliability: zero,
      maintenance: zero,
      throughput: zero,
      service: zero,
      tax: zero,
      ...bySource,
    },
  };
}

describe("valueReliance", () => {
  it("never rounds a typed share up to 100 % while some value is computed, nor a small one down to 0 %", () => {
    // 9,970 typed of 10,000 (99.7 %) and 30 of 10,000 (0.3 %): worked by hand.
    const most = valueReliance(scenario({ energy: ["15", "15"], throughput: ["4985", "4985"] }));
    expect(most?.typedPct).toBe(99);
    const least = valueReliance(scenario({ energy: ["4985", "4985"], throughput: ["15", "15"] }));
    expect(least?.typedPct).toBe(1);
    expect(valueReliance(scenario({ throughput: ["1", "1"] }))?.typedPct).toBe(100);
    expect(wholePercent(new Decimal(995), new Decimal(1000))).toBe(99);
    expect(wholePercent(new Decimal(994), new Decimal(1000))).toBe(99);
    expect(wholePercent(new Decimal(985), new Decimal(1000))).toBe(99);
    expect(wholePercent(new Decimal(984), new Decimal(1000))).toBe(98);
  });

  it("counts event and output value as typed, energy and cooling as computed, tax as neither", () => {
    // 620 typed of 1000 pre-tax: worked by hand.
    const r = valueReliance(
      scenario({
        energy: ["150", "150"],
        cooling: ["40", "40"],
        reliability: ["200", "220"],
        throughput: ["100", "100"],
        tax: ["-300", "-300"],
      }),
    );
    expect(r).toEqual({
      typedPct: 62,
      typedSources: ["Step-loss events avoided", "Added output"],
      mostlyTyped: true,
    });
    expect(relianceSentence(r!)).toBe(
      "62 % of the value over the horizon rests on figures typed for this case: step-loss events avoided and added output.",
    );
  });

  it("does not warn when the computed value is the larger part, and ignores a negative service cost", () => {
    const r = valueReliance(
      scenario({ energy: ["300", "300"], maintenance: ["100", "100"], service: ["-50", "-50"] }),
    )!;
    expect(r.typedPct).toBe(25);
    expect(r.mostlyTyped).toBe(false);
  });

  it("exactly half is not more than half", () => {
    expect(
      valueReliance(scenario({ energy: ["1", "1"], reliability: ["1", "1"] }))!.mostlyTyped,
    ).toBe(false);
  });

  it("has nothing to say without positive value or without sources", () => {
    expect(valueReliance(scenario({}))).toBeNull();
    const old = scenario({});
    delete (old as Partial<Scenario>).bySource;
    expect(valueReliance(old)).toBeNull();
  });
});
