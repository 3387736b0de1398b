import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { axisInputSchema, caseInputSchema, evaluateCase, TORQUE_FACTORS_TO_NM } from "@/lib/engine";
import { irr, npv } from "@/lib/engine/finance";
import { loadAngle } from "@/lib/engine/margin";
import { Money } from "@/lib/engine/money";
import {
  COPPER_ALPHA_PER_K,
  INSULATION_CLASS_LIMIT_C,
  microstepCurrents,
  resistanceAt,
  stepGeometry,
} from "@/lib/engine/motor";
import { windingTemperature } from "@/lib/engine/thermal";

const flows = (values: number[]) => values.map((v) => new Money(v));
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const clone = (value: unknown): Json => structuredClone(value);

/** One axis at standstill speed, so the torque is k1·vf·I with no back-EMF and no drag. */
function standstillCase(stepMode: string, currentSettingA: number) {
  const input = clone(handCase);
  input.axes[0].drive = { ...input.axes[0].drive, stepMode, currentSettingA };
  input.axes[0].motor.hysteresisWPerHz = 0;
  input.axes[0].motor.eddyWPerHz2 = 0;
  input.axes[0].duty.speedRpm = 0;
  return input;
}

describe("step geometry of a two-phase hybrid motor (textbook relation; fact of the trade)", () => {
  it("50 rotor teeth: 1.8° full step, 200 steps/rev, 7.2° electrical cycle", () => {
    expect(stepGeometry(50, "full", 16)).toEqual({
      stepAngleDeg: 1.8,
      stepsPerRev: 200,
      resolutionDeg: 1.8,
      electricalCycleDeg: 7.2,
    });
  });
  it("100 rotor teeth: 0.9° full step, 400 steps/rev", () => {
    const g = stepGeometry(100, "full", 16);
    expect(g.stepAngleDeg).toBeCloseTo(0.9, 12);
    expect(g.stepsPerRev).toBe(400);
    expect(g.electricalCycleDeg).toBeCloseTo(3.6, 12);
  });
  it("half step of a 1.8° motor is 0.9°, a 1/8 microstep 0.225°", () => {
    expect(stepGeometry(50, "half", 16).resolutionDeg).toBeCloseTo(0.9, 12);
    expect(stepGeometry(50, "half-compensated", 16).resolutionDeg).toBeCloseTo(0.9, 12);
    expect(stepGeometry(50, "micro", 8).resolutionDeg).toBeCloseTo(0.225, 12);
  });
  it("reports the geometry of each axis in the case result", () => {
    const result = evaluateCase(handCase);
    expect(result.axes[0].geometry).toEqual({
      stepAngleDeg: 1.8,
      stepsPerRev: 200,
      resolutionDeg: 0.1125,
      electricalCycleDeg: 7.2,
    });
  });
});

