import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { NonFiniteResultError } from "@/lib/engine/evaluate";
import { modelTorqueNm, torqueModel } from "@/lib/engine/capability";
import { dragTorqueNm } from "@/lib/engine/motor";
import { COPPER_MELTING_C, insulationLifeFactor } from "@/lib/engine/thermal";
import { FIELD_BOUNDS, MONEY_MAX, type BoundedField } from "@/lib/engine/schema-fields";

// Issue 13, finding 6: "no NaN or Infinity ever leaves the engine". Every input field of a case
// is drawn at an end of its FIELD_BOUNDS (or of its schema range where the field has no
// registry entry) or anywhere between, in any combination, with both duty forms (typed and
// from a mechanism), both kit sensings, optional fields present and absent. Each case must
// parse, and evaluateCase must return a result whose every number and decimal string is finite:
// the guard in evaluate.ts throws NonFiniteResultError otherwise, and that fails the test.
// Seeded, so a failure replays with the printed counterexample.

/** The smallest double above x: the "minimum" of a bound that excludes its own end. */
const justAbove = (x: number) => {
  if (x === 0) return Number.MIN_VALUE;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  view.setBigUint64(0, x > 0 ? bits + 1n : bits - 1n);
  return view.getFloat64(0);
};

/** A number in [min, max] (or (min, max]): either end three times in four, else between. */
const span = (min: number, max: number, minExclusive = false) => {
  const low = minExclusive ? justAbove(min) : min;
  return fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(low, max) },
    {
      weight: 1,
      arbitrary: fc.double({ min: low, max, noNaN: true, noDefaultInfinity: true }),
    },
  );
};
const field = (key: BoundedField) => {
  const b: { min: number; minExclusive?: boolean; max: number } = FIELD_BOUNDS[key];
  return span(b.min, b.max, b.minExclusive === true);
};
const whole = (min: number, max: number) =>
  fc.oneof({ weight: 3, arbitrary: fc.constantFrom(min, max) }, fc.integer({ min, max }));
const wholeField = (key: BoundedField) => whole(FIELD_BOUNDS[key].min, FIELD_BOUNDS[key].max);
const pct = span(0, 100);
const efficiencyPct = field("efficiencyPct");
const below100 = fc.oneof(
  fc.constantFrom(0, 100 - 1e-9),
  fc.double({ min: 0, max: 99.999, noNaN: true }),
);
const money = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom("0", MONEY_MAX, "0.01") },
  fc.integer({ min: 0, max: 1_000_000_000 }).map(String),
);
const maybe = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });

const motor = fc
  .record(
    {
      rotorTeeth: wholeField("rotorTeeth"),
      holdingTorqueNm: field("holdingTorqueNm"),
      ratedCurrentA: field("ratedCurrentA"),
      phaseResistanceOhm: field("phaseResistanceOhm"),
      phaseInductanceMh: field("phaseInductanceMh"),
      thermalResistanceKPerW: maybe(field("thermalResistanceKPerW")),
      ratedTempRiseK: field("ratedTempRiseK"),
      insulationClass: fc.constantFrom("B", "F", "H"),
      hysteresisWPerHz: field("hysteresisWPerHz"),
      eddyWPerHz2: field("eddyWPerHz2"),
      pullOutCurve: maybe(
        fc
          .tuple(field("speedRpm"), field("speedRpm"), field("dutyTorqueNm"), field("dutyTorqueNm"))
          .map(([a, b, ta, tb]) =>
            a === b
              ? [{ rpm: a, torqueNm: ta }]
              : [
                  { rpm: Math.min(a, b), torqueNm: ta },
                  { rpm: Math.max(a, b), torqueNm: tb },
                ],
          ),
      ),
    },
    { requiredKeys: [] },
  )
  .map((m) => ({
    // The required fields are always there; requiredKeys: [] only lets the optional ones go.
    rotorTeeth: 50,
    holdingTorqueNm: 1,
    ratedCurrentA: 2,
    phaseResistanceOhm: 1,
    phaseInductanceMh: 3,
    ...m,
  }));

