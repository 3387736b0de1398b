import { describe, expect, it } from "vitest";
import { Money } from "@/lib/engine/money";
import { cashFlowSeries, cumulativeFlows, SCENARIO_KEYS } from "@/lib/results/scenarios";
import { input, result } from "./fixture";

describe("cumulative cash flow", () => {
  it("starts at minus the capex and ends at the exact sum of the yearly flows, for every scenario", () => {
    for (const key of SCENARIO_KEYS) {
      const scenario = result.scenarios[key];
      const points = cumulativeFlows(scenario);
      expect(points[0].cumulative).toBe(new Money(result.totals.capex).negated().toFixed());
      const sum = scenario.cashFlows.reduce((s, f) => s.plus(f), new Money(0));
      expect(points[points.length - 1].cumulative).toBe(sum.toFixed());
      expect(points.map((p) => p.year)).toEqual(scenario.cashFlows.map((_, i) => i));
    }
  });

  it("keeps every digit of the engine's Decimal money (no rounding through doubles)", () => {
    const points = cumulativeFlows(result.scenarios.physics);
    const flows = result.scenarios.physics.cashFlows;
    expect(new Money(points[2].cumulative).toFixed()).toBe(
      new Money(flows[0]).plus(flows[1]).plus(flows[2]).toFixed(),
    );
    expect(points[2].cumulative.split(".")[1]?.length ?? 0).toBeGreaterThan(10);
  });

  it("names the three scenarios in words, the band ones with the fraction they assume", () => {
    expect(cashFlowSeries(result, input).map((s) => s.label)).toEqual([
      "Engineering estimate",
      "Low trade claim (25 % saved)",
      "High trade claim (50 % saved)",
    ]);
  });
});
