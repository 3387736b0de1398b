import { NotFoundError } from "@/lib/errors";

// A route id that is not a positive whole number names nothing: 404, like a missing record.
export function idFromRoute(value: string): number {
  const id = Number(value);
  if (!Number.isSafeInteger(id) || id < 1) throw new NotFoundError("Not found");
  return id;
}
