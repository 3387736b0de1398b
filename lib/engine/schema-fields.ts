import Decimal from "decimal.js";
import { z } from "zod";
import {
  canonicalInertiaUnit,
  canonicalTorqueUnit,
  inertiaToKgM2,
  INERTIA_UNIT_NAMES,
  torqueToNm,
  TORQUE_UNIT_NAMES,
} from "./units";

/** How a wrong value reads in a message: "received string", "received an array". */
export function describeInput(input: unknown): string {
  if (input === null) return "null";
  if (Array.isArray(input)) return "an array";
  if (typeof input === "number" && !Number.isFinite(input)) return String(input);
  return typeof input;
}

const typeError =
  (expected: string) =>
  (issue: { input?: unknown }): string =>
    issue.input === undefined
      ? `required: expected ${expected}`
      : `expected ${expected}, received ${describeInput(issue.input)}`;

export const num = () => z.number({ error: typeError("a number") });
export const atLeast = (min: number) => num().min(min, `must be at least ${min}`);
export const positive = () => num().positive("must be greater than 0");
export const pct = () => atLeast(0).max(100, "must be at most 100");
export const int = (min: number, max?: number) => {
  const base = z
    .number({ error: typeError("a whole number") })
    .int("must be a whole number")
    .min(min, `must be at least ${min}`);
  return max === undefined ? base : base.max(max, `must be at most ${max}`);
};

/**
 * One set of bounds per input field, shared by the engine's schema, the forms
 * (lib/validations), the import columns (lib/import/fields.ts) and so the API: a value outside
 * them is not a stepper axis or a retrofit case, and inside them the engine's arithmetic stays
 * finite (evaluate.ts still checks its result). Each bound is physical or commercial, with room:
 * - hybrid steppers and their drives: NEMA 8–42 frames hold up to ~50 N·m at up to ~10 A per
 *   phase, with windings of 0.1–100 Ω and 0.1–300 mH, on buses up to ~350 V DC; so 100 N·m,
 *   100 A, 1000 Ω, 1000 mH, 1000 V. Duty torques at the motor shaft stay below 1000 N·m.
 * - speeds: beyond 60,000 rpm no stepper or mechanism in scope turns.
 * - time: a year has at most 8784 hours (leap year), 527,040 minutes.
 * - ambient: IEC 60204-1 machinery works at +5…+40 °C; −40…+80 °C covers cold stores and hot
 *   enclosures, and nothing outside it runs a motor.
 * - money: 10^12 in the case's currency is above any retrofit budget; quantity 100,000 axes per
 *   row is the case's own axis limit.
 * - percentages that are shares stay 0–100 (pct()); rates of change (escalation, discount,
 *   inflation) lie within ±100 % a year.
 * - lower ends: the smallest datasheet figures (NEMA 8: ~0.2 A, ~1 Ω, ~0.5 mH) with a factor
 *   of ten or more below them, so that a winding never computes as 0/0; a drive sets some
 *   current (0.01 A) and some bus voltage (1 V).
 * - no "greater than 0" where the engine divides by the field: such a bound admits 5·10^-324,
 *   and a quotient by it is Infinity. Instead a physical floor with room: thermal resistance
 *   0.01 K/W, rated rise 1 K, a kit's peak current 0.01 A, a cooler's COP 0.1 (thermoelectric
 *   coolers reach ~0.3), a life-halving interval 2 K (IEC 60216 materials lie near 6–12 K),
 *   pulley radius and screw lead 0.1 mm, gear ratio 0.01, stroke 0.001 mm or °, a move of 1 ms,
 *   efficiencies from 1 %, an acceleration share from 1 % of the move.
 * - the discount rate lies within −20…+100 % a year: the sensitivity scales it by up to
 *   (1 ± 100 %), and at −50 % doubled the discount factor 1/(1 + r)^t divides by zero.
 * `minExclusive` makes min a "greater than". `unit` is how the message names the bound.
 */
export interface FieldBound {
  readonly min: number;
  readonly minExclusive?: boolean;
  readonly max: number;
  readonly unit: string;
}

