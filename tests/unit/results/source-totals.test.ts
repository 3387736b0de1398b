import { describe, expect, it } from "vitest";
import { VALUE_SOURCES, type Scenario } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { sourceTotals } from "@/lib/results/source-totals";
import { result } from "./fixture";

describe("sourceTotals", () => {
  it("discounts each year by (1 + rate)^t: 110 then 121 at 10 % are 100 each, worked by hand", () => {
    const zero = ["0", "0"];
    const scenario = {
      bySource: Object.fromEntries(
        VALUE_SOURCES.map((s) => [s, s === "energy" ? ["110", "121"] : zero]),
      ),
    } as unknown as Scenario;
    const energy = sourceTotals(scenario, 10).find((t) => t.source === "energy")!;
    expect(energy.sum.toFixed()).toBe("231");
    expect(energy.discounted.toFixed(10)).toBe("200.0000000000");
  });

  it("plain sums add up to the yearly cash flows of the fixture's physics scenario", () => {
    const scenario = result.scenarios.physics;
    const total = sourceTotals(scenario, 7).reduce((acc, t) => acc.plus(t.sum), new Money(0));
    const flows = scenario.cashFlows.slice(1).reduce((acc, f) => acc.plus(f), new Money(0));
    expect(total.toFixed(2)).toBe(flows.toFixed(2));
  });
});
