import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { evaluateCase } from "@/lib/engine";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const hand = (): Json => structuredClone(handCase) as Json;

describe("edge cases of docs/model.md", () => {
  it("thermal runaway (docs/model.md (Winding temperature), docs/contracts.md (Case result)): temperature and life factor null, losses at the class-limit resistance", () => {
    const input = hand();
    // 3.6× rated current, always moving slowly (the bus still drives the setting):
    // R_th = 80/(2·2.8²·0.9·(1 + 0.00393·80)) = 4.313 K/W; R_th·A·α = 4.313·(0.9·10²)·0.00393 = 1.53 > 1
    Object.assign(input.axes[0].drive, { currentSettingA: 10 });
    Object.assign(input.axes[0].duty, { movePct: 100, holdPct: 0, speedRpm: 30 });
    const axis = evaluateCase(input).axes[0];
    const rClassB = 0.9 * (1 + 0.00393 * (130 - 20)); // IEC 60085 class B, 130 °C
    expect(axis.openLoop.windingTempC).toBeNull();
    expect(axis.openLoop.resistanceHotOhm).toBeCloseTo(rClassB, 12);
    expect(axis.openLoop.copperLossMoveW).toBeCloseTo(10 ** 2 * rClassB, 10);
    expect(axis.savings.tempDropK).toBeNull();
    expect(axis.savings.insulationLifeFactor).toBeNull();
    expect(axis.warnings).toContain("OL_THERMAL_RUNAWAY");
    expect(axis.warnings).toContain("CURRENT_ABOVE_RATING");
    expect(axis.warnings).not.toContain("OL_WINDING_OVER_CLASS");
    expect(axis.closedLoop.windingTempC).not.toBeNull();
  });

  it("winding above its class without runaway warns OL_WINDING_OVER_CLASS (IEC 60085)", () => {
    const input = hand();
    Object.assign(input.axes[0].drive, { currentSettingA: 4.2 });
    Object.assign(input.axes[0].duty, { movePct: 90, holdPct: 10 });
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.windingTempC as number).toBeGreaterThan(130);
    expect(axis.warnings).toContain("OL_WINDING_OVER_CLASS");
  });

  it("a kit too small: CL_KIT_UNDERSIZED, status undersized, its reliability excluded, throughput capped", () => {
    const input = hand();
    input.machines[0] = { ...input.machines[0], throughputGainPct: 10, marginPerOutputHour: "30" };
    input.axes[0].retrofit.kit.maxCurrentPeakA = 0.8; // k1·0.8 = 0.255 N·m < 0.25 + drag
    const result = evaluateCase(input);
    const axis = result.axes[0];
    expect(axis.closedLoop.status).toBe("undersized");
    expect(axis.closedLoop.currentMoveA).toBe(0.8);
    expect(axis.warnings).toContain("CL_KIT_UNDERSIZED");
    expect(axis.savings.stepLossEventsAvoided).toBe(0);
    expect(result.totals.reliabilityPerYear).toBe("0");
    expect(result.machines[0]).toEqual({
      id: "M1",
      throughputGainPct: 0,
      throughputPerYear: "0",
      warnings: ["THROUGHPUT_CAPPED"],
    });
  });

  it("a holding demand above I_max alone makes the kit undersized (docs/model.md (Currents at the operating point), docs/model.md (Torque margin and speed))", () => {
    const input = hand();
    input.axes[0].duty.holdTorqueNm = 1.5; // above k1·I_max = 1.26 N·m
    const axis = evaluateCase(input).axes[0];
    expect(axis.closedLoop.currentHoldA).toBeCloseTo(Math.SQRT2 * 2.8, 12);
    expect(axis.closedLoop.status).toBe("undersized");
    expect(axis.warnings).toEqual(expect.arrayContaining(["CL_KIT_UNDERSIZED", "HOLDING_LOAD"]));
    expect(axis.closedLoop.marginPct as number).toBeGreaterThan(15); // the margin alone would be ok
  });

  it("a datasheet curve exceeded: SPEED_BEYOND_CURVE and the last point held flat", () => {
    const input = hand();
    input.axes[0].motor.pullOutCurve = [
      { rpm: 0, torqueNm: 0.9 },
      { rpm: 100, torqueNm: 0.85 },
      { rpm: 200, torqueNm: 0.75 },
    ];
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.torqueAtSpeedNm).toBe(0.75);
    expect(axis.warnings).toContain("SPEED_BEYOND_CURVE");
    // within the curve: interpolated, no warning
    input.axes[0].duty.speedRpm = 150;
    const inside = evaluateCase(input).axes[0];
    expect(inside.openLoop.torqueAtSpeedNm).toBeCloseTo(0.8, 12);
    expect(inside.warnings).not.toContain("SPEED_BEYOND_CURVE");
  });

  it("a payback beyond the horizon is null, simple and discounted", () => {
    const input = hand();
    input.axes[0].retrofit.kit.price = "50000";
    const physics = evaluateCase(input).scenarios.physics;
    expect(physics.paybackYears).toBeNull();
    expect(physics.discountedPaybackYears).toBeNull();
    expect(physics.roiPct as number).toBeLessThan(0);
  });

  it("no sign change in the flows: IRR null (capex 0: payback 0, ROI null)", () => {
    const input = hand();
    Object.assign(input.axes[0].retrofit, { installHours: 0, commissioningCost: "0" });
    input.axes[0].retrofit.kit.price = "0";
    const physics = evaluateCase(input).scenarios.physics;
    expect(physics.cashFlows[0]).toBe("0");
    expect(physics.irr).toBeNull();
    expect(physics.paybackYears).toBe(0);
    expect(physics.discountedPaybackYears).toBe(0);
    expect(physics.roiPct).toBeNull();
  });

  it("flows that only lose money: IRR and payback null", () => {
    const input = hand();
    input.finance.annualServiceCost = "5000";
    const physics = evaluateCase(input).scenarios.physics;
    expect(physics.cashFlows.every((f) => Number(f) < 0)).toBe(true);
    expect(physics.irr).toBeNull();
    expect(physics.paybackYears).toBeNull();
  });

  it("sensorless below its minimum speed moves at I_max, holds with today's holding torque, avoids no events and is warned (docs/model.md (Currents at the operating point))", () => {
    const input = hand();
    input.axes[0].retrofit.kit.sensing = "sensorless";
    input.axes[0].duty.speedRpm = 30; // below the default 60 rpm
    const slowAxis = evaluateCase(input).axes[0];
    const slow = slowAxis.closedLoop;
    const iMax = Math.SQRT2 * 2.8;
    expect(slow.currentMoveA).toBeCloseTo(iMax, 12);
    // Same motor: k1·vf_hold·I_set·idle/k1' = 1 · 2.8 · 0.5 (micro, vf_hold = 1)
    expect(slow.currentHoldA).toBeCloseTo(0.5 * 2.8, 12);
    expect(slowAxis.warnings).toContain("SENSORLESS_LOW_SPEED");
    expect(slowAxis.savings.stepLossEventsAvoided).toBe(0);
    // sensorless has no encoder supply: standby 3 W only
    expect(slow.inputPowerW.off).toBe(3);
    input.axes[0].duty.speedRpm = 300;
    expect(evaluateCase(input).axes[0].closedLoop.currentMoveA).toBeLessThan(iMax);
  });

  it("a holding load warns HOLDING_LOAD and sets the closed-loop holding current to T_hold/k1", () => {
    const input = hand();
    input.axes[0].duty.holdTorqueNm = 0.3;
    const axis = evaluateCase(input).axes[0];
    expect(axis.warnings).toContain("HOLDING_LOAD");
    expect(axis.closedLoop.currentHoldA).toBeCloseTo(0.3 / (1.26 / (Math.SQRT2 * 2.8)), 12);
  });

  it("speed 0: no iron loss or drag, headroom null, throughput cap 0", () => {
    const input = hand();
    input.axes[0].duty.speedRpm = 0;
    input.machines[0] = { ...input.machines[0], throughputGainPct: 5, marginPerOutputHour: "30" };
    const result = evaluateCase(input);
    expect(result.axes[0].openLoop.ironLossW).toBe(0);
    expect(result.axes[0].savings.speedHeadroomPct).toBeNull();
    expect(result.machines[0].throughputGainPct).toBe(0);
    expect(result.machines[0].warnings).toEqual(["THROUGHPUT_CAPPED"]);
  });

  it("no torque at speed: margin null and the loop short (docs/model.md (Torque margin and speed))", () => {
    const input = hand();
    input.axes[0].duty.speedRpm = 20000; // back-EMF above the bus: no current
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.torqueAtSpeedNm).toBe(0);
    expect(axis.openLoop.marginPct).toBeNull();
    expect(axis.openLoop.status).toBe("step-loss");
    expect(axis.openLoop.loadAngleElecDeg).toBeNull();
    expect(axis.savings.torqueFreedPct).toBeNull();
  });

  it("max speed is 6000 when 6000 rpm still suffices and 0 when standstill falls short (docs/model.md (Torque margin and speed))", () => {
    const input = hand();
    Object.assign(input.axes[0].duty, { loadTorqueNm: 0.01, peakTorqueNm: 0.02, speedRpm: 100 });
    Object.assign(input.axes[0].motor, {
      hysteresisWPerHz: 0,
      eddyWPerHz2: 0,
      phaseInductanceMh: 0.01,
    });
    input.axes[0].drive.busVoltageV = 400;
    expect(evaluateCase(input).axes[0].closedLoop.maxSpeedRpm).toBe(6000);
    Object.assign(input.axes[0].duty, { loadTorqueNm: 0.7, peakTorqueNm: 0.8 });
    expect(evaluateCase(input).axes[0].openLoop.maxSpeedRpm).toBe(0);
  });

  it("warnings are a set in the documented order", () => {
    const input = hand();
    Object.assign(input.axes[0].drive, { currentSettingA: 10 });
    Object.assign(input.axes[0].duty, { movePct: 100, holdPct: 0, holdTorqueNm: 2, speedRpm: 30 });
    input.axes[0].retrofit.kit.sensing = "sensorless";
    const warnings = evaluateCase(input).axes[0].warnings;
    expect(new Set(warnings).size).toBe(warnings.length);
    expect(warnings).toEqual([
      "OL_THERMAL_RUNAWAY",
      "CL_KIT_UNDERSIZED",
      "SAVING_OUTSIDE_BAND",
      "CURRENT_ABOVE_RATING",
      "HOLDING_LOAD",
      "OL_HOLD_SLIPS",
      "SENSORLESS_LOW_SPEED",
      "SENSORLESS_HOLDING_LOAD",
    ]);
  });

  it("the band includes its ends (docs/model.md (Energy and cooling))", () => {
    const first = evaluateCase(hand()).axes[0].savings.energyPct as number;
    const input = hand();
    input.band = { lowPct: first, highPct: first };
    const axis = evaluateCase(input).axes[0];
    expect(axis.savings.band).toBe("within");
    expect(axis.warnings).not.toContain("SAVING_OUTSIDE_BAND");
    input.band = { lowPct: first + 1e-9, highPct: 60 };
    expect(evaluateCase(input).axes[0].savings.band).toBe("below");
    input.band = { lowPct: 0, highPct: first - 1e-9 };
    expect(evaluateCase(input).axes[0].savings.band).toBe("above");
  });
});
