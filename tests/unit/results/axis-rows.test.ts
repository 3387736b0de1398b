import { describe, expect, it } from "vitest";
import { axisRows, machineWarnings } from "@/lib/results/axis-rows";
import { loopStatus } from "@/lib/results/status";
import { input, result } from "./fixture";

describe("results by axis", () => {
  const rows = axisRows(result, input);

  it("reads each loop's status in words with a matching tone, never a tone alone", () => {
    const z = rows.find((r) => r.axisId === "M1-Z")!;
    expect(z.openLoop).toMatchObject({ words: "Thin margin", tone: "caution" });
    expect(z.closedLoop).toMatchObject({ words: "Margin kept", tone: "success" });
    expect(z.openLoop.detail).toMatch(/^margin -?\d+ % \(needs 40 %\)$/);
    expect(z.closedLoop.detail).toMatch(/\(needs 15 %\)$/);
  });

  it("covers every status of docs/model.md (Torque margin and speed)", () => {
    const loop = result.axes[0].openLoop;
    expect(loopStatus({ ...loop, status: "step-loss" }, 40)).toMatchObject({
      words: "Loses steps",
      tone: "danger",
    });
    expect(loopStatus({ ...loop, status: "undersized" }, 15)).toMatchObject({
      words: "Kit too small",
      tone: "danger",
    });
    expect(loopStatus({ ...loop, marginPct: null }, 40).detail).toBe(
      "no torque at this speed (needs 40 %)",
    );
  });

  it("carries the freed torque, headroom, saving of all units and temperature drop", () => {
    rows.forEach((row, i) => {
      const axis = result.axes[i];
      expect(row.torqueFreedNm).toBe(axis.savings.torqueFreedNm);
      expect(row.speedHeadroomPct).toBe(axis.savings.speedHeadroomPct);
      expect(row.energySavedKWhPerYear).toBe(axis.totals.energySavedKWhPerYear);
      expect(row.tempDropK).toBe(axis.savings.tempDropK);
    });
    expect(rows[0]).toMatchObject({
      label: "Gantry X",
      machineName: "Invented pick-and-place cell",
      quantity: 2,
    });
  });

  it("explains the vertical axis's warnings in sentences, the holding load with its caution", () => {
    const z = rows.find((r) => r.axisId === "M1-Z")!;
    expect(z.warnings.map((w) => w.code)).toEqual(["SAVING_OUTSIDE_BAND", "HOLDING_LOAD"]);
    const holding = z.warnings.find((w) => w.code === "HOLDING_LOAD")!;
    expect(holding.caution).toMatch(/brake/);
  });

  it("lists only machines that carry a warning", () => {
    expect(machineWarnings(result, input)).toEqual([]);
  });
});
