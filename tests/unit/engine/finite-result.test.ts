import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { assertFiniteResult, NonFiniteResultError } from "@/lib/engine/evaluate";
import { FIELD_BOUNDS, MONEY_MAX, type BoundedField } from "@/lib/engine/schema-fields";

// Issue 13, finding 6: inside FIELD_BOUNDS the engine's figures stay finite. Extreme but valid
// inputs (each bound itself, tiny values above an exclusive zero, and values between) go
// through the engine; every number of the result must be finite and every money string a
// finite decimal. The guard in evaluate.ts would throw otherwise, so the test also fails then.
const base = JSON.parse(
  fs.readFileSync(path.resolve("tests/fixtures/engine-case.json"), "utf8"),
) as Record<string, unknown>;

const within = (key: BoundedField) => {
  const b: { min: number; minExclusive?: boolean; max: number } = FIELD_BOUNDS[key];
  const low = b.minExclusive ? (b.min === 0 ? 1e-6 : b.min + 1e-6) : b.min;
  return fc.oneof(
    fc.constantFrom(low, b.max),
    fc.double({ min: low, max: b.max, noNaN: true, noDefaultInfinity: true }),
  );
};
const wholeWithin = (key: BoundedField) =>
  fc.integer({ min: FIELD_BOUNDS[key].min, max: FIELD_BOUNDS[key].max });
const pctValue = fc.oneof(fc.constantFrom(0, 100), fc.double({ min: 0, max: 100, noNaN: true }));
const moneyValue = fc.oneof(
  fc.constantFrom("0", MONEY_MAX, "0.01"),
  fc.integer({ min: 0, max: 1_000_000_000 }).map(String),
);

const extremeAxis = fc.record({
  quantity: wholeWithin("quantity"),
  rotorTeeth: wholeWithin("rotorTeeth"),
  holdingTorqueNm: within("holdingTorqueNm"),
  ratedCurrentA: within("ratedCurrentA"),
  phaseResistanceOhm: within("phaseResistanceOhm"),
  phaseInductanceMh: within("phaseInductanceMh"),
  busVoltageV: within("busVoltageV"),
  currentSettingA: within("currentSettingA"),
  microsteps: wholeWithin("microsteps"),
  hoursPerYear: within("hoursPerYear"),
  movePct: pctValue,
  speedRpm: within("speedRpm"),
  loadTorqueNm: within("dutyTorqueNm"),
  ambientC: within("ambientC"),
  events: within("stepLossEventsPerYear"),
  price: moneyValue,
  cost: moneyValue,
});

const extremeFinance = fc.record({
  tariffPerKWh: moneyValue,
  tariffEscalationPct: within("ratePct"),
  discountRatePct: within("discountRatePct"),
  horizonYears: fc.integer({ min: 1, max: 30 }),
});

type AxisDraw = typeof extremeAxis extends fc.Arbitrary<infer T> ? T : never;
type FinanceDraw = typeof extremeFinance extends fc.Arbitrary<infer T> ? T : never;
interface Axis {
  quantity: number;
  motor: Record<string, unknown>;
  drive: Record<string, unknown>;
  duty: Record<string, unknown>;
  reliability: Record<string, unknown>;
  retrofit: { kit: Record<string, unknown> };
}

function caseWith(a: AxisDraw, f: FinanceDraw) {
  const input = structuredClone(base) as { axes: Axis[]; finance: Record<string, unknown> };
  Object.assign(input.finance, f);
  const axis = input.axes[0];
  axis.quantity = a.quantity;
  Object.assign(axis.motor, {
    rotorTeeth: a.rotorTeeth,
    holdingTorqueNm: a.holdingTorqueNm,
    ratedCurrentA: a.ratedCurrentA,
    phaseResistanceOhm: a.phaseResistanceOhm,
    phaseInductanceMh: a.phaseInductanceMh,
  });
  Object.assign(axis.drive, {
    busVoltageV: a.busVoltageV,
    currentSettingA: a.currentSettingA,
    microsteps: a.microsteps,
  });
  Object.assign(axis.duty, {
    hoursPerYear: a.hoursPerYear,
    movePct: a.movePct,
    holdPct: 100 - a.movePct,
    speedRpm: a.speedRpm,
    loadTorqueNm: a.loadTorqueNm,
    peakTorqueNm: a.loadTorqueNm,
    ambientC: a.ambientC,
  });
  axis.reliability = { stepLossEventsPerYear: a.events, costPerEvent: a.cost };
  axis.retrofit.kit.price = a.price;
  return input;
}

const FINITE_DECIMAL = /^-?\d+(\.\d+)?$/;

describe("the engine's result inside FIELD_BOUNDS", () => {
  // Every figure finite: the guard in evaluate.ts would throw NonFiniteResultError otherwise,
  // and this test lets no error through. bounds-extremes.test.ts covers every field.
  it("is finite for extreme but valid input (fast-check, 300 cases)", () => {
    fc.assert(
      fc.property(extremeAxis, extremeFinance, (a, f) => {
        const input = caseWith(a, f);
        expect(caseInputSchema.safeParse(input).success).toBe(true);
        const result = evaluateCase(input);
        const walk = (value: unknown): void => {
          if (typeof value === "number") expect(Number.isFinite(value)).toBe(true);
          else if (Array.isArray(value)) value.forEach(walk);
          else if (typeof value === "object" && value !== null) Object.values(value).forEach(walk);
        };
        walk(result);
        expect(result.scenarios.physics.npv).toMatch(FINITE_DECIMAL);
        expect(result.totals.capex).toMatch(FINITE_DECIMAL);
      }),
      { numRuns: 300, seed: 13 },
    );
  });

  it("refuses what used to break a case: ambientC -1000, ratedCurrentA 1e308, naming the bound", () => {
    const input = structuredClone(base) as { axes: Axis[] };
    input.axes[0].duty.ambientC = -1000;
    input.axes[0].motor.ratedCurrentA = 1e308;
    const parsed = caseInputSchema.safeParse(input);
    expect(parsed.success).toBe(false);
    const messages = parsed.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(messages).toContain("axes.0.duty.ambientC: must be at least -40 °C");
    expect(messages).toContain("axes.0.motor.ratedCurrentA: must be at most 100 A");
  });

  it("the final guard throws a typed error naming the first figure that is not finite", () => {
    expect(() => assertFiniteResult({ a: [1, { npv: "NaN" }] })).toThrow(NonFiniteResultError);
    expect(() => assertFiniteResult({ x: Infinity })).toThrow(/x/);
    expect(assertFiniteResult({ a: "12.50", b: null, c: [0] })).toEqual({
      a: "12.50",
      b: null,
      c: [0],
    });
  });
});