const drive = fc.record({
  busVoltageV: field("busVoltageV"),
  currentSettingA: field("currentSettingA"),
  currentConvention: fc.constantFrom("peak", "rms"),
  stepMode: fc.constantFrom("full", "half", "half-compensated", "micro"),
  microsteps: wholeField("microsteps"),
  idleCurrentPct: pct,
  efficiencyPct: efficiencyPct,
  standbyW: field("standbyW"),
  resonance: maybe(
    fc
      .tuple(field("speedRpm"), field("speedRpm"), pct)
      .map(([a, b, deratePct]) => ({ fromRpm: Math.min(a, b), toRpm: Math.max(a, b), deratePct })),
  ),
});

const motion = fc
  .record({
    mechanism: fc.constantFrom("belt", "rack", "screw", "rotary"),
    radiusMm: field("radiusMm"),
    leadMm: field("leadMm"),
    efficiencyPct: maybe(efficiencyPct),
    gearRatio: field("gearRatio"),
    gearEfficiencyPct: efficiencyPct,
    massKg: field("massKg"),
    loadInertiaKgM2: field("inertiaKgM2"),
    motorInertiaKgM2: fc.oneof(fc.constant(0), field("rotorInertiaKgM2")),
    inclineDeg: span(0, 90),
    frictionCoeff: field("frictionCoeff"),
    externalForceN: field("externalForceN"),
    externalTorqueNm: field("dutyTorqueNm"),
    stroke: field("stroke"),
    moveTimeS: field("moveTimeS"),
    accelSharePct: field("accelSharePct"),
    dwellTimeS: field("dwellTimeS"),
    returnMove: fc.boolean(),
    energizedPct: pct,
    maxInertiaRatio: field("maxInertiaRatio"),
  })
  .map((m) => m);

const typedDuty = fc
  .record({
    movePct: pct,
    holdShare: span(0, 1),
    speedRpm: field("speedRpm"),
    loadTorqueNm: field("dutyTorqueNm"),
    peakExtra: span(0, 1),
    holdTorqueNm: field("dutyTorqueNm"),
  })
  .map(({ movePct, holdShare, loadTorqueNm, peakExtra, ...rest }) => ({
    ...rest,
    movePct,
    holdPct: (100 - movePct) * holdShare,
    loadTorqueNm,
    peakTorqueNm: loadTorqueNm + (FIELD_BOUNDS.dutyTorqueNm.max - loadTorqueNm) * peakExtra,
  }));

const duty = fc
  .record({
    hoursPerYear: field("hoursPerYear"),
    ambientC: field("ambientC"),
    typed: typedDuty,
    motion: maybe(motion),
  })
  .map(({ hoursPerYear, ambientC, typed, motion }) =>
    motion === undefined
      ? { hoursPerYear, ambientC, ...typed }
      : { hoursPerYear, ambientC, motion },
  );

const kit = fc.record(
  {
    price: money,
    sensing: fc.constantFrom("encoder", "sensorless"),
    motor: maybe(motor),
    maxCurrentPeakA: maybe(field("maxCurrentPeakA")),
    busVoltageV: maybe(field("busVoltageV")),
    efficiencyPct: efficiencyPct,
    standbyW: field("standbyW"),
    encoderW: maybe(field("standbyW")),
    minCurrentPct: pct,
    sensorlessMinRpm: field("speedRpm"),
  },
  { requiredKeys: ["price"] },
);

const reliability = fc.oneof(
  fc.record({
    stepLossEventsPerYear: field("stepLossEventsPerYear"),
    costPerEvent: money,
    avoidedPct: pct,
  }),
  fc.record({
    stepLossEventsPerYear: field("stepLossEventsPerYear"),
    avoidedPct: pct,
    event: fc.record({
      downtimeMinutes: field("downtimeMinutes"),
      scrapParts: wholeField("scrapParts"),
      scrapCostPerPart: money,
      restartLaborHours: field("restartLaborHours"),
    }),
  }),
);

const axis = fc.record({
  quantity: wholeField("quantity"),
  motor,
  drive,
  duty,
  reliability,
  kit,
  discountPct: pct,
  installHours: field("installHours"),
  commissioningCost: money,
  maintenanceSavingPerYear: money,
});

const finance = fc.record({
  tariffPerKWh: money,
  tariffEscalationPct: field("ratePct"),
  discountRatePct: field("discountRatePct"),
  horizonYears: whole(1, 30),
  laborRatePerHour: money,
  downtimeCostPerHour: money,
  projectOneTimeCost: money,
  annualServiceCost: money,
  coolingCop: fc.option(field("coolingCop"), { nil: null }),
  gridKgCo2PerKWh: field("gridKgCo2PerKWh"),
  inflationPct: field("ratePct"),
  taxRatePct: below100,
  depreciationYears: whole(1, 30),
});

