"use server";

import { revalidatePath } from "next/cache";
import { changeRole, createUser, setUserActive } from "@/db/queries/users";
import { failed, invalid, type ActionResult } from "@/lib/actions/result";
import { requireRole } from "@/lib/auth";
import { changeRoleSchema, createUserSchema, setActiveSchema } from "@/lib/validations/user";

export async function createUserAction(values: unknown): Promise<ActionResult<{ id: number }>> {
  try {
    const caller = await requireRole("admin");
    const parsed = createUserSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    const row = createUser(caller, parsed.data);
    revalidatePath("/admin");
    return { ok: true, data: { id: row.id } };
  } catch (error) {
    return failed(error);
  }
}

export async function changeRoleAction(values: unknown): Promise<ActionResult> {
  try {
    const caller = await requireRole("admin");
    const parsed = changeRoleSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    changeRole(caller, parsed.data);
    revalidatePath("/admin");
    return { ok: true, data: undefined };
  } catch (error) {
    return failed(error);
  }
}

export async function setActiveAction(values: unknown): Promise<ActionResult> {
  try {
    const caller = await requireRole("admin");
    const parsed = setActiveSchema.safeParse(values);
    if (!parsed.success) return invalid(parsed.error);
    setUserActive(caller, parsed.data.userId, parsed.data.active);
    revalidatePath("/admin");
    return { ok: true, data: undefined };
  } catch (error) {
    return failed(error);
  }
}
