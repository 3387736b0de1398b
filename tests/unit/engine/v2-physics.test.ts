import fc from "fast-check";
import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { caseInputSchema, evaluateCase, formatIssues, torqueSpeedCurve } from "@/lib/engine";
import { largestTorqueCurrentA, modelTorqueNm, torqueModel } from "@/lib/engine/capability";
import { derivedMotion } from "@/lib/engine/motion";
import { motionInputSchema } from "@/lib/engine/schema";
import { INERTIA_FACTORS_TO_KG_M2, STANDARD_GRAVITY } from "@/lib/engine/units";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const hand = (): Json => structuredClone(handCase) as Json;
const motion = (fields: Json) => derivedMotion(motionInputSchema.parse(fields));

describe("motion from the mechanism (REFERENCES: textbook kinematics, CGPM 1901)", () => {
  it("standard gravity is 9.806 65 m/s² exactly (CGPM 1901; NIST SP 330)", () => {
    expect(STANDARD_GRAVITY).toBe(9.80665);
  });

  it("a 5 kg mass on a 15 mm pulley reflects m·r² = 1.125·10⁻³ kg·m² (textbook kinematics)", () => {
    const m = motion({ mechanism: "belt", radiusMm: 15, massKg: 5, stroke: 100, moveTimeS: 1 });
    expect(m.reflectedInertiaKgM2).toBeCloseTo(1.125e-3, 15);
  });

  it("a 10 kg mass on a 10 mm lead screw reflects m·(p/2π)² = 2.533·10⁻⁵ kg·m² (textbook kinematics)", () => {
    const m = motion({ mechanism: "screw", leadMm: 10, massKg: 10, stroke: 100, moveTimeS: 1 });
    expect(m.reflectedInertiaKgM2).toBeCloseTo(2.533e-5, 8);
  });

  it("a gear of ratio G divides the reflected inertia by G² (textbook kinematics)", () => {
    const fields = { mechanism: "belt", radiusMm: 15, massKg: 5, stroke: 100, moveTimeS: 1 };
    const direct = motion(fields).reflectedInertiaKgM2;
    expect(motion({ ...fields, gearRatio: 3 }).reflectedInertiaKgM2).toBeCloseTo(direct / 9, 15);
  });

  it("pushing 100 N through a 10 mm screw at η 0.9 takes F·p/(2π·η) = 0.176 84 N·m (textbook machine design)", () => {
    // No mass and no inertia: every phase of the move carries the process force alone.
    const m = motion({
      mechanism: "screw",
      leadMm: 10,
      externalForceN: 100,
      stroke: 50,
      moveTimeS: 1,
      returnMove: false,
    });
    expect(m.loadTorqueNm).toBeCloseTo(0.17684, 5);
    expect(m.peakTorqueNm).toBeCloseTo(0.17684, 5);
  });

  it("a trapezoidal move of 400 mm in 0.5 s with 0.125 s ramps tops out at s/(t − t_a) = 1.0667 m/s (textbook kinematics)", () => {
    const m = motion({
      mechanism: "belt",
      radiusMm: 20,
      stroke: 400,
      moveTimeS: 0.5,
      accelSharePct: 25,
    });
    const topSpeed = ((m.speedRpm * 2 * Math.PI) / 60) * 0.02;
    expect(topSpeed).toBeCloseTo(1.0667, 4);
  });

  it("the load torque is the RMS over the moving time, √(Σ T²·t / Σ t) (motion-sizing practice)", () => {
    // A 4 kg carriage on a vertical belt: up and back down, with rotor inertia.
    const fields = {
      mechanism: "belt",
      radiusMm: 12,
      massKg: 4,
      inclineDeg: 90,
      motorInertiaKgM2: 4.8e-5,
      stroke: 200,
      moveTimeS: 0.4,
      accelSharePct: 25,
      dwellTimeS: 0.6,
      efficiencyPct: 95,
    };
    const m = motion(fields);
    const k = 0.012;
    const eta = 0.95;
    const omega = 0.2 / k / (0.4 - 0.1);
    const acc = omega / 0.1;
    const j = 4.8e-5 + (4 * k * k) / eta;
    const up = (4 * 9.80665 * k) / eta; // the motor lifts
    const down = -4 * 9.80665 * k * eta; // the load drives, through the belt's efficiency
    const phases = [up, down].flatMap((tl) => [
      [tl + j * acc, 0.1],
      [tl, 0.2],
      [tl - j * acc, 0.1],
    ]);
    const rms = Math.sqrt(phases.reduce((s, [t, dt]) => s + t * t * dt, 0) / 0.8);
    expect(m.loadTorqueNm).toBeCloseTo(rms, 12);
    expect(m.peakTorqueNm).toBeCloseTo(Math.max(...phases.map(([t]) => Math.abs(t))), 12);
    expect(m.holdTorqueNm).toBeCloseTo(4 * 9.80665 * k, 12);
    expect(m.movePct).toBeCloseTo((100 * 0.8) / 2, 12);
    expect(m.holdPct).toBeCloseTo((100 * 1.2) / 2, 12);
    expect(m.inertiaRatio).toBeCloseTo((4 * k * k) / 4.8e-5, 12);
  });

  it("a screw at 45 % efficiency is self-locking: back-driving ≈ 2 − 1/η ≤ 0, nothing held at rest (textbook approximation, from memory)", () => {
    const m = motion({
      mechanism: "screw",
      leadMm: 5,
      efficiencyPct: 45,
      massKg: 20,
      inclineDeg: 90,
      stroke: 100,
      moveTimeS: 1,
    });
    expect(m.holdTorqueNm).toBe(0);
  });

  it("inertia units convert by NIST SP 811 factors: 1 lb·in² = 2.926 397·10⁻⁴ kg·m², 1 ozf·in·s² = 7.061 552·10⁻³ kg·m²", () => {
    const parsed = motionInputSchema.parse({
      mechanism: "rotary",
      stroke: 90,
      moveTimeS: 0.5,
      loadInertiaKgM2: { value: 2, unit: "lb·in²" },
      motorInertiaKgM2: { value: 300, unit: "g·cm²" },
    });
    expect(parsed.loadInertiaKgM2).toBeCloseTo(2 * 2.926397e-4, 15);
    expect(parsed.motorInertiaKgM2).toBeCloseTo(300e-7, 15);
    expect(INERTIA_FACTORS_TO_KG_M2["ozf·in·s²"]).toBe(7.061552e-3);
    expect(INERTIA_FACTORS_TO_KG_M2["kg·cm²"]).toBe(1e-4);
  });
});

