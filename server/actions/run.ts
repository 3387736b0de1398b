import "server-only";
import type { z } from "zod";
import { requireRole } from "@/server/auth";
import type { Role } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { failed, invalid, type ActionResult } from "./result";

// The shape of every form action: check the caller's role, validate with the shared zod schema,
// run the query, and turn known failures into a message for the form.
export async function runAction<S extends z.ZodType, T>(
  roles: readonly Role[],
  schema: S,
  values: unknown,
  mutate: (caller: SessionUser, data: z.infer<S>) => T | Promise<T>,
): Promise<ActionResult<T>> {
  try {
    const caller = await requireRole(...roles);
    const parsed = schema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    return { ok: true, data: await mutate(caller, parsed.data) };
  } catch (error) {
    return failed(error);
  }
}
