import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { maxSpeedRpm, torqueModel, type Capability } from "@/lib/engine/capability";
import { headroomForGain, speedHeadroomPct } from "@/lib/engine/margin";
import type { ParsedMotor } from "@/lib/engine/schema";

// Invented closed-loop motors and kits, drawn around NEMA 17–34 class values.
const drawArb = fc.record({
  holdingTorqueNm: fc.double({ min: 0.2, max: 6, noNaN: true }),
  ratedCurrentA: fc.double({ min: 1, max: 6, noNaN: true }),
  resistanceOhm: fc.double({ min: 0.2, max: 4, noNaN: true }),
  inductanceMh: fc.double({ min: 0.3, max: 12, noNaN: true }),
  hysteresisWPerHz: fc.double({ min: 0, max: 0.01, noNaN: true }),
  eddyWPerHz2: fc.double({ min: 0, max: 1e-5, noNaN: true }),
  busVoltageV: fc.constantFrom(24, 36, 48, 72),
  requiredPct: fc.constantFrom(0, 10, 15, 30),
  peakShare: fc.double({ min: 0, max: 1.1, noNaN: true }),
  speedRpm: fc.integer({ min: 0, max: 3000 }),
  gainPct: fc.constantFrom(0.5, 5, 10, 25, 100, 400),
});

type Draw = typeof drawArb extends fc.Arbitrary<infer T> ? T : never;

function capabilityOf(d: Draw): Capability {
  const motor = {
    rotorTeeth: 50,
    holdingTorqueNm: d.holdingTorqueNm,
    ratedCurrentA: d.ratedCurrentA,
    phaseResistanceOhm: d.resistanceOhm,
    phaseInductanceMh: d.inductanceMh,
    hysteresisWPerHz: d.hysteresisWPerHz,
    eddyWPerHz2: d.eddyWPerHz2,
  } as ParsedMotor;
  return {
    model: torqueModel(motor, {
      currentLimitA: Math.SQRT2 * d.ratedCurrentA,
      resistanceOhm: d.resistanceOhm * 1.2,
      busVoltageV: d.busVoltageV,
    }),
  };
}

describe("the throughput cap's headroom (docs/model.md (Torque margin and speed to The business case))", () => {
  it("caps the gain exactly as the full bisection does: min(gain, headroom) is the same", () => {
    fc.assert(
      fc.property(drawArb, (d) => {
        const capability = capabilityOf(d);
        const peakTorqueNm = d.peakShare * d.holdingTorqueNm;
        const op = { speedRpm: d.speedRpm, peakTorqueNm };
        const exact = speedHeadroomPct(
          maxSpeedRpm(capability, d.requiredPct, peakTorqueNm),
          d.speedRpm,
        );
        const quick = headroomForGain(capability, d.requiredPct, op, d.gainPct);
        if (exact === null) expect(quick).toBeNull();
        else expect(Math.min(d.gainPct, quick!)).toBe(Math.min(d.gainPct, exact));
      }),
      { numRuns: 3000 },
    );
  });

  it("returns the bisection's own headroom when it falls short of the gain", () => {
    // A gain far beyond what any of these motors reaches at 1000 rpm: the bisection decides.
    const d = fc.sample(drawArb, { seed: 7, numRuns: 1 })[0];
    const capability = capabilityOf(d);
    const op = { speedRpm: 1000, peakTorqueNm: 0.3 * d.holdingTorqueNm };
    const exact = speedHeadroomPct(maxSpeedRpm(capability, 15, op.peakTorqueNm), 1000);
    expect(headroomForGain(capability, 15, op, 10_000)).toBe(exact);
  });
});