describe("motion in a case: validation and results", () => {
  const withMotion = (fields: Json): Json => {
    const input = hand();
    const duty = input.axes[0].duty;
    for (const key of ["speedRpm", "loadTorqueNm", "peakTorqueNm", "movePct", "holdPct"])
      delete duty[key];
    duty.motion = fields;
    return input;
  };

  it("a screw without its lead is refused at the field's path", () => {
    const parsed = caseInputSchema.safeParse(
      withMotion({ mechanism: "screw", stroke: 100, moveTimeS: 1 }),
    );
    expect(parsed.success).toBe(false);
    expect(formatIssues(parsed.error!)).toEqual([
      "axes[0].duty.motion.leadMm: required for a screw: the lead in mm per screw turn",
    ]);
  });

  it("without motion the typed duty figures are required, each at its path", () => {
    const input = hand();
    delete input.axes[0].duty.peakTorqueNm;
    const parsed = caseInputSchema.safeParse(input);
    expect(formatIssues(parsed.error!)).toEqual([
      "axes[0].duty.peakTorqueNm: required: expected a number (or give duty.motion to derive it)",
    ]);
  });

  it("the result's motion block is what the physics used, and the warnings follow from it", () => {
    const result = evaluateCase(
      withMotion({
        mechanism: "belt",
        radiusMm: 12,
        massKg: 3,
        stroke: 300,
        moveTimeS: 0.6,
        dwellTimeS: 0.4,
      }),
    );
    const axis = result.axes[0];
    expect(axis.motion).not.toBeNull();
    expect(axis.openLoop.marginPct).toBeCloseTo(
      100 * (1 - axis.motion!.peakTorqueNm / axis.openLoop.torqueAtSpeedNm),
      10,
    );
    expect(axis.warnings).toContain("MOTOR_INERTIA_UNKNOWN");
    const heavy = evaluateCase(
      withMotion({
        mechanism: "belt",
        radiusMm: 20,
        massKg: 10,
        motorInertiaKgM2: 3e-5,
        stroke: 300,
        moveTimeS: 0.6,
      }),
    ).axes[0];
    expect(heavy.motion!.inertiaRatio).toBeGreaterThan(10);
    expect(heavy.warnings).toContain("INERTIA_RATIO_HIGH");
  });
});