const machine = fc.record({
  downtimeHours: field("downtimeHours"),
  throughputGainPct: field("throughputGainPct"),
  marginPerOutputHour: money,
});

const extremeCase = fc
  .record({
    finance,
    machines: fc.array(machine, { minLength: 1, maxLength: 2 }),
    axes: fc.array(fc.tuple(axis, fc.nat()), { minLength: 1, maxLength: 3 }),
    openLoopRequiredPct: below100,
    closedLoopRequiredPct: below100,
    band: fc.tuple(field("bandPct"), field("bandPct")),
    swingPct: pct,
    lifeHalvingK: field("lifeHalvingK"),
  })
  .map((c) => ({
    currency: "EUR",
    finance: c.finance,
    margins: {
      openLoopRequiredPct: c.openLoopRequiredPct,
      closedLoopRequiredPct: c.closedLoopRequiredPct,
    },
    band: { lowPct: Math.min(...c.band), highPct: Math.max(...c.band) },
    sensitivity: { swingPct: c.swingPct },
    thermal: { lifeHalvingK: c.lifeHalvingK },
    machines: c.machines.map((m, i) => ({ id: `M${i}`, name: `Machine ${i}`, ...m })),
    axes: c.axes.map(([a, pick], i) => ({
      id: `A${i}`,
      label: `Axis ${i}`,
      machineId: `M${pick % c.machines.length}`,
      quantity: a.quantity,
      motor: a.motor,
      drive: a.drive,
      duty: a.duty,
      reliability: a.reliability,
      retrofit: {
        kit: { id: `K${i}`, name: `Kit ${i}`, ...a.kit },
        discountPct: a.discountPct,
        installHours: a.installHours,
        commissioningCost: a.commissioningCost,
        maintenanceSavingPerYear: a.maintenanceSavingPerYear,
      },
    })),
  }));

const FINITE_DECIMAL = /^-?\d+(\.\d+)?$/;

/** Every number finite and every decimal string a plain finite decimal; returns the bad paths. */
function nonFinitePaths(value: unknown, path = ""): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [path];
  if (typeof value === "string") return /^[+-]?(NaN|Infinity)$/.test(value) ? [path] : [];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (typeof value === "object" && value !== null)
    return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, path ? `${path}.${k}` : k));
  return [];
}

describe("the engine at the ends of FIELD_BOUNDS", () => {
  it("gives only finite figures for every combination of extreme inputs (fast-check, 400 cases, seed 1313)", () => {
    fc.assert(
      fc.property(extremeCase, (input) => {
        const parsed = caseInputSchema.safeParse(input);
        if (!parsed.success) throw new Error(JSON.stringify(parsed.error.issues.slice(0, 3)));
        let result;
        try {
          result = evaluateCase(input);
        } catch (error) {
          if (error instanceof NonFiniteResultError) throw new Error(error.message);
          throw error;
        }
        expect(nonFinitePaths(result)).toEqual([]);
        expect(result.scenarios.physics.npv).toMatch(FINITE_DECIMAL);
        for (const row of result.sensitivity) {
          expect(row.low.npv).toMatch(FINITE_DECIMAL);
          expect(row.high.npv).toMatch(FINITE_DECIMAL);
        }
      }),
      { numRuns: 400, seed: 1313 },
    );
  }, 600_000);
});

const fixture = () =>
  JSON.parse(fs.readFileSync(path.resolve("tests/fixtures/engine-case.json"), "utf8")) as {
    thermal?: { lifeHalvingK: number };
    finance: Record<string, unknown>;
    axes: {
      motor: Record<string, unknown>;
      drive: Record<string, unknown>;
      duty: Record<string, unknown>;
    }[];
  };

