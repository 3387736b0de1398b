import { describe, expect, it } from "vitest";
import { Money } from "@/lib/engine/money";
import { DRIVER_LABELS, tornado } from "@/lib/results/tornado";
import { input, result } from "./fixture";

describe("sensitivity tornado", () => {
  const view = tornado(result, input);

  it("measures each end against the physics NPV, exactly in Decimal", () => {
    expect(view.baseNpv).toBe(result.scenarios.physics.npv);
    for (const row of view.rows) {
      expect(new Money(view.baseNpv).plus(row.lowChange).eq(row.lowNpv)).toBe(true);
      expect(new Money(view.baseNpv).plus(row.highChange).eq(row.highNpv)).toBe(true);
    }
  });

  it("keeps the engine's order, widest swing first, and labels every driver in words", () => {
    expect(view.rows.map((r) => r.driver)).toEqual(result.sensitivity.map((r) => r.driver));
    for (const row of view.rows) {
      expect(row.label).toBe(DRIVER_LABELS[row.driver]);
      expect(row.label).toMatch(/^[A-Z][a-z]/);
      expect(row.label).not.toMatch(/[A-Z]{2}|[a-z][A-Z]/);
    }
    expect(Object.keys(DRIVER_LABELS)).toHaveLength(9);
  });

  it("a higher tariff raises the NPV of a case that saves energy", () => {
    const tariff = view.rows.find((r) => r.driver === "tariff")!;
    expect(new Money(tariff.highChange).gt(0)).toBe(true);
    expect(new Money(tariff.lowChange).lt(0)).toBe(true);
  });

  it("uses the case's swing", () => {
    expect(view.swingPct).toBe(20);
  });
});