describe("torque at speed with a free current angle (docs/model.md (Torque at speed))", () => {
  const motorArb = fc.record({
    holdingTorqueNm: fc.double({ min: 0.2, max: 6, noNaN: true }),
    ratedCurrentA: fc.double({ min: 0.5, max: 6, noNaN: true }),
    phaseResistanceOhm: fc.double({ min: 0.1, max: 5, noNaN: true }),
    phaseInductanceMh: fc.double({ min: 0.3, max: 15, noNaN: true }),
    currentLimitA: fc.double({ min: 0.3, max: 8, noNaN: true }),
    busVoltageV: fc.constantFrom(12, 24, 36, 48, 80),
    rpm: fc.double({ min: 0, max: 6000, noNaN: true }),
  });
  const modelOf = (d: Json) =>
    torqueModel(
      {
        rotorTeeth: 50,
        holdingTorqueNm: d.holdingTorqueNm,
        ratedCurrentA: d.ratedCurrentA,
        phaseResistanceOhm: d.phaseResistanceOhm,
        phaseInductanceMh: d.phaseInductanceMh,
        ratedTempRiseK: 80,
        insulationClass: "B",
        hysteresisWPerHz: 0,
        eddyWPerHz2: 0,
      },
      {
        currentLimitA: d.currentLimitA,
        resistanceOhm: d.phaseResistanceOhm,
        busVoltageV: d.busVoltageV,
      },
    );

  it("the closed form equals a brute-force search over the current angle and magnitude", () => {
    fc.assert(
      fc.property(motorArb, (d) => {
        const m = modelOf(d);
        const w = (2 * Math.PI * d.rpm) / 60;
        const e = m.k1 * w;
        const x = 50 * w * m.inductanceH;
        const r = m.resistanceOhm;
        let best = 0;
        // The best i_q for each i_d lies on the edge of one disc: search i_d finely.
        for (let k = 0; k <= 4000; k++) {
          const id = -d.currentLimitA + (2 * d.currentLimitA * k) / 4000;
          const byCurrent = Math.sqrt(Math.max(0, d.currentLimitA ** 2 - id * id));
          // |v|² = (R·i_d − X·i_q)² + (X·i_d + R·i_q + E)² ≤ V²: largest i_q by the quadratic.
          const a = r * r + x * x;
          const b = 2 * (-r * x * id + (x * id + e) * r);
          const c = (r * id) ** 2 + (x * id + e) ** 2 - d.busVoltageV ** 2;
          const disc = b * b - 4 * a * c;
          if (disc < 0) continue;
          const byVoltage = (-b + Math.sqrt(disc)) / (2 * a);
          const low = (-b - Math.sqrt(disc)) / (2 * a);
          const iq = Math.min(byCurrent, byVoltage);
          if (iq >= Math.max(-byCurrent, low)) best = Math.max(best, iq);
        }
        const closed = Math.max(0, largestTorqueCurrentA(m, d.rpm));
        expect(closed).toBeGreaterThanOrEqual(best - 1e-9 * (1 + best));
        expect(closed).toBeLessThanOrEqual(best + 2e-3 * (1 + best));
      }),
      { numRuns: 300 },
    );
  });

  it("where the current limit is inactive, T = (V·E/Z − E²·R/Z²)/ω_m (steady-state phasor result — from memory)", () => {
    fc.assert(
      fc.property(motorArb, (d) => {
        const m = modelOf({ ...d, currentLimitA: 1e6 });
        fc.pre(d.rpm > 1);
        const w = (2 * Math.PI * d.rpm) / 60;
        const e = m.k1 * w;
        const r = m.resistanceOhm;
        const z = Math.hypot(r, 50 * w * m.inductanceH);
        const expected = Math.max(0, (d.busVoltageV * e) / z - (e * e * r) / (z * z)) / w;
        expect(modelTorqueNm(m, d.rpm)).toBeCloseTo(expected, 9);
      }),
    );
  });

  it("the torque never rises with speed (no resonance)", () => {
    fc.assert(
      fc.property(motorArb, (d) => {
        const m = modelOf(d);
        let previous = Infinity;
        for (let rpm = 0; rpm <= 6000; rpm += 50) {
          const t = modelTorqueNm(m, rpm);
          expect(t).toBeLessThanOrEqual(previous + 1e-12);
          previous = t;
        }
      }),
      { numRuns: 200 },
    );
  });

  it("matches the current-in-phase solution wherever that is the optimum (low speed)", () => {
    fc.assert(
      fc.property(motorArb, (d) => {
        const m = modelOf(d);
        const w = (2 * Math.PI * d.rpm) / 60;
        const e = m.k1 * w;
        const x = 50 * w * m.inductanceH;
        const r = m.resistanceOhm;
        // i_d = 0: (e + R·I)² + (X·I)² = V², the positive root.
        const a = r * r + x * x;
        const c = e * e - d.busVoltageV ** 2;
        const inPhase =
          c >= 0 ? 0 : (-2 * e * r + Math.sqrt(4 * e * e * r * r - 4 * a * c)) / (2 * a);
        // In-phase reaches the full current limit: it is the optimum, and the free angle agrees.
        fc.pre(inPhase >= d.currentLimitA);
        expect(largestTorqueCurrentA(m, d.rpm)).toBeCloseTo(d.currentLimitA, 12);
        // Elsewhere the free angle never does worse.
        expect(largestTorqueCurrentA(m, d.rpm)).toBeGreaterThanOrEqual(
          Math.min(inPhase, d.currentLimitA) - 1e-12,
        );
      }),
    );
  });

  it("open loop never exceeds closed loop with the same motor and bus and a current limit at least as high", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("full", "half", "half-compensated", "micro"),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        fc.integer({ min: 0, max: 3000 }),
        fc.constantFrom(24, 48),
        (stepMode, share, speedRpm, busVoltageV) => {
          const axis = hand().axes[0];
          Object.assign(axis.drive, { stepMode, currentSettingA: 2.8 * share, busVoltageV });
          Object.assign(axis.duty, { speedRpm, movePct: 0, holdPct: 0 });
          axis.retrofit.kit.maxCurrentPeakA = 4 * 2.8; // ≥ vf_run·I_set for every mode
          const open = torqueSpeedCurve(axis, "open", 31);
          const closed = torqueSpeedCurve(axis, "closed", 31);
          // No duty: both loops sit at ambient, so the resistances are equal.
          for (let i = 0; i < open.length; i++)
            expect(open[i].torqueNm).toBeLessThanOrEqual(closed[i].torqueNm + 1e-12);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("a NEMA 23 class motor on 24 V keeps torque at 1,000 rpm", () => {
    const axis = hand().axes[0];
    axis.drive.busVoltageV = 24;
    const curve = torqueSpeedCurve(axis, "open", 61);
    expect(curve.find((p) => p.rpm === 1000)!.torqueNm).toBeGreaterThan(0.3);
  });

  it("a mid-band resonance derates every speed past its start (model only)", () => {
    const axis = hand().axes[0];
    axis.drive.resonance = { fromRpm: 400, toRpm: 700, deratePct: 40 };
    const dipped = torqueSpeedCurve(axis, "open", 61);
    delete axis.drive.resonance;
    const clean = torqueSpeedCurve(axis, "open", 61);
    const atBandEnd = clean.find((p) => p.rpm === 700)!.torqueNm;
    for (let i = 0; i < clean.length; i++) {
      const rpm = clean[i].rpm;
      if (rpm < 400) expect(dipped[i].torqueNm).toBe(clean[i].torqueNm);
      else if (rpm <= 700) expect(dipped[i].torqueNm).toBeCloseTo(0.6 * clean[i].torqueNm, 12);
      else expect(dipped[i].torqueNm).toBeCloseTo(Math.min(clean[i].torqueNm, 0.6 * atBandEnd), 12);
      if (i > 0) expect(dipped[i].torqueNm).toBeLessThanOrEqual(dipped[i - 1].torqueNm + 1e-12);
    }
  });

  it("a datasheet curve of today's motor and bus bounds the closed loop from below", () => {
    const input = hand();
    input.axes[0].drive.busVoltageV = 24;
    input.axes[0].motor.pullOutCurve = [
      { rpm: 0, torqueNm: 0.9 },
      { rpm: 900, torqueNm: 0.63 },
      { rpm: 2000, torqueNm: 0.2 },
    ];
    input.axes[0].duty.speedRpm = 900;
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.torqueAtSpeedNm).toBeCloseTo(0.63, 12);
    expect(axis.closedLoop.torqueAtSpeedNm).toBeGreaterThanOrEqual(0.63);
  });
});

describe("currents at the operating point and holding (docs/model.md (Currents at the operating point), docs/model.md (Winding temperature), docs/model.md (Torque margin and speed))", () => {
  it("the default thermal resistance reproduces the datasheet rise exactly (common practice: the rise a datasheet states)", () => {
    const input = hand();
    Object.assign(input.axes[0].drive, {
      stepMode: "full",
      currentSettingA: 2.8,
      idleCurrentPct: 100,
    });
    Object.assign(input.axes[0].duty, { movePct: 0, holdPct: 100, ambientC: 20 });
    const t = evaluateCase(input).axes[0].openLoop.windingTempC as number;
    expect(Math.abs(t - 100) / 100).toBeLessThan(1e-12);
  });

  it("an open-loop drive short of voltage draws less than its setting; the kit pays field weakening", () => {
    const input = hand();
    Object.assign(input.axes[0].drive, { busVoltageV: 24 });
    Object.assign(input.axes[0].duty, { speedRpm: 1200, loadTorqueNm: 0.1, peakTorqueNm: 0.15 });
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.currentMoveA).toBeLessThan(2.8);
    const k1 = 1.26 / (Math.SQRT2 * 2.8);
    const fe = (50 * 1200) / 60;
    const drag = (0.004 * fe + 2e-6 * fe * fe) / ((2 * Math.PI * 1200) / 60);
    expect(axis.closedLoop.currentMoveA).toBeGreaterThan((0.1 + drag) / k1);
  });

  it("a load beyond what today's drive holds at rest warns OL_HOLD_SLIPS", () => {
    const input = hand();
    input.axes[0].duty.holdTorqueNm = 0.5; // k1·1.4 A = 0.445 N·m held today
    const axis = evaluateCase(input).axes[0];
    expect(axis.openLoop.holdingCapabilityNm).toBeCloseTo((1.26 / (Math.SQRT2 * 2.8)) * 1.4, 12);
    expect(axis.warnings).toEqual(expect.arrayContaining(["HOLDING_LOAD", "OL_HOLD_SLIPS"]));
    input.axes[0].duty.holdTorqueNm = 0.4;
    expect(evaluateCase(input).axes[0].warnings).not.toContain("OL_HOLD_SLIPS");
  });
});
