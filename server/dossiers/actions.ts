"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { notFound } from "next/navigation";
import { saveDossierSettings, setDossierPrice } from "@/db/queries/dossiers";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { closeOpenCheckout } from "@/server/payments/checkout";
import { dossierPriceSchema, uncertaintySettingsSchema } from "@/lib/validations/dossier";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export async function saveDossierSettingsAction(proposalId: number, values: unknown) {
  const result = await runAction(VENDOR_ROLES, uncertaintySettingsSchema, values, (caller, data) =>
    saveDossierSettings(caller, requireId(proposalId), data),
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

// The cancel page's "Close the checkout" button (a form action, so it answers nothing: the page
// re-renders without the open checkout). Another account's proposal, or a role that never buys,
// gets the not-found page, as a proposal that does not exist would: no 500, nothing confirmed.
export async function closeDossierCheckoutAction(proposalId: number): Promise<void> {
  try {
    const caller = await requireRole(...VENDOR_ROLES);
    await closeOpenCheckout(caller, requireId(proposalId));
  } catch (error) {
    if (error instanceof NotFoundError || error instanceof ForbiddenError) notFound();
    throw error;
  }
  revalidatePath(`/dossiers/${proposalId}/cancelled`);
}
