import type { ImportField } from "./fields";
import { boundMessages } from "@/lib/engine/schema-fields";
import { toSi } from "./units";
import { readTypedDecimal } from "@/lib/validations/typed-number";
import { lowerFirst } from "@/lib/words";

/** A cell's value in the field's SI unit, or what is wrong with it and how to fix it. */
export type CellResult =
  { ok: true; value: number | string | boolean } | { ok: false; message: string };

const YES = new Set(["yes", "y", "true", "1", "x"]);
const NO = new Set(["no", "n", "false", "0"]);

const PLAIN_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const GROUPED = /^[+-]?\d{1,3}(?:[,.'\u00a0\u202f ]\d{3})+(?:[.,]\d+)?$/;
const NUMBER_THEN_TEXT = /^[+-]?(?:\d+[.,]?\d*|[.,]\d+)\s*[^\d\s.,]\S*$/;
const FORMULA_START = /^[=+\-@]/;
const NEGATIVE = /^[-\u2212]/;

/** Longest name a machine or an axis label may have, as in the forms (lib/validations). */
export const MAX_NAME_LENGTH = 120;

/**
 * "1,500" could be 1.5 or 1500 (lib/validations/typed-number.ts reads numbers for the forms, the
 * server's schemas and these cells alike), while "0,450", "1,5" and "12,75" are decimals.
 */
export function isAmbiguousDecimalComma(text: string): boolean {
  const read = readTypedDecimal(text);
  return !read.ok && read.reason === "ambiguous";
}

type NumberText =
  | { ok: true; value: number }
  | { ok: false; reason: "blank" | "not-a-number" | "ambiguous"; message?: string };

/**
 * A number as typed, before units and bounds; the reason says how to explain a refusal. A
 * decimal comma and grouped thousands are read as the forms read them ("1.234,5" is 1234.5).
 */
export function parseNumberText(raw: string): NumberText {
  const text = raw.trim();
  if (text === "") return { ok: false, reason: "blank" };
  // Most cells are plain numbers: settled without the general reader.
  const read = PLAIN_NUMBER.test(text) ? { ok: true as const, text } : readTypedDecimal(text);
  if (read.ok) {
    const value = Number(read.text);
    return Number.isFinite(value)
      ? { ok: true, value }
      : { ok: false, reason: "not-a-number", message: `"${text}" is too large` };
  }
  return { ok: false, reason: read.reason === "ambiguous" ? "ambiguous" : "not-a-number" };
}

const lower = (field: ImportField) => lowerFirst(field.label);

/** "the holding torque in oz·in", "the quantity": what to enter, in the column's unit. */
function entering(field: ImportField, unit: string): string {
  const what = field.key === "machine" ? "machine name" : lower(field);
  return unit === "" ? `the ${what}` : `the ${what} in ${unit}`;
}

/** "1,500": both readings, and the field to write it for (lib/validations/typed-number.ts). */
function ambiguousMessage(field: ImportField, text: string, unit: string): string {
  const [whole, fraction] = text.replace(/^\+/, "").split(",");
  return `"${text}" could be ${Number(`${whole}.${fraction}`)} or ${whole}${fraction}; write ${entering(field, unit)} with a decimal point and no thousands separator`;
}

function notANumberMessage(field: ImportField, text: string, unit: string, header: string): string {
  if (FORMULA_START.test(text)) {
    return `"${text}" looks like a formula, and formulas are not evaluated; enter ${entering(field, unit)} as a plain number`;
  }
  if (GROUPED.test(text)) {
    return `"${text}" has a thousands separator; enter ${entering(field, unit)} without one, with a decimal point`;
  }
  if (NUMBER_THEN_TEXT.test(text)) {
    return `"${text}" has text after the number; enter the number only — the unit belongs in the column header ("${header}")`;
  }
  return `"${text}" is not a number; enter ${entering(field, unit)}`;
}

const show = (value: number) => String(Number(value.toPrecision(12)));

function boundsMessage(field: ImportField, si: number, typed: number): string | undefined {
  if (field.bound) {
    // The engine's own bounds and wording, so a cell is refused exactly as the API refuses it.
    const { min, minExclusive, max } = field.bound;
    const messages = boundMessages(field.bound);
    if (minExclusive ? !(si > min) : si < min) return `${messages.min} (received ${show(typed)})`;
    if (si > max) return `${messages.max} (received ${show(typed)})`;
    return undefined;
  }
  if (field.min !== undefined) {
    if (field.minExclusive ? !(si > field.min) : si < field.min) {
      return `must be ${field.minExclusive ? "greater than" : "at least"} ${field.min} (received ${show(typed)})`;
    }
  }
  if (field.max !== undefined && si > field.max)
    return `must be at most ${field.max} (received ${show(typed)})`;
  return undefined;
}

/**
 * One cell of `field`, read in the column's unit (`factor` to SI). Blank cells are the caller's
 * to default; here they are "required" refusals.
 */
export function parseCell(
  field: ImportField,
  raw: string,
  unit: string,
  factor: number,
  header: string,
): CellResult {
  const text = raw.trim();
  if (text === "") return { ok: false, message: `required: enter ${entering(field, unit)}` };
  switch (field.type) {
    case "text": {
      const value = text.replace(/\s+/g, " ");
      const maxLength = field.maxLength ?? MAX_NAME_LENGTH;
      if (value.length > maxLength) {
        return {
          ok: false,
          message: `is ${value.length} characters long; shorten ${entering(field, "")} to at most ${maxLength} characters`,
        };
      }
      return { ok: true, value };
    }
    case "enum": {
      const choices = field.choices ?? [];
      const wanted = text.toLowerCase().replace(/[\s_]+/g, "-");
      const value = choices.find((c) => c.toLowerCase() === wanted);
      if (value === undefined) {
        return {
          ok: false,
          message: `"${text}" is not a valid ${lower(field)}; must be one of ${choices.join(", ")}`,
        };
      }
      return { ok: true, value };
    }
    case "money-string":
      return parseMoney(field, text);
    case "boolean": {
      const word = text.toLowerCase();
      if (YES.has(word)) return { ok: true, value: true };
      if (NO.has(word)) return { ok: true, value: false };
      return { ok: false, message: `"${text}" is not yes or no; enter yes or no` };
    }
    case "number":
    case "int": {
      const parsed = parseNumberText(text);
      if (!parsed.ok)
        return {
          ok: false,
          message:
            parsed.message ??
            (parsed.reason === "ambiguous"
              ? ambiguousMessage(field, text, unit)
              : notANumberMessage(field, text, unit, header)),
        };
      if (field.type === "int" && !Number.isInteger(parsed.value)) {
        return {
          ok: false,
          message: `${show(parsed.value)} is not a whole number; enter ${entering(field, unit)} as a whole number`,
        };
      }
      const value = toSi(parsed.value, factor);
      const bounds = boundsMessage(field, value, parsed.value);
      return bounds === undefined ? { ok: true, value } : { ok: false, message: bounds };
    }
  }
}

/**
 * Money as a decimal string, by pattern only (docs/model.md: money never passes through a JS
 * number), read as the forms read it (lib/validations/typed-number.ts). Normalised to digits and
 * one decimal point: "+012,50" → "12.50", "7." → "7", "1.234,50" → "1234.50".
 */
function parseMoney(field: ImportField, text: string): CellResult {
  const read = /e/i.test(text) ? null : readTypedDecimal(text);
  if (read?.ok && NEGATIVE.test(read.text)) {
    // "-0" and "-0.00" are nothing, not a refund.
    if (!/[1-9]/.test(read.text)) return { ok: true, value: "0" };
    return { ok: false, message: `must be at least 0 (received ${text})` };
  }
  if (read === null || !read.ok) {
    if (read?.reason === "ambiguous")
      return { ok: false, message: ambiguousMessage(field, text, "") };
    const why = FORMULA_START.test(text)
      ? "looks like a formula, and formulas are not evaluated"
      : "is not an amount";
    return {
      ok: false,
      message: `"${text}" ${why}; enter ${entering(field, "")} as a number such as 12.50, in the site's currency, without a currency sign`,
    };
  }
  const [whole, fraction = ""] = read.text.split(".");
  const digits = whole.replace(/^0+(?=\d)/, "") || "0";
  return { ok: true, value: fraction === "" ? digits : `${digits}.${fraction}` };
}
