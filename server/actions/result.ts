import "server-only";
import type { ZodError } from "zod";
import { ConflictError, ForbiddenError, NotFoundError, UnauthorizedError } from "@/lib/errors";

// The one result type every server action returns; forms map fieldErrors onto their fields.
export type ActionResult<T = undefined> =
  { ok: true; data: T } | { ok: false; fieldErrors: Record<string, string>; message: string };

export function invalid(error: ZodError): ActionResult<never> {
  const fieldErrors: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "form";
    fieldErrors[key] ??= issue.message;
  }
  return { ok: false, fieldErrors, message: "Check the highlighted fields." };
}

// Known failures become a message for the form; anything else is rethrown to the error boundary.
export function failed(error: unknown): ActionResult<never> {
  if (
    error instanceof ConflictError ||
    error instanceof NotFoundError ||
    error instanceof ForbiddenError ||
    error instanceof UnauthorizedError
  ) {
    return { ok: false, fieldErrors: {}, message: error.message };
  }
  throw error;
}
