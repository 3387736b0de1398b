import { z } from "zod";

/**
 * A number as a person types it. A decimal comma is accepted ("0,24" is 0.24), as is a grouped
 * thousand with the other mark as decimal ("1,234.5", "1.234,5"). "1,234" alone could be either
 * a thousand or a little over one, so it is refused rather than guessed.
 */
export type TypedNumber = { ok: true; value: number } | { ok: false; reason: TypedNumberProblem };

export type TypedNumberProblem = "empty" | "not-a-number" | "ambiguous";

/** The same reading as decimal text ("-0.24"), for amounts that never pass through a JS number. */
export type TypedDecimal = { ok: true; text: string } | { ok: false; reason: TypedNumberProblem };

const GROUPED = /^\d{1,3}([.,]\d{3})+$/;

export function parseTypedNumber(text: string): TypedNumber {
  const read = readTypedDecimal(text);
  return read.ok ? { ok: true, value: Number(read.text) } : read;
}

/** What was typed as plain decimal text with a point and no grouping, or why it cannot be. */
export function readTypedDecimal(text: string): TypedDecimal {
  const raw = text
    .trim()
    .replace(/[\s\u00a0\u202f]/g, "")
    .replace(/^\u2212/, "-");
  if (raw === "") return { ok: false, reason: "empty" };
  const sign = raw.startsWith("-") ? "-" : "";
  const body = raw.replace(/^[-+]/, "");
  const commas = (body.match(/,/g) ?? []).length;
  const dots = (body.match(/\./g) ?? []).length;
  let plain: string;
  if (commas === 0) plain = body;
  else if (dots === 0 && commas === 1) {
    const [whole, fraction] = body.split(",");
    // "1,234": a thousands group or a decimal comma; "0,234" and "1,23" can only be decimals.
    if (fraction.length === 3 && /^[1-9]\d{0,2}$/.test(whole))
      return { ok: false, reason: "ambiguous" };
    plain = `${whole}.${fraction}`;
  } else {
    // Both marks, or several of one: the last mark is the decimal one unless every mark groups thousands.
    const decimalMark = body.lastIndexOf(",") > body.lastIndexOf(".") ? "," : ".";
    const groupMark = decimalMark === "," ? "." : ",";
    const onlyGroups = (dots === 0 || commas === 0) && GROUPED.test(body);
    if (onlyGroups) plain = body.replace(/[.,]/g, "");
    else {
      const cut = body.lastIndexOf(decimalMark);
      const whole = body.slice(0, cut);
      if (
        whole.includes(decimalMark) ||
        !(whole === "" || GROUPED.test(whole) || /^\d+$/.test(whole))
      )
        return { ok: false, reason: "not-a-number" };
      plain = `${whole.split(groupMark).join("")}.${body.slice(cut + 1)}`;
    }
  }
  if (!/^(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(plain)) return { ok: false, reason: "not-a-number" };
  return { ok: true, text: `${sign}${plain}` };
}

/** The sentence beside a field when what was typed is not a number we can read. */
export function typedNumberMessage(
  label: string,
  text: string,
  reason: "not-a-number" | "ambiguous",
): string {
  if (reason === "ambiguous") {
    const digits = text.trim().replace(",", "");
    return `${label}: write ${digits} or ${text.trim().replace(",", ".")} — '${text.trim()}' could mean either`;
  }
  return `${label}: enter a number such as 0.24`;
}

type Typed = "number" | "amount";

/**
 * Reads text typed into a form as a number (or, for an amount, as decimal text). Anything that
 * is not text passes unchanged, so JSON numbers keep working; blank text is "not given".
 */
export function readTyped(
  value: unknown,
  kind: Typed,
): { ok: true; value: unknown } | { ok: false; reason: "not-a-number" | "ambiguous" } {
  if (typeof value !== "string") return { ok: true, value };
  const read = readTypedDecimal(value);
  if (read.ok) return { ok: true, value: kind === "number" ? Number(read.text) : read.text };
  if (read.reason === "empty") return { ok: true, value: undefined };
  return { ok: false, reason: read.reason };
}

function typed<T extends z.ZodType>(kind: Typed, label: string, schema: T) {
  return z.preprocess((value, ctx) => {
    const read = readTyped(value, kind);
    if (read.ok) return read.value;
    ctx.addIssue({
      code: "custom",
      message: typedNumberMessage(label, String(value), read.reason),
    });
    return z.NEVER;
  }, schema);
}

/**
 * A number typed as text on a form or sent to a route: "0,24" is 0.24, "1,234" is refused with a
 * sentence naming the field. The server's half of what the forms do (components/ui/form-fields.tsx).
 * Blank text is absent: wrap an optional schema for a field that may stay empty.
 */
export const typedNumber = <T extends z.ZodType>(label: string, schema: T) =>
  typed("number", label, schema);

/** An amount of money typed as text: "12,50" becomes "12.50" without passing through a double. */
export const typedAmount = <T extends z.ZodType>(label: string, schema: T) =>
  typed("amount", label, schema);
