"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import type { z } from "zod";
import {
  archiveAccount,
  createAccount,
  reassignOwner,
  renameAccount,
  restoreAccount,
  shareAccount,
  unshareAccount,
} from "@/db/queries/account-changes";
import type { ActionResult } from "@/server/actions/result";
import { runAction } from "@/server/actions/run";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { FieldConflictError } from "@/lib/field-conflict-error";
import {
  accountIdSchema,
  createAccountSchema,
  reassignOwnerSchema,
  renameAccountSchema,
  shareAccountSchema,
} from "@/lib/validations/account";

// runAction, plus a conflict that belongs to one field (a name taken, an engineer who owns the
// account already) shown beside that field instead of only in the form's status line.
async function accountAction<S extends z.ZodType, T>(
  schema: S,
  values: unknown,
  mutate: (caller: SessionUser, data: z.infer<S>) => T,
): Promise<ActionResult<T>> {
  const result = await runAction(VENDOR_ROLES, schema, values, (caller, data) => {
    try {
      return { done: true as const, value: mutate(caller, data) };
    } catch (error) {
      if (error instanceof FieldConflictError) return { done: false as const, error };
      throw error;
    }
  });
  if (!result.ok) return result;
  if (!result.data.done) {
    const { field, message } = result.data.error;
    return { ok: false, fieldErrors: { [field]: message }, message };
  }
  return { ok: true, data: result.data.value };
}

function revalidateAccount(accountId: number) {
  revalidatePath("/accounts", "layout");
  revalidatePath(`/accounts/${accountId}`);
  // Archiving and restoring change the new case's site choice.
  revalidatePath("/cases");
}

export async function createAccountAction(values: unknown) {
  const result = await accountAction(createAccountSchema, values, (caller, data) => ({
    id: createAccount(caller, data).id,
  }));
  if (result.ok) revalidatePath("/accounts", "layout");
  return result;
}

export async function renameAccountAction(values: unknown) {
  const result = await accountAction(renameAccountSchema, values, (caller, data) => {
    renameAccount(caller, data);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}

export async function shareAccountAction(values: unknown) {
  const result = await accountAction(shareAccountSchema, values, (caller, data) => {
    shareAccount(caller, data.accountId, data.userId);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}

export async function unshareAccountAction(values: unknown) {
  const result = await accountAction(shareAccountSchema, values, (caller, data) => {
    unshareAccount(caller, data.accountId, data.userId);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}

export async function reassignOwnerAction(values: unknown) {
  const result = await accountAction(reassignOwnerSchema, values, (caller, data) => {
    reassignOwner(caller, data);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}

export async function archiveAccountAction(values: unknown) {
  const result = await accountAction(accountIdSchema, values, (caller, data) => {
    archiveAccount(caller, data.accountId);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}

export async function restoreAccountAction(values: unknown) {
  const result = await accountAction(accountIdSchema, values, (caller, data) => {
    restoreAccount(caller, data.accountId);
    return data.accountId;
  });
  if (result.ok) revalidateAccount(result.data);
  return result;
}
