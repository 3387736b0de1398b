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

const UNSIGNED_DECIMAL = /^\+?(\d+\.?\d*|\.\d+)$/;
const MONEY_EXPECTED = 'an amount as a decimal string such as "12.50" (or a JSON number)';

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
      z.string().regex(UNSIGNED_DECIMAL, { error: moneyTextMessage }),
      z
        .number()
        .min(0, "must be at least 0")
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
const torqueWithUnit = (positiveOnly: boolean) =>
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
    if (positiveOnly ? !(nm > 0) : nm < 0) {
      const bound = positiveOnly ? "must be greater than 0" : "must be at least 0";
      ctx.addIssue({
        code: "custom",
        path: ["value"],
        message: bound,
        input: v.value,
        ...notAborting,
      });
    }
    return nm;
  });

/** A torque in N·m, or { value, unit } converted to N·m by the NIST SP 811 factors (units.ts). */
export const torque = (options: { positive?: boolean } = {}) =>
  z.union([options.positive ? positive() : atLeast(0), torqueWithUnit(options.positive === true)], {
    error: typeError(TORQUE_EXPECTED),
  });

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
  z.union([atLeast(0), inertiaWithUnit], { error: typeError(INERTIA_EXPECTED) });

export const bool = () => z.boolean({ error: typeError("true or false") });