describe("the sources that overflowed before", () => {
  it("reports the insulation-life factor only below the melting point of copper", () => {
    // 2^((100 − 60)/10) = 16, the rule of docs/model.md (Winding temperature).
    expect(insulationLifeFactor(100, 60, 10)).toBe(16);
    expect(insulationLifeFactor(COPPER_MELTING_C, 60, 2)).toBeGreaterThan(0);
    expect(Number.isFinite(insulationLifeFactor(COPPER_MELTING_C, -40, 2))).toBe(true);
    expect(insulationLifeFactor(COPPER_MELTING_C + 1, 60, 10)).toBeNull();
    expect(insulationLifeFactor(60, 5000, 10)).toBeNull();
    // 1084.62 °C: the freezing point of copper, a defining fixed point of ITS-90.
    expect(COPPER_MELTING_C).toBe(1084.62);
  });

  it("gives a 1 A, 0.5 Ω winding at 60,000 rpm a finite result and no life factor", () => {
    // Before: both windings settle (no runaway) at some 10^5 °C, and 2^(ΔT/10) with ΔT near
    // 10^5 K overflowed, so the case answered 422 (thermal.ts).
    const input = fixture();
    const axis = input.axes[0];
    Object.assign(axis.motor, { ratedCurrentA: 1, phaseResistanceOhm: 0.5 });
    Object.assign(axis.duty, { speedRpm: 60_000 });
    input.thermal = { lifeHalvingK: 10 };
    const result = evaluateCase(input);
    expect(nonFinitePaths(result)).toEqual([]);
    const { openLoop, closedLoop, savings } = result.axes[0];
    expect(openLoop.windingTempC).toBeGreaterThan(COPPER_MELTING_C);
    expect(closedLoop.windingTempC).toBeGreaterThan(COPPER_MELTING_C);
    expect(2 ** ((openLoop.windingTempC! - closedLoop.windingTempC!) / 10)).toBe(Infinity);
    expect(savings.insulationLifeFactor).toBeNull();
    expect(result.axes[0].warnings).toContain("OL_WINDING_OVER_CLASS");
  });

  it("takes the hysteresis drag as its limit where the speed underflows", () => {
    const motor = caseInputSchema.parse(fixture()).axes[0].motor;
    // P_fe/ω_m = N_r·(k_h + k_e·f_e)/(2π): at 10^-320 rpm that is N_r·k_h/(2π).
    expect(dragTorqueNm(motor, 5e-324)).toBeCloseTo((50 * 0.004) / (2 * Math.PI), 12);
    expect(dragTorqueNm(motor, 1e-9)).toBeCloseTo((50 * 0.004) / (2 * Math.PI), 12);
    // The flat model behind the torque curve takes the same limit: just above standstill the
    // torque runs on continuously from a small ordinary speed, not to 0 from a 0/0 (NaN) that
    // the clamp at 0 would hide.
    const model = torqueModel(motor, {
      currentLimitA: 1.5 * motor.ratedCurrentA,
      resistanceOhm: motor.phaseResistanceOhm,
      busVoltageV: 24,
    });
    const nearRest = modelTorqueNm(model, 1e-6);
    expect(nearRest).toBeGreaterThan(0);
    for (const rpm of [5e-324, 1e-320, 1e-300]) {
      expect(modelTorqueNm(model, rpm)).toBeCloseTo(nearRest, 6);
    }
  });

  it("refuses the values that used to divide by almost nothing, naming the bound", () => {
    const input = fixture();
    input.thermal = { lifeHalvingK: 1 };
    input.finance.coolingCop = 0.01;
    input.finance.discountRatePct = -50;
    input.axes[0].drive.efficiencyPct = 0.5;
    input.axes[0].duty.motion = {
      mechanism: "belt",
      radiusMm: 1e-300,
      stroke: 100,
      moveTimeS: 1e-9,
      motorInertiaKgM2: 1e-300,
      accelSharePct: 0.001,
    };
    const parsed = caseInputSchema.safeParse(input);
    const messages = parsed.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(messages).toEqual(
      expect.arrayContaining([
        "thermal.lifeHalvingK: must be at least 2 K",
        "finance.coolingCop: must be at least 0.1",
        "finance.discountRatePct: must be at least -20 %",
        "axes.0.drive.efficiencyPct: must be at least 1 %",
        "axes.0.duty.motion.radiusMm: must be at least 0.1 mm",
        "axes.0.duty.motion.moveTimeS: must be at least 0.001 s",
        "axes.0.duty.motion.motorInertiaKgM2: must be 0 (unknown) or at least 1e-9 kg·m²",
        "axes.0.duty.motion.accelSharePct: must be at least 1 %",
      ]),
    );
  });
});
