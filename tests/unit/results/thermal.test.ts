import { describe, expect, it } from "vitest";
import { evaluateCase, caseInputSchema } from "@/lib/engine";
import { windingTemperatures } from "@/lib/results/thermal";
import { input, rawCase, result } from "./fixture";

describe("winding temperature before and after", () => {
  const rows = windingTemperatures(result, input);

  it("shows each axis's open- and closed-loop winding temperature and the drop", () => {
    expect(rows.map((r) => r.axisId)).toEqual(["M1-X", "M1-Z", "M2-FEED"]);
    rows.forEach((row, i) => {
      expect(row.beforeC).toBe(result.axes[i].openLoop.windingTempC);
      expect(row.afterC).toBe(result.axes[i].closedLoop.windingTempC);
      expect(row.beforeC! - row.afterC!).toBeCloseTo(row.dropK!, 9);
    });
  });

  it("sets the insulation class limit of IEC 60085: B 130 °C, F 155 °C", () => {
    const z = rows.find((r) => r.axisId === "M1-Z")!;
    expect([z.beforeClass, z.beforeLimitC]).toEqual(["F", 155]);
    const x = rows.find((r) => r.axisId === "M1-X")!;
    expect([x.beforeClass, x.beforeLimitC]).toEqual(["B", 130]);
  });

  it("takes the closed-loop limit from the kit's own motor when the kit brings one", () => {
    const raw = rawCase();
    raw.axes[0].retrofit.kit.motor = { ...raw.axes[0].motor, insulationClass: "H" };
    const parsed = caseInputSchema.parse(raw);
    const row = windingTemperatures(evaluateCase(raw), parsed)[0];
    expect([row.beforeLimitC, row.afterClass, row.afterLimitC]).toEqual([130, "H", 180]);
  });

  it("flags a winding above its class", () => {
    const raw = rawCase();
    // The hottest ambient FIELD_BOUNDS allows (80 °C, issue 13) and a drive set to twice the
    // rated current: the open-loop winding passes its class B limit.
    Object.assign(raw.axes[0].duty, { ambientC: 80 });
    const motor = raw.axes[0].motor as { ratedCurrentA: number };
    Object.assign(raw.axes[0].drive, { currentSettingA: motor.ratedCurrentA * 2 });
    const evaluated = evaluateCase(raw);
    const row = windingTemperatures(evaluated, caseInputSchema.parse(raw))[0];
    expect(evaluated.axes[0].warnings).toContain("OL_WINDING_OVER_CLASS");
    expect(row.beforeOverLimit).toBe(true);
  });
});
