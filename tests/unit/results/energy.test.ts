import { describe, expect, it } from "vitest";
import { energyByMachine } from "@/lib/results/energy";
import { input, result } from "./fixture";

describe("energy before and after by machine", () => {
  const rows = energyByMachine(result, input);

  it("adds up to the case totals, every unit of every axis counted", () => {
    const before = rows.reduce((s, r) => s + r.beforeKWhPerYear, 0);
    const after = rows.reduce((s, r) => s + r.afterKWhPerYear, 0);
    const saved = rows.reduce((s, r) => s + r.savedKWhPerYear, 0);
    expect(before).toBeCloseTo(result.totals.energyOpenLoopKWhPerYear, 9);
    expect(after).toBeCloseTo(result.totals.energyClosedLoopKWhPerYear, 9);
    expect(saved).toBeCloseTo(result.totals.energySavedKWhPerYear, 9);
  });

  it("lists each machine once, by the name the engineer gave it, with its unit count", () => {
    expect(rows.map((r) => [r.machineId, r.name, r.axisCount])).toEqual([
      ["M1", "Invented pick-and-place cell", 3],
      ["M2", "Invented labeller", 3],
    ]);
  });

  it("multiplies the per-unit figures by the axis quantity", () => {
    const m2 = rows.find((r) => r.machineId === "M2")!;
    const feed = result.axes.find((a) => a.id === "M2-FEED")!;
    expect(m2.beforeKWhPerYear).toBeCloseTo(3 * feed.openLoop.energyKWhPerYear, 9);
  });

  it("shows no record ids for names when the input is not at hand", () => {
    const names = energyByMachine(result, null).map((r) => r.name);
    expect(names).toEqual(["Unnamed machine", "Unnamed machine"]);
    for (const machine of result.machines) expect(names).not.toContain(machine.id);
  });
});
