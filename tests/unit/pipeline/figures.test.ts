import { describe, expect, it } from "vitest";
import { stageTotals, weightedValue, winRate } from "@/lib/pipeline/figures";
import { DEFAULT_STAGE_PROBABILITIES, QUOTE_STAGES } from "@/lib/pipeline/stages";

describe("weighted pipeline figures", () => {
  it("weights a value by the stage's chance, rounded half-even to the cent", () => {
    expect(weightedValue("14457.6", 40, "EUR")).toBe("5783.04");
    // 0.125 × 10 % = 0.0125 → 0.01 (half-even; half-up would give 0.02)
    expect(weightedValue("0.125", 10, "EUR")).toBe("0.01");
    expect(weightedValue("1000", 33, "JPY")).toBe("330");
  });

  it("sums per stage and currency without adding currencies together", () => {
    const totals = stageTotals(
      [
        { stage: "sent", currency: "EUR", value: "0.1", vendorRevenue: "0.1", weighted: "0.04" },
        { stage: "sent", currency: "EUR", value: "0.25", vendorRevenue: "0.2", weighted: "0.08" },
        { stage: "sent", currency: "USD", value: "5", vendorRevenue: "5", weighted: "2" },
      ],
      QUOTE_STAGES,
    );
    const eurSent = totals.find((t) => t.stage === "sent" && t.currency === "EUR")!;
    // Decimal sums: 0.1 + 0.2 is exactly 0.3 (a double would give 0.30000000000000004).
    expect(eurSent).toEqual({
      stage: "sent",
      currency: "EUR",
      count: 2,
      value: "0.35",
      revenue: "0.3",
      weighted: "0.12",
    });
    expect(totals.filter((t) => t.currency === "USD" && t.count > 0)).toHaveLength(1);
    expect(totals).toHaveLength(2 * QUOTE_STAGES.length);
  });

  it("counts the win rate of decided quotes only, and none without any", () => {
    expect(winRate([{ stage: "accepted" }, { stage: "declined" }, { stage: "sent" }])).toEqual({
      won: 1,
      lost: 1,
      ratePct: 50,
    });
    expect(winRate([{ stage: "sent" }]).ratePct).toBeNull();
    expect(DEFAULT_STAGE_PROBABILITIES.accepted).toBe(100);
    expect(DEFAULT_STAGE_PROBABILITIES.declined).toBe(0);
  });
});
