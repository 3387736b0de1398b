"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import {
  deleteAxis,
  deleteMachine,
  deleteSite,
  undoDeletion,
} from "@/db/queries/installed-base-delete";
import { duplicateMachine } from "@/db/queries/machine-series";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { duplicateMachineSchema } from "@/lib/validations/installed-base";

// Deletes, undo and duplicate of the installed base. Whoever may edit may delete; the queries
// check the account scope, and a reviewer is refused by the role list here and by the queries.
const EDITORS = VENDOR_ROLES;
const nothing = z.object({}).strict().optional();

function refreshInstalledBase() {
  // Sites, machines and axes pages, the account pages that count them, and cases that lose axes.
  revalidatePath("/", "layout");
}

export async function deleteSiteAction(siteId: number) {
  const result = await runAction(EDITORS, nothing, undefined, (caller) =>
    deleteSite(caller, requireId(siteId)),
  );
  if (result.ok) refreshInstalledBase();
  return result;
}

export async function deleteMachineAction(machineId: number) {
  const result = await runAction(EDITORS, nothing, undefined, (caller) =>
    deleteMachine(caller, requireId(machineId)),
  );
  if (result.ok) refreshInstalledBase();
  return result;
}

export async function deleteAxisAction(axisId: number) {
  const result = await runAction(EDITORS, nothing, undefined, (caller) =>
    deleteAxis(caller, requireId(axisId)),
  );
  if (result.ok) refreshInstalledBase();
  return result;
}

export async function undoDeletionAction(undoId: number) {
  const result = await runAction(EDITORS, nothing, undefined, (caller) =>
    undoDeletion(caller, requireId(undoId)),
  );
  if (result.ok) refreshInstalledBase();
  return result;
}

export async function duplicateMachineAction(machineId: number, values: unknown) {
  const result = await runAction(EDITORS, duplicateMachineSchema, values, (caller, data) => {
    const copy = duplicateMachine(caller, requireId(machineId), data.name);
    return { id: copy.id, name: copy.name, axisRows: copy.axisRows };
  });
  if (result.ok) revalidatePath("/sites", "layout");
  return result;
}