export const FIELD_BOUNDS = {
  quantity: { min: 1, max: 100_000, unit: "" },
  rotorTeeth: { min: 1, max: 500, unit: "" },
  holdingTorqueNm: { min: 0.001, max: 100, unit: "N·m" },
  ratedCurrentA: { min: 0.01, max: 100, unit: "A" },
  phaseResistanceOhm: { min: 0.01, max: 1000, unit: "Ω" },
  phaseInductanceMh: { min: 0.01, max: 1000, unit: "mH" },
  thermalResistanceKPerW: { min: 0.01, max: 100, unit: "K/W" },
  ratedTempRiseK: { min: 1, max: 250, unit: "K" },
  hysteresisWPerHz: { min: 0, max: 10, unit: "W/Hz" },
  eddyWPerHz2: { min: 0, max: 1, unit: "W/Hz²" },
  busVoltageV: { min: 1, max: 1000, unit: "V" },
  currentSettingA: { min: 0.01, max: 100, unit: "A" },
  maxCurrentPeakA: { min: 0.01, max: 100, unit: "A" },
  microsteps: { min: 1, max: 512, unit: "" },
  standbyW: { min: 0, max: 1000, unit: "W" },
  hoursPerYear: { min: 0, max: 8784, unit: "h (the hours of a leap year)" },
  speedRpm: { min: 0, max: 60_000, unit: "rpm" },
  dutyTorqueNm: { min: 0, max: 1000, unit: "N·m" },
  ambientC: { min: -40, max: 80, unit: "°C" },
  stepLossEventsPerYear: { min: 0, max: 1_000_000, unit: "a year" },
  installHours: { min: 0, max: 10_000, unit: "h" },
  downtimeHours: { min: 0, max: 8784, unit: "h" },
  // The engine caps the gain at the machine's headroom; 10,000 % only refuses typos.
  throughputGainPct: { min: 0, max: 10_000, unit: "%" },
  ratePct: { min: -100, minExclusive: true, max: 100, unit: "%" },
  discountRatePct: { min: -20, max: 100, unit: "%" },
  efficiencyPct: { min: 1, max: 100, unit: "%" },
  accelSharePct: { min: 1, max: 50, unit: "%" },
  gridKgCo2PerKWh: { min: 0, max: 10, unit: "kg/kWh" },
  coolingCop: { min: 0.1, max: 100, unit: "" },
  lifeHalvingK: { min: 2, max: 100, unit: "K" },
  bandPct: { min: -100, max: 100, unit: "%" },
  radiusMm: { min: 0.1, max: 10_000, unit: "mm" },
  leadMm: { min: 0.1, max: 10_000, unit: "mm" },
  gearRatio: { min: 0.01, max: 1000, unit: "" },
  massKg: { min: 0, max: 100_000, unit: "kg" },
  inertiaKgM2: { min: 0, max: 1000, unit: "kg·m²" },
  // A rotor's inertia when known (0 = unknown): a NEMA 8 rotor has ~2·10^-7 kg·m², so 10^-9
  // leaves room, and the inertia ratio load/rotor cannot overflow on a vanishing rotor.
  rotorInertiaKgM2: { min: 1e-9, max: 1000, unit: "kg·m²" },
  frictionCoeff: { min: 0, max: 10, unit: "" },
  externalForceN: { min: 0, max: 1_000_000, unit: "N" },
  stroke: { min: 0.001, max: 1_000_000, unit: "" },
  moveTimeS: { min: 0.001, max: 3600, unit: "s" },
  dwellTimeS: { min: 0, max: 86_400, unit: "s" },
  maxInertiaRatio: { min: 0, minExclusive: true, max: 10_000, unit: "" },
  downtimeMinutes: { min: 0, max: 527_040, unit: "min" },
  scrapParts: { min: 0, max: 1_000_000_000, unit: "" },
  restartLaborHours: { min: 0, max: 8784, unit: "h" },
} as const satisfies Record<string, FieldBound>;

export type BoundedField = keyof typeof FIELD_BOUNDS;

/** The largest amount of money any field takes, in the case's currency. */
export const MONEY_MAX = "1000000000000";

const withUnit = (value: number, unit: string) => (unit === "" ? `${value}` : `${value} ${unit}`);

/** The messages of a bound, e.g. "must be at most 80 °C"; shared with the importer's cells. */
export function boundMessages(bound: FieldBound) {
  return {
    min:
      bound.minExclusive === true
        ? `must be greater than ${withUnit(bound.min, bound.min === 0 ? "" : bound.unit)}`
        : `must be at least ${withUnit(bound.min, bound.min === 0 ? "" : bound.unit)}`,
    max: `must be at most ${withUnit(bound.max, bound.unit)}`,
  };
}

