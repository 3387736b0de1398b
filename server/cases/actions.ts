"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { createCase, updateAssumptions } from "@/db/queries/cases";
import { setAxisRetrofit, setCaseAxes, suggestKitsForCase } from "@/db/queries/case-axes";
import { freezeProposal } from "@/server/cases/freeze";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import {
  axisRetrofitSchema,
  caseAssumptionsSchema,
  caseAxesSchema,
  caseIdSchema,
  createCaseSchema,
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

export async function setAxisRetrofitAction(caseId: number, axisId: number, values: unknown) {
  const result = await runAction(EDITORS, axisRetrofitSchema, values, (caller, data) =>
    setAxisRetrofit(caller, requireId(caseId), requireId(axisId), data),
  );
  if (result.ok) refresh(caseId);
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
