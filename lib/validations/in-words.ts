import { z } from "zod";
import { readTyped, typedNumberMessage } from "./typed-number";

/**
 * The engine's schemas (lib/engine/schema-fields.ts) word their messages for the JSON API, after a
 * field path: "required: expected a number", "must be at least 0, received -1". A person typing
 * into a form needs the field's name and an example instead: "Enter the discount % as a number
 * such as 5", "Discount % must be at least 0".
 */
export function personMessage(label: string, example: string, message: string): string {
  if (message.startsWith(`${label}:`) || message.startsWith(`${label} `)) return message;
  if (/^(required|expected|invalid input)/i.test(message) || /received NaN/.test(message))
    return `Enter the ${lowerFirst(label)} as a number such as ${example}`;
  const plain = message.replace(/,? \(?received [^)]*\)?$/, "");
  if (plain === "must be a whole number")
    return `${label} must be a whole number, such as ${example}`;
  if (plain.startsWith("must ")) return `${label} ${plain}`;
  return message;
}

const lowerFirst = (text: string) =>
  /^[A-Z][a-z]/.test(text) ? text.charAt(0).toLowerCase() + text.slice(1) : text;

/**
 * `schema` for a value a person types: text is read as they write it ("0,24" is 0.24, "1,234" is
 * refused as ambiguous: lib/validations/typed-number.ts), blank text is not given, and every
 * message names the field. `kind` "amount" keeps money as decimal text (docs/model.md); "as-is"
 * only words the messages (an id, a choice).
 */
export function inWords<T extends z.ZodType>(
  label: string,
  example: string,
  schema: T,
  kind: "number" | "amount" | "as-is" = "number",
) {
  // A preprocess, not a transform: an object then still treats a missing key as the inner
  // schema does (its default, or optional). The inner schema checks the value once more after
  // it passed here, which settles on the same value (numbers and decimal text parse to themselves).
  return z.preprocess((value, ctx) => {
    // Null and blank text are "not given", whatever the kind.
    const given =
      value === null || (typeof value === "string" && value.trim() === "") ? undefined : value;
    const read = kind === "as-is" ? ({ ok: true, value: given } as const) : readTyped(given, kind);
    if (!read.ok) {
      const message =
        read.reason === "ambiguous"
          ? typedNumberMessage(label, String(value), read.reason)
          : personMessage(label, example, "expected a number");
      ctx.addIssue({ code: "custom", message });
      return z.NEVER;
    }
    const parsed = schema.safeParse(read.value);
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues)
      ctx.addIssue({
        code: "custom",
        message: personMessage(label, example, issue.message),
        path: issue.path,
      });
    return z.NEVER;
  }, schema);
}
