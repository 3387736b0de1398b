"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { createCase, updateAssumptions } from "@/db/queries/cases";
import {
  setAxisRetrofit,
  setCaseAxes,
  setCaseAxesRetrofit,
  suggestKitsForCase,
} from "@/db/queries/case-axes";
import { duplicateCase, updateCaseDetails } from "@/db/queries/case-details";
import { freezeProposal } from "@/server/cases/freeze";
import { runAction } from "@/server/actions/run";
import type { ActionResult } from "@/server/actions/result";
import { requireId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import {
  axisRetrofitSchema,
  bulkRetrofitSchema,
  caseAssumptionsSchema,
  caseAxesSchema,
  caseDetailsSchema,
  caseIdSchema,
  createCaseSchema,
  duplicateCaseSchema,
  RETROFIT_LABELS,
} from "@/lib/validations/case";

const EDITORS = VENDOR_ROLES;

// Each edit changes the case's figures, so its pages and the list (stage, axis count) refresh.
function refresh(caseId: number) {
  revalidatePath("/cases");
  revalidatePath(`/cases/${caseId}`, "layout");
}

export async function createCaseAction(values: unknown) {
  const result = await runAction(EDITORS, createCaseSchema, values, (caller, data) => ({
    id: createCase(caller, data).id,
  }));
  if (result.ok) revalidatePath("/cases");
  return result;
}

export async function updateAssumptionsAction(caseId: number, values: unknown) {
  const result = await runAction(EDITORS, caseAssumptionsSchema, values, (caller, data) =>
    updateAssumptions(caller, requireId(caseId), data),
  );
  if (result.ok) refresh(caseId);
  return result;
}

export async function setCaseAxesAction(caseId: number, values: unknown) {
  const result = await runAction(EDITORS, caseAxesSchema, values, (caller, data) =>
    setCaseAxes(caller, requireId(caseId), data.axisIds),
  );
  if (result.ok) refresh(caseId);
  return result;
}

// A refused field's message starts with the field's name ("Discount % must be at most 100"),
// and the form's summary repeats the messages instead of a bare "check the fields".
function namingFields<T>(result: ActionResult<T>): ActionResult<T> {
  if (result.ok || Object.keys(result.fieldErrors).length === 0) return result;
  const fieldErrors = Object.fromEntries(
    Object.entries(result.fieldErrors).map(([key, message]) => {
      const label = RETROFIT_LABELS[key as keyof typeof RETROFIT_LABELS];
      return [key, label && !message.startsWith(label) ? `${label} ${message}` : message];
    }),
  );
  return { ...result, fieldErrors, message: Object.values(fieldErrors).join(" · ") };
}

export async function setAxisRetrofitAction(caseId: number, axisId: number, values: unknown) {
  const result = await runAction(EDITORS, axisRetrofitSchema, values, (caller, data) =>
    setAxisRetrofit(caller, requireId(caseId), requireId(axisId), data),
  );
  if (result.ok) refresh(caseId);
  return namingFields(result);
}

// Kit, discount, install hours and/or commissioning cost on many axes at once.
export async function setCaseAxesRetrofitAction(caseId: number, values: unknown) {
  const result = await runAction(EDITORS, bulkRetrofitSchema, values, (caller, data) =>
    setCaseAxesRetrofit(caller, requireId(caseId), data),
  );
  if (result.ok) refresh(caseId);
  return namingFields(result);
}

export async function updateCaseDetailsAction(caseId: number, values: unknown) {
  const result = await runAction(EDITORS, caseDetailsSchema, values, (caller, data) =>
    updateCaseDetails(caller, requireId(caseId), data),
  );
  if (result.ok) refresh(caseId);
  return result;
}

// Returns the copy's id only, to open its page.
export async function duplicateCaseAction(caseId: number, values: unknown) {
  const result = await runAction(EDITORS, duplicateCaseSchema, values, (caller, data) => ({
    id: duplicateCase(caller, requireId(caseId), data).id,
  }));
  if (result.ok) revalidatePath("/cases");
  return result;
}

export async function suggestKitsAction(caseId: number) {
  const result = await runAction(EDITORS, caseIdSchema, caseId, (caller, id) =>
    suggestKitsForCase(caller, id),
  );
  if (result.ok) refresh(caseId);
  return result;
}

// Returns the new version's id and number only: the frozen input and result stay on the server.
export async function freezeProposalAction(caseId: number) {
  const result = await runAction(EDITORS, caseIdSchema, caseId, (caller, id) => {
    const proposal = freezeProposal(caller, id);
    return { id: proposal.id, version: proposal.version };
  });
  if (result.ok) refresh(caseId);
  return result;
}
