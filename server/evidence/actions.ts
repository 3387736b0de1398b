"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { clearEvidence, saveEvidence } from "@/db/queries/evidence";
import { runAction } from "@/server/actions/run";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { evidenceInputSchema, evidenceSubjectFieldSchema } from "@/lib/validations/evidence";

// The figure's page and every case result that reads it: a case's headline weighs evidence.
function revalidateEvidence() {
  revalidatePath("/axes", "layout");
  revalidatePath("/machines", "layout");
  revalidatePath("/cases", "layout");
}

export async function saveEvidenceAction(values: unknown) {
  const result = await runAction(VENDOR_ROLES, evidenceInputSchema, values, saveEvidence);
  if (result.ok) revalidateEvidence();
  return result;
}

export async function clearEvidenceAction(values: unknown) {
  const result = await runAction(VENDOR_ROLES, evidenceSubjectFieldSchema, values, clearEvidence);
  if (result.ok) revalidateEvidence();
  return result;
}
