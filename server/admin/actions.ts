"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { saveSalesSettings } from "@/db/queries/sales-settings";
import { changeRole, createUser, setUserActive } from "@/db/queries/users";
import { runAction } from "@/server/actions/run";
import { salesSettingsSchema } from "@/lib/validations/pipeline";
import { changeRoleSchema, createUserSchema, setActiveSchema } from "@/lib/validations/user";

export async function createUserAction(values: unknown) {
  const result = await runAction(["admin"], createUserSchema, values, (caller, data) => ({
    id: createUser(caller, data).id,
  }));
  if (result.ok) revalidatePath("/admin");
  return result;
}

export async function changeRoleAction(values: unknown) {
  const result = await runAction(["admin"], changeRoleSchema, values, (caller, data) =>
    changeRole(caller, data),
  );
  if (result.ok) revalidatePath("/admin");
  return result;
}

export async function setActiveAction(values: unknown) {
  const result = await runAction(["admin"], setActiveSchema, values, (caller, data) =>
    setUserActive(caller, data.userId, data.active),
  );
  if (result.ok) revalidatePath("/admin");
  return result;
}

export async function saveSalesSettingsAction(values: unknown) {
  const result = await runAction(["admin"], salesSettingsSchema, values, (caller, data) =>
    saveSalesSettings(caller, data),
  );
  if (result.ok) {
    revalidatePath("/admin/sales");
    revalidatePath("/pipeline");
  }
  return result;
}
