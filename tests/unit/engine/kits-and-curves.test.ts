import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { evaluateCase, suggestKit, torqueSpeedCurve, type KitInput } from "@/lib/engine";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const axis = (): Json => structuredClone(handCase.axes[0]) as Json;

const kits: KitInput[] = [
  { id: "tiny", name: "Invented 0.8 A kit", price: "60", maxCurrentPeakA: 0.8 },
  { id: "plain", name: "Invented standard kit", price: "189" },
  { id: "cheap", name: "Invented budget kit", price: "150" },
  { id: "big", name: "Invented large kit", price: "400", maxCurrentPeakA: 6 },
];

describe("suggestKit (docs/model.md (Currents at the operating point), docs/model.md (Torque margin and speed))", () => {
  it("picks the cheapest kit whose closed-loop usable torque covers the peak and that is not undersized", () => {
    const { kit, reason } = suggestKit(axis(), kits, {});
    expect(kit?.id).toBe("cheap");
    expect(reason).toContain("cheap");
  });

  it("compares prices after the axis's discount and keeps the given order on equal prices", () => {
    const a = axis();
    a.retrofit.discountPct = 50;
    const sameprice: KitInput[] = [
      { id: "first", name: "Invented kit A", price: "100" },
      { id: "second", name: "Invented kit B", price: "100" },
    ];
    expect(suggestKit(a, sameprice).kit?.id).toBe("first");
  });

  it("returns no kit and the best usable torque against the peak when none covers it", () => {
    const a = axis();
    a.duty.peakTorqueNm = 5;
    const { kit, reason } = suggestKit(a, kits, { closedLoopRequiredPct: 15 });
    expect(kit).toBeNull();
    expect(reason).toMatch(/best usable torque is \d+\.\d{3} N·m \(big\)/);
    expect(reason).toContain("5.000 N·m");
  });

  it("a stricter closed-loop margin can rule out a kit", () => {
    const a = axis();
    a.duty.peakTorqueNm = 1.0; // standard kit: T_cl 1.224 N·m, usable 1.04 at 15 %, 0.98 at 20 %
    expect(suggestKit(a, kits, { closedLoopRequiredPct: 15 }).kit?.id).toBe("cheap");
    expect(suggestKit(a, kits, { closedLoopRequiredPct: 20 }).kit?.id).toBe("big");
  });

  it("says so when no kits are offered", () => {
    expect(suggestKit(axis(), [])).toEqual({
      kit: null,
      reason: expect.stringContaining("no kits"),
    });
  });
});

describe("torqueSpeedCurve (docs/model.md (Torque at speed))", () => {
  it("samples the model from 0 to 6000 rpm, matching the torque at the operating speed", () => {
    const a = axis();
    const curve = torqueSpeedCurve(a, "closed", 21);
    expect(curve).toHaveLength(21);
    expect(curve[0].rpm).toBe(0);
    expect(curve[20].rpm).toBe(6000);
    a.duty.speedRpm = 300;
    const result = evaluateCase({ ...structuredClone(handCase), axes: [a] });
    const at300 = torqueSpeedCurve(a, "closed", 21).find((p) => p.rpm === 300);
    expect(at300?.torqueNm).toBeCloseTo(result.axes[0].closedLoop.torqueAtSpeedNm, 12);
  });

  it("uses the datasheet curve for the open loop, up to its last point", () => {
    const a = axis();
    a.motor.pullOutCurve = [
      { rpm: 0, torqueNm: 0.9 },
      { rpm: 500, torqueNm: 0.5 },
      { rpm: 1000, torqueNm: 0.2 },
    ];
    const curve = torqueSpeedCurve(a, "open", 5);
    expect(curve).toEqual([
      { rpm: 0, torqueNm: 0.9 },
      { rpm: 250, torqueNm: 0.7 },
      { rpm: 500, torqueNm: 0.5 },
      { rpm: 750, torqueNm: expect.closeTo(0.35, 12) },
      { rpm: 1000, torqueNm: 0.2 },
    ]);
  });
});

describe("a kit's encoder supply (docs/contracts.md (Case input), docs/model.md (Energy and cooling))", () => {
  // Off, the closed loop draws only the kit's standby and encoder supply: standbyW 3 by default.
  const offW = (kit: Json) => {
    const input = structuredClone(handCase) as Json;
    Object.assign(input.axes[0].retrofit.kit, kit);
    return evaluateCase(input).axes[0].closedLoop.inputPowerW.off;
  };

  it("defaults to 0.5 W with an encoder and to 0 W sensorless", () => {
    expect(offW({ sensing: "encoder" })).toBeCloseTo(3.5, 12);
    expect(offW({ sensing: "sensorless" })).toBeCloseTo(3, 12);
  });

  it("uses a value given, like every other default of docs/contracts.md (Case input)", () => {
    expect(offW({ sensing: "encoder", encoderW: 1.2 })).toBeCloseTo(4.2, 12);
    expect(offW({ sensing: "sensorless", encoderW: 0.8 })).toBeCloseTo(3.8, 12);
  });
});