describe("microstepping currents and torque (trigonometry; fact of the trade)", () => {
  it("quarter-step table: 0, 38.27, 70.71, 92.39, 100 %", () => {
    const table = [0, 1, 2, 3, 4].map((i) => Math.round(microstepCurrents(i, 4).a * 10000) / 100);
    expect(table).toEqual([0, 38.27, 70.71, 92.39, 100]);
    // the other phase runs the same table backwards (cosine)
    expect(microstepCurrents(1, 4).b).toBeCloseTo(0.9239, 4);
  });
  it("microstepping at the rated per-phase current gives 1/√2 = 70.7 % of the holding torque", () => {
    const result = evaluateCase(standstillCase("micro", 2.8));
    const holding = 1.26;
    expect(result.axes[0].openLoop.torqueAtSpeedNm).toBeCloseTo(holding / Math.SQRT2, 12);
    expect(result.axes[0].openLoop.torqueAtSpeedNm / holding).toBeCloseTo(0.7071, 4);
  });
  it("two phases on at the rated current give the holding torque at standstill", () => {
    const input = standstillCase("full", 2.8);
    input.axes[0].drive.idleCurrentPct = 100;
    const result = evaluateCase(input);
    expect(result.axes[0].openLoop.holdingCapabilityNm).toBeCloseTo(1.26, 12);
  });
  it("full, half and compensated half steps run on the fundamental of their stepped current (Fourier series of the staircase)", () => {
    // At standstill the bus drives any current (48 V / 0.9 Ω ≫ 2.8 A): T(0) = k1·vf_run·I.
    const k1 = 1.26 / (Math.SQRT2 * 2.8);
    const torque = (mode: string) =>
      evaluateCase(standstillCase(mode, 2.8)).axes[0].openLoop.torqueAtSpeedNm;
    expect(torque("full") / (k1 * 2.8)).toBeCloseTo(1.2732, 4); // (4/π)
    expect(torque("half") / (k1 * 2.8)).toBeCloseTo(1.1763, 4); // (4/π)·sin 67.5°
    expect(torque("half-compensated") / (k1 * 2.8)).toBeCloseTo(0.9745, 4); // (8/π)·sin 22.5°
    expect(torque("micro") / (k1 * 2.8)).toBeCloseTo(1, 12);
  });
  it("compensated half steps run the two-phase steps at cos 45° = 70.7 %: half the copper loss of full steps", () => {
    const full = evaluateCase(standstillCase("full", 2.8)).axes[0].openLoop;
    const compensated = evaluateCase(standstillCase("half-compensated", 2.8)).axes[0].openLoop;
    // 2·(0.7071·I)²·R = I²·R against 2·I²·R, at the same winding temperature in a cold comparison
    const perR = (loop: typeof full) => loop.copperLossMoveW / loop.resistanceHotOhm;
    expect(perR(compensated) / perR(full)).toBeCloseTo(Math.cos(Math.PI / 4) ** 2, 12);
  });
  it("an RMS setting in micro mode is √2 times that as per-phase peak", () => {
    const input = standstillCase("micro", 2.8 / Math.SQRT2);
    input.axes[0].drive.currentConvention = "rms";
    const result = evaluateCase(input);
    expect(result.axes[0].openLoop.currentMoveA).toBeCloseTo(2.8, 12);
    expect(result.axes[0].warnings).not.toContain("CURRENT_ABOVE_RATING");
  });
});

describe("stability limit of the load angle: 90° electrical = one full step (fact of the trade)", () => {
  it("sin θ_e = T_load / T_po", () => {
    const angle = loadAngle(0.25, 0.5, 50);
    expect(angle.elecDeg).toBeCloseTo(30, 12);
    expect(angle.mechDeg).toBeCloseTo(0.6, 12);
  });
  it("at the pull-out torque the angle is 90° electrical, 1.8° mechanical for 50 teeth", () => {
    const angle = loadAngle(0.5, 0.5, 50);
    expect(angle.elecDeg).toBe(90);
    expect(angle.mechDeg).toBeCloseTo(1.8, 12);
  });
  it("beyond the pull-out torque there is no stable angle: both null", () => {
    const input = standstillCase("micro", 2.8);
    input.axes[0].duty.loadTorqueNm = 0.9; // T_po = 1.26/√2 = 0.891 N·m
    input.axes[0].duty.peakTorqueNm = 0.95;
    const open = evaluateCase(input).axes[0].openLoop;
    expect(open.loadAngleElecDeg).toBeNull();
    expect(open.loadAngleMechDeg).toBeNull();
    expect(open.status).toBe("step-loss");
  });
});

describe("copper and insulation", () => {
  it("annealed copper: α = 0.00393 K⁻¹ at 20 °C (IACS, IEC 60028)", () => {
    expect(COPPER_ALPHA_PER_K).toBe(0.00393);
    expect(resistanceAt(1, 120)).toBeCloseTo(1.393, 12);
    const open = evaluateCase(handCase).axes[0].openLoop;
    expect(open.resistanceHotOhm).toBeCloseTo(
      0.9 * (1 + 0.00393 * ((open.windingTempC as number) - 20)),
      12,
    );
  });
  it("IEC 60085 Table 1: B 130, F 155, H 180 °C", () => {
    expect(INSULATION_CLASS_LIMIT_C).toEqual({ B: 130, F: 155, H: 180 });
  });
  it.each([
    ["B", 130],
    ["F", 155],
    ["H", 180],
  ] as const)(
    "IEC 60085 class %s: under thermal runaway the resistance is taken at %i °C",
    (insulationClass, limitC) => {
      const motor = axisInputSchema.parse(handCase.axes[0]).motor;
      const state = windingTemperature({ ...motor, insulationClass }, 40, {
        copperAt20W: 1000,
        ironW: 0,
      });
      expect(state.windingTempC).toBeNull();
      expect(state.resistanceHotOhm).toBeCloseTo(0.9 * (1 + 0.00393 * (limitC - 20)), 12);
    },
  );
});

