"use server";

import { revalidatePath } from "next/cache";
import { saveDossierSettings, setDossierPrice } from "@/db/queries/dossiers";
import { runAction } from "@/lib/actions/run";
import { requireId } from "@/lib/api/params";
import { dossierPriceSchema, uncertaintySettingsSchema } from "@/lib/validations/dossier";

export async function saveDossierSettingsAction(proposalId: number, values: unknown) {
  const result = await runAction(
    ["engineer", "manager", "admin"],
    uncertaintySettingsSchema,
    values,
    (caller, data) => saveDossierSettings(caller, requireId(proposalId), data),
  );
  if (result.ok) revalidatePath(`/dossiers/${proposalId}`);
  return result;
}

export async function setDossierPriceAction(values: unknown) {
  const result = await runAction(["admin"], dossierPriceSchema, values, (caller, data) =>
    setDossierPrice(caller, data),
  );
  if (result.ok) revalidatePath("/admin/payments");
  return result;
}