/** A number within FIELD_BOUNDS[key]. */
export function bounded(key: BoundedField) {
  const bound: FieldBound = FIELD_BOUNDS[key];
  const messages = boundMessages(bound);
  const low =
    bound.minExclusive === true
      ? num().gt(bound.min, messages.min)
      : num().min(bound.min, messages.min);
  return low.max(bound.max, messages.max);
}

/** A whole number within FIELD_BOUNDS[key]. */
export function boundedInt(key: BoundedField) {
  const bound: FieldBound = FIELD_BOUNDS[key];
  return int(bound.min, bound.max);
}

export const text = () => z.string({ error: typeError("a string") });
export const id = () => text().min(1, "must not be empty");

export const choice = <const T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, {
    error: (issue) =>
      `must be one of ${values.map((v) => `"${v}"`).join(", ")}` +
      (issue.input === undefined ? " (required)" : `, received ${JSON.stringify(issue.input)}`),
  });

export const obj = <T extends z.core.$ZodLooseShape>(shape: T) =>
  z.object(shape, { error: typeError("an object") });
export const list = <T extends z.ZodType>(item: T) =>
  z.array(item, { error: typeError("an array") });

const MONEY_TOO_LARGE = `must be at most ${MONEY_MAX}`;
const UNSIGNED_DECIMAL = /^\+?(\d+\.?\d*|\.\d+)$/;
const MONEY_EXPECTED = 'an amount as a decimal string such as "12.50" (or a JSON number)';

/**
 * A decimal text (UNSIGNED_DECIMAL) at most MONEY_MAX. Fewer whole digits than MONEY_MAX has
 * settles it without decimal.js: a 10,000-axis case carries several amounts per axis, and
 * building a Decimal for each was a tenth of its schema parse.
 */
function isWithinMoneyMax(text: string): boolean {
  let start = text.startsWith("+") ? 1 : 0;
  while (text[start] === "0") start++;
  const dot = text.indexOf(".");
  const wholeDigits = (dot === -1 ? text.length : dot) - start;
  return wholeDigits < MONEY_MAX.length || new Decimal(text).lte(MONEY_MAX);
}

const moneyTextMessage = (issue: { input?: unknown }): string =>
  typeof issue.input === "string" && /^-(\d+\.?\d*|\.\d+)$/.test(issue.input)
    ? `must be at least 0, received ${issue.input}`
    : `expected ${MONEY_EXPECTED}, received ${JSON.stringify(issue.input)}`;

/**
 * Money: a decimal string, a JSON number or a Decimal; the parsed value is a decimal string that
 * the engine reads with decimal.js (docs/model.md: money never goes through JS number arithmetic).
 * A string passes through unchanged (no transform: this keeps a 10,000-axis parse fast); a JSON
 * number becomes its shortest round-trip text, which is the decimal its author typed.
 * Accepting a Decimal keeps the schema usable on values the engine itself produced.
 */
export const money = () =>
  z.union(
    [
      z
        .string()
        .regex(UNSIGNED_DECIMAL, { error: moneyTextMessage })
        // zod runs this even after the regex failed: only a decimal is compared.
        .refine((v) => !UNSIGNED_DECIMAL.test(v) || isWithinMoneyMax(v), MONEY_TOO_LARGE),
      z
        .number()
        .min(0, "must be at least 0")
        .max(Number(MONEY_MAX), MONEY_TOO_LARGE)
        .transform((v) => String(v)),
      z
        .custom<Decimal>((v) => Decimal.isDecimal(v))
        .transform((v, ctx) => {
          if (v.isNegative() && !v.isZero())
            ctx.addIssue({
              code: "custom",
              message: `must be at least 0, received ${v.toFixed()}`,
              input: v,
            });
          if (v.gt(MONEY_MAX)) ctx.addIssue({ code: "custom", message: MONEY_TOO_LARGE, input: v });
          return v.toFixed();
        }),
    ],
    { error: typeError(MONEY_EXPECTED) },
  );

export type TorqueInput = number | { value: number; unit: string };

const TORQUE_EXPECTED = `a torque: a number in N·m or { value, unit } with unit one of ${TORQUE_UNIT_NAMES.map((u) => `"${u}"`).join(", ")}`;