describe("torque units (NIST SP 811, Appendix B)", () => {
  it.each([
    ["ozf·in", 7.061552e-3],
    ["oz·in", 7.061552e-3],
    ["oz-in", 7.061552e-3],
    ["ozin", 7.061552e-3],
    ["lbf·in", 1.129848e-1],
    ["lbf·ft", 1.355818],
    ["kgf·cm", 9.80665e-2],
    ["mN·m", 1e-3],
    ["N·m", 1],
    ["N.m", 1],
    ["Nm", 1],
  ])("1 %s = %f N·m through the input schema", (unit, factor) => {
    const axis = clone(handCase.axes[0]);
    axis.motor.holdingTorqueNm = { value: 1, unit };
    axis.duty.peakTorqueNm = { value: 2, unit };
    axis.duty.loadTorqueNm = 0;
    const parsed = axisInputSchema.parse(axis);
    expect(parsed.motor.holdingTorqueNm).toBeCloseTo(factor, 15);
    expect(parsed.duty.peakTorqueNm).toBeCloseTo(2 * factor, 15);
  });
  it("exports exactly the NIST factors", () => {
    expect(TORQUE_FACTORS_TO_NM).toEqual({
      "N·m": 1,
      "mN·m": 0.001,
      "ozf·in": 0.007061552,
      "lbf·in": 0.1129848,
      "lbf·ft": 1.355818,
      "kgf·cm": 0.0980665,
    });
  });
  it("a whole case accepts a torque with a unit and evaluates in N·m", () => {
    const input = clone(handCase);
    input.axes[0].motor.holdingTorqueNm = { value: 1.26 / 7.061552e-3, unit: "ozf·in" };
    const parsed = caseInputSchema.parse(input);
    expect(parsed.axes[0].motor.holdingTorqueNm).toBeCloseTo(1.26, 12);
  });
});

describe("NPV and IRR worked examples", () => {
  it("numpy-financial irr docstring: IRR(−100, 39, 59, 55, 20) = 0.2809484211599611", () => {
    expect(irr(flows([-100, 39, 59, 55, 20]))).toBeCloseTo(0.2809484211599611, 9);
  });
  it("numpy-financial documentation index: IRR(−250000, 100000 … 300000) = 0.5672303344358536", () => {
    expect(irr(flows([-250000, 100000, 150000, 200000, 250000, 300000]))).toBeCloseTo(
      0.5672303344358536,
      9,
    );
  });
  it("numpy-financial npv docstring: NPV at 8 % of −40000, 5000, 8000, 12000, 30000 = 3065.22267", () => {
    expect(npv(new Money("0.08"), flows([-40000, 5000, 8000, 12000, 30000])).toFixed(5)).toBe(
      "3065.22267",
    );
  });
  it("NumPy ≤ 1.17 npv docstring: rate 0.281 on −100, 39, 59, 55, 20 gives −0.0084785916384548798", () => {
    const value = npv(new Money("0.281"), flows([-100, 39, 59, 55, 20]));
    // The docstring was computed in doubles; exact decimal arithmetic agrees to 3e-14.
    expect(value.minus("-0.0084785916384548798").abs().lessThan("1e-13")).toBe(true);
  });
  it("LibreOffice Calc help: NPV(8.75 %; 10; 20; 30) = 49.43, the first flow discounted one period", () => {
    expect(npv(new Money("0.0875"), flows([0, 10, 20, 30])).toFixed(2)).toBe("49.43");
  });
  it("LibreOffice Calc help: IRR(−10000, 3500, 7600, 1000) = 11.33 %", () => {
    expect(((irr(flows([-10000, 3500, 7600, 1000])) as number) * 100).toFixed(2)).toBe("11.33");
  });
});
