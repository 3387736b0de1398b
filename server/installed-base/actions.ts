"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { createAxis, updateAxis } from "@/db/queries/axes";
import { createMachine, updateMachine } from "@/db/queries/machines";
import { createSite, updateSite } from "@/db/queries/sites";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import {
  axisInputSchema,
  machineInputSchema,
  siteInputSchema,
} from "@/lib/validations/installed-base";

const EDITORS = VENDOR_ROLES;

export async function createSiteAction(accountId: number, values: unknown) {
  const result = await runAction(
    EDITORS,
    siteInputSchema,
    values,
    (caller, data) => createSite(caller, requireId(accountId), data).id,
  );
  if (result.ok) revalidatePath(`/accounts/${accountId}`);
  return result;
}

export async function updateSiteAction(siteId: number, values: unknown) {
  const result = await runAction(EDITORS, siteInputSchema, values, (caller, data) =>
    updateSite(caller, requireId(siteId), data),
  );
  // The site's pages, its edit form among them.
  if (result.ok) revalidatePath(`/sites/${siteId}`, "layout");
  return result;
}

export async function createMachineAction(siteId: number, values: unknown) {
  const result = await runAction(
    EDITORS,
    machineInputSchema,
    values,
    (caller, data) => createMachine(caller, requireId(siteId), data).id,
  );
  if (result.ok) revalidatePath(`/sites/${siteId}`);
  return result;
}

export async function updateMachineAction(machineId: number, values: unknown) {
  const result = await runAction(EDITORS, machineInputSchema, values, (caller, data) =>
    updateMachine(caller, requireId(machineId), data),
  );
  if (result.ok) {
    // The machine's own page (where it is edited) and the site pages that list it.
    revalidatePath(`/machines/${machineId}`);
    revalidatePath("/sites", "layout");
  }
  return result;
}

export async function saveAxisAction(axisId: number | null, values: unknown) {
  const result = await runAction(EDITORS, axisInputSchema, values, (caller, data) => {
    if (axisId === null) return createAxis(caller, data).id;
    const id = requireId(axisId);
    updateAxis(caller, id, data);
    return id;
  });
  if (result.ok) revalidatePath("/sites", "layout");
  return result;
}