const notAborting = { continue: true } as const;

/**
 * { value, unit } in N·m. Issues here do not abort, so that the union below reports them with
 * their path instead of its own "expected a torque" (zod reports a union's only non-aborted branch).
 */
const torqueWithUnit = (positiveOnly: boolean, maxNm: number, minNm: number) =>
  z.object({ value: num(), unit: text() }).transform((v, ctx): number => {
    const unit = canonicalTorqueUnit(v.unit);
    if (unit === undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["unit"],
        message: `must be one of ${TORQUE_UNIT_NAMES.map((u) => `"${u}"`).join(", ")}, received ${JSON.stringify(v.unit)}`,
        input: v.unit,
        ...notAborting,
      });
      return z.NEVER;
    }
    const nm = torqueToNm(v.value, unit);
    if (positiveOnly ? !(nm > 0) : nm < minNm) {
      const bound = positiveOnly
        ? "must be greater than 0"
        : `must be at least ${minNm === 0 ? "0" : `${minNm} N·m`}`;
      ctx.addIssue({
        code: "custom",
        path: ["value"],
        message: bound,
        input: v.value,
        ...notAborting,
      });
    }
    if (nm > maxNm) {
      ctx.addIssue({
        code: "custom",
        path: ["value"],
        message: `must be at most ${maxNm} N·m`,
        input: v.value,
        ...notAborting,
      });
    }
    return nm;
  });

/** A torque in N·m, or { value, unit } converted to N·m by the NIST SP 811 factors (units.ts). */
export const torque = (options: { positive?: boolean; max?: number } = {}) => {
  // A duty torque unless told otherwise (holdingTorque() for a motor's rating).
  const maxNm = options.max ?? FIELD_BOUNDS.dutyTorqueNm.max;
  const plain = (options.positive ? positive() : atLeast(0)).max(
    maxNm,
    `must be at most ${maxNm} N·m`,
  );
  return z.union([plain, torqueWithUnit(options.positive === true, maxNm, 0)], {
    error: typeError(TORQUE_EXPECTED),
  });
};

/** A motor's holding torque within FIELD_BOUNDS.holdingTorqueNm, in N·m or { value, unit }. */
export const holdingTorque = () => {
  const { min, max } = FIELD_BOUNDS.holdingTorqueNm;
  const plain = num()
    .min(min, `must be at least ${min} N·m`)
    .max(max, `must be at most ${max} N·m`);
  return z.union([plain, torqueWithUnit(false, max, min)], {
    error: typeError(TORQUE_EXPECTED),
  });
};

const INERTIA_EXPECTED = `an inertia: a number in kg·m² or { value, unit } with unit one of ${INERTIA_UNIT_NAMES.map((u) => `"${u}"`).join(", ")}`;

/** { value, unit } in kg·m²; issues do not abort, for the same reason as torqueWithUnit. */
const inertiaWithUnit = z.object({ value: num(), unit: text() }).transform((v, ctx): number => {
  const unit = canonicalInertiaUnit(v.unit);
  if (unit === undefined) {
    ctx.addIssue({
      code: "custom",
      path: ["unit"],
      message: `must be one of ${INERTIA_UNIT_NAMES.map((u) => `"${u}"`).join(", ")}, received ${JSON.stringify(v.unit)}`,
      input: v.unit,
      ...notAborting,
    });
    return z.NEVER;
  }
  const kgM2 = inertiaToKgM2(v.value, unit);
  if (kgM2 > FIELD_BOUNDS.inertiaKgM2.max) {
    ctx.addIssue({
      code: "custom",
      path: ["value"],
      message: `must be at most ${FIELD_BOUNDS.inertiaKgM2.max} kg·m²`,
      input: v.value,
      ...notAborting,
    });
  }
  if (kgM2 < 0) {
    ctx.addIssue({
      code: "custom",
      path: ["value"],
      message: "must be at least 0",
      input: v.value,
      ...notAborting,
    });
  }
  return kgM2;
});

/** A moment of inertia in kg·m², or { value, unit } converted by the NIST SP 811 factors (units.ts). */
export const inertia = () =>
  z.union([bounded("inertiaKgM2"), inertiaWithUnit], { error: typeError(INERTIA_EXPECTED) });

export const bool = () => z.boolean({ error: typeError("true or false") });
