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
import { FIELD_BOUNDS, MONEY_MAX, type BoundedField, type FieldBound } from "../fields/bounds";
import type { FieldRange, FieldSpec } from "../fields/types";

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

// The bounds are the field registry's (lib/fields); re-exported for the engine's callers.
export { FIELD_BOUNDS, MONEY_MAX, type BoundedField, type FieldBound };

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

/*
 * Schemas built from a field of the registry (lib/fields): its range, choices and default are
 * read from there, never restated. Which builder a field takes follows its kind and the units it
 * accepts; tests/unit/fields/registry.test.ts checks each schema against its registry entry.
 */

type Presence<T extends z.ZodType, S> = S extends { readonly default: unknown }
  ? z.ZodDefault<T>
  : S extends { readonly optional: true }
    ? z.ZodOptional<T>
    : T;

/** The field's default, or optional, or required: as the registry says. */
export function presence<T extends z.ZodType, S extends FieldSpec>(
  schema: T,
  spec: S,
): Presence<T, S> {
  if (spec.default !== undefined)
    return schema.default(spec.default as never) as unknown as Presence<T, S>;
  if (spec.optional === true) return schema.optional() as unknown as Presence<T, S>;
  return schema as unknown as Presence<T, S>;
}

/** The number (no default applied) within a registry range: a share is pct(), else FIELD_BOUNDS. */
export function ranged(range: FieldRange | undefined, kind: FieldSpec["kind"] = "number") {
  if (range === undefined) throw new Error("a number field of the registry needs a range");
  if (kind === "int") return range === "share" ? int(0, 100) : boundedInt(range);
  return range === "share" ? pct() : bounded(range);
}

/** A plain number or whole-number field of the registry, with its presence. */
export const numberField = <const S extends FieldSpec>(spec: S) =>
  presence(ranged(spec.range, spec.kind), spec);

/** A choice field of the registry, with its presence. */
export function choiceField<
  const S extends FieldSpec & { readonly choices: readonly [string, ...string[]] },
>(spec: S): Presence<ReturnType<typeof choice<S["choices"]>>, S> {
  return presence(choice<S["choices"]>(spec.choices), spec);
}

/** A duty torque (or a process torque) field of the registry, with its presence. */
export const torqueField = <const S extends FieldSpec>(spec: S) => presence(torque(), spec);

/** A money field of the registry, with its presence. */
export const moneyField = <const S extends FieldSpec>(spec: S) => presence(money(), spec);

/** The registry's optional text fields (a tag, a note): described once, carried as typed. */
type OptionalTextKey<F> = {
  [K in keyof F]: F[K] extends { readonly kind: "text"; readonly optional: true } ? K : never;
}[keyof F];

const textWithin = (spec: FieldSpec) => {
  const max = spec.maxLength ?? 120;
  return text().max(max, `must be at most ${max} characters`);
};

/**
 * Every optional text field of `fields` as an optional string: the engine carries them through
 * to its readers (the workbook) and computes nothing with them.
 */
export function optionalTextShape<F extends Record<string, FieldSpec>>(fields: F) {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, spec] of Object.entries(fields))
    if (spec.kind === "text" && spec.optional === true) shape[key] = textWithin(spec).optional();
  return shape as { [K in OptionalTextKey<F>]: z.ZodOptional<z.ZodString> };
}

const nullableText = (spec: FieldSpec) =>
  z.preprocess(
    (v) => (v === undefined || (typeof v === "string" && v.trim() === "") ? null : v),
    textWithin(spec).trim().nullable(),
  );

const optionalNumberInput = (range: FieldRange | undefined, kind: FieldSpec["kind"]) =>
  z.preprocess((v) => (v === "" || v === undefined ? null : v), ranged(range, kind).nullable());

const requiredText = (spec: FieldSpec) => {
  const max = spec.maxLength ?? 120;
  return z
    .string()
    .trim()
    .min(1, `Enter the ${spec.label.toLowerCase()}`)
    .max(max, `Keep it under ${max} characters`);
};

/** The schema a form (and the JSON API) takes for one registry field; see formShape. */
type FormSchemaOf<S> = S extends { readonly kind: "text"; readonly optional: true }
  ? ReturnType<typeof nullableText>
  : S extends { readonly kind: "text" }
    ? ReturnType<typeof requiredText>
    : S extends {
          readonly kind: "enum";
          readonly choices: infer C extends readonly [string, ...string[]];
        }
      ? Presence<ReturnType<typeof choice<C>>, S>
      : S extends { readonly kind: "money" }
        ? Presence<ReturnType<typeof money>, S>
        : S extends { readonly range: "holdingTorqueNm" }
          ? Presence<ReturnType<typeof holdingTorque>, S>
          : S extends { readonly accepts: "torque" }
            ? Presence<ReturnType<typeof torque>, S>
            : S extends { readonly optional: true }
              ? ReturnType<typeof optionalNumberInput>
              : Presence<z.ZodNumber, S>;

function formSchemaOf(spec: FieldSpec): z.ZodType {
  if (spec.kind === "text") return spec.optional ? nullableText(spec) : requiredText(spec);
  if (spec.kind === "enum")
    return presence(choice(spec.choices as readonly [string, ...string[]]), spec);
  if (spec.kind === "money") return presence(money(), spec);
  if (spec.kind === "boolean") return presence(bool(), spec);
  if (spec.range === "holdingTorqueNm") return presence(holdingTorque(), spec);
  if (spec.accepts === "torque") return presence(torque(), spec);
  if (spec.optional) return optionalNumberInput(spec.range, spec.kind);
  return presence(ranged(spec.range, spec.kind), spec);
}

/**
 * Every field of `fields` as a form and the JSON API take it, built from its registry entry: a
 * field added to the registry is in the form's schema with no other edit. An empty box of an
 * optional field is null; a required text says "Enter the …".
 */
export function formShape<F extends Record<string, FieldSpec>>(fields: F) {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, spec] of Object.entries(fields)) shape[key] = formSchemaOf(spec);
  return shape as { [K in keyof F]: FormSchemaOf<F[K]> };
}
