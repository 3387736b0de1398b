import { notFound } from "next/navigation";
import { idFromRoute } from "@/lib/validations/ids";
import { NotFoundError } from "@/lib/errors";

// A route id that is not a positive whole number is simply not found.
export function idParam(value: string): number {
  return orNotFound(() => idFromRoute(value));
}

// Runs a getXOrThrow lookup for a page: missing and out-of-scope both become the not-found page.
export function orNotFound<T>(lookup: () => T): T {
  try {
    return lookup();
  } catch (error) {
    if (error instanceof NotFoundError) notFound();
    throw error;
  }
}

export type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export function firstParam(v: string | string[] | undefined): string | undefined {
  return Array.isArray(v) ? v[0] : v;
}
