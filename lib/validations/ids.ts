import { z } from "zod";
import { NotFoundError } from "@/lib/errors";

// Record ids are SQLite rowids: positive integers within JavaScript's safe range. The one parser
// every route, page and action uses, so `true`, `[2]`, "", " 7", "1e3", "0x10" or 1.5 never reach
// the database driver (which throws on them, or coerces them to another row).
const DIGITS = /^[1-9][0-9]{0,15}$/;

/** A positive safe integer from a number or a string of digits; anything else is null. */
export function parseId(value: unknown): number | null {
  if (typeof value === "number") return Number.isSafeInteger(value) && value >= 1 ? value : null;
  if (typeof value !== "string" || !DIGITS.test(value)) return null;
  const id = Number(value);
  return Number.isSafeInteger(id) ? id : null;
}

/** The id or NotFoundError: an id that is not an id names nothing, like a missing record. */
export function requireId(value: unknown, what = "Not found"): number {
  const id = parseId(value);
  if (id === null) throw new NotFoundError(what);
  return id;
}

// A route id that is not a positive whole number names nothing: 404, like a missing record.
export function idFromRoute(value: string): number {
  return requireId(value);
}

/** The zod form of parseId, for ids inside a form's or a request's values. */
export const idSchema = (message = "must be a record id (a positive whole number)") =>
  z.union([z.number(), z.string()]).transform((value, ctx) => {
    const id = parseId(value);
    if (id === null) {
      ctx.addIssue({ code: "custom", message });
      return z.NEVER;
    }
    return id;
  });
