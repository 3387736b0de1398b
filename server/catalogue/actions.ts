"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { saveKit, saveMotor, setCatalogueActive } from "@/db/queries/catalogue";
import { failed, invalid, type ActionResult } from "@/server/actions/result";
import { requireRole } from "@/server/auth";
import { idSchema, requireId } from "@/lib/validations/ids";
import { ConflictError } from "@/lib/errors";
import { kitInputSchema, motorInputSchema } from "@/lib/validations/catalogue";

// An id from the page: absent for a new row; anything else that is not a positive whole number
// cannot name a row, so it reads as "no such row" rather than as a field error.
function parseRowId(id: unknown, what: string): number | undefined {
  if (id === undefined || id === null) return undefined;
  return requireId(id, `No such ${what}`);
}

// The only conflict a save can meet is a code already in use, so it belongs beside the code field.
function failedSave(error: unknown): ActionResult<never> {
  if (error instanceof ConflictError) {
    return {
      ok: false,
      fieldErrors: { code: error.message },
      message: "Check the highlighted fields.",
    };
  }
  return failed(error);
}

const setActiveSchema = z.object({
  kind: z.enum(["kit", "motor"]),
  id: idSchema(),
  active: z.boolean(),
});

export async function saveKitAction(
  values: unknown,
  id?: number,
): Promise<ActionResult<{ id: number }>> {
  try {
    const caller = await requireRole("admin");
    const kitId = parseRowId(id, "kit");
    const parsed = kitInputSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    const row = saveKit(caller, parsed.data, kitId);
    revalidatePath("/catalogue");
    return { ok: true, data: { id: row.id } };
  } catch (error) {
    return failedSave(error);
  }
}

export async function saveMotorAction(
  values: unknown,
  id?: number,
): Promise<ActionResult<{ id: number }>> {
  try {
    const caller = await requireRole("admin");
    const motorId = parseRowId(id, "motor");
    const parsed = motorInputSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    const row = saveMotor(caller, parsed.data, motorId);
    revalidatePath("/catalogue");
    return { ok: true, data: { id: row.id } };
  } catch (error) {
    return failedSave(error);
  }
}

export async function setCatalogueActiveAction(values: unknown): Promise<ActionResult> {
  try {
    const caller = await requireRole("admin");
    const parsed = setActiveSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    setCatalogueActive(caller, parsed.data.kind, parsed.data.id, parsed.data.active);
    revalidatePath("/catalogue");
    return { ok: true, data: undefined };
  } catch (error) {
    return failed(error);
  }
}
