import { describe, expect, it } from "vitest";
import { Money } from "@/lib/engine/money";
import { bandPosition, bandPositionText } from "@/lib/results/band";
import { scenarioHeadlines } from "@/lib/results/scenarios";
import { input, result } from "./fixture";

describe("headline figures by scenario", () => {
  const [physics, low, high] = scenarioHeadlines(result, input);

  it("shows each scenario's own NPV, IRR and paybacks beside the shared capex", () => {
    expect([physics.key, low.key, high.key]).toEqual(["physics", "bandLow", "bandHigh"]);
    expect(physics.npv).toBe(result.scenarios.physics.npv);
    expect(low.irr).toBe(result.scenarios.bandLow.irr);
    expect(high.discountedPaybackYears).toBe(result.scenarios.bandHigh.discountedPaybackYears);
    for (const h of [physics, low, high]) expect(h.capex).toBe(result.totals.capex);
  });

  it("the physics scenario saves the engine's energy total and CO₂", () => {
    expect(physics.energySavedKWhPerYear).toBeCloseTo(
      result.totals.energySavedKWhPerYear + result.totals.coolingSavedKWhPerYear,
      12,
    );
    expect(physics.co2TonnesPerYear).toBe(result.totals.co2TonnesPerYear);
  });

  it("a band scenario's energy, priced at the tariff, is what its first-year cash flow holds", () => {
    const recurring = new Money(result.totals.reliabilityPerYear)
      .plus(result.totals.maintenancePerYear)
      .plus(result.totals.throughputPerYear)
      .minus(input.finance.annualServiceCost);
    for (const [h, key] of [
      [low, "bandLow"],
      [high, "bandHigh"],
    ] as const) {
      const energyValue = new Money(result.scenarios[key].cashFlows[1]).minus(recurring);
      expect(energyValue.div(input.finance.tariffPerKWh).toNumber()).toBeCloseTo(
        h.energySavedKWhPerYear,
        6,
      );
      expect(h.co2TonnesPerYear).toBeCloseTo((h.energySavedKWhPerYear * 0.38) / 1000, 12);
    }
    expect(low.savingPct).toBeCloseTo(25, 9);
    expect(high.savingPct).toBeCloseTo(50, 9);
    expect([low.band, high.band]).toEqual(["within", "within"]);
  });

  it("says where the physics lands against the band", () => {
    expect(physics.bandText).toMatch(
      /% of today's energy saved — (below|within|above) the 25–50 % band$/,
    );
  });
});

describe("band position", () => {
  it("counts both ends of the band as inside (docs/model.md (Energy and cooling))", () => {
    const band = { lowPct: 25, highPct: 50 };
    expect(bandPosition(25, band)).toBe("within");
    expect(bandPosition(50, band)).toBe("within");
    expect(bandPosition(24.9, band)).toBe("below");
    expect(bandPosition(50.1, band)).toBe("above");
    expect(bandPositionText(32.71, band)).toBe(
      "32.7 % of today's energy saved — within the 25–50 % band",
    );
    expect(bandPositionText(null, band)).toMatch(/^No energy today/);
  });

  it("never shows a saving just under the band as the band's own edge", () => {
    const band = { lowPct: 25, highPct: 50 };
    expect(bandPositionText(24.996, band)).toBe(
      "Just under 25 % of today's energy saved — below the 25–50 % band",
    );
    expect(bandPositionText(50.04, band)).toBe(
      "Just over 50 % of today's energy saved — above the 25–50 % band",
    );
    expect(bandPositionText(50.06, band)).toBe(
      "50.1 % of today's energy saved — above the 25–50 % band",
    );
  });
});
