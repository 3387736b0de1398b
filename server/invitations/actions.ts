"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { acceptInvitation, revokeInvitation } from "@/db/queries/invitations";
import { failed, invalid, type ActionResult } from "@/server/actions/result";
import { runAction } from "@/server/actions/run";
import { invitationUserSchema, setPasswordSchema } from "@/lib/validations/invitation";
import { resendInvitation } from "./resend";

// Public: the token in the link is the credential, so there is no caller to check here.
export async function acceptInvitationAction(
  token: string,
  values: unknown,
): Promise<ActionResult<{ email: string; proposalId: number | null }>> {
  const parsed = setPasswordSchema.safeParse(values);
  if (!parsed.success) return invalid(parsed.error);
  try {
    return { ok: true, data: acceptInvitation(token, parsed.data.password) };
  } catch (error) {
    return failed(error);
  }
}

// Administrators only: a new link by e-mail for a user who has not chosen a password yet.
export async function resendInvitationAction(values: unknown) {
  const result = await runAction(["admin"], invitationUserSchema, values, (caller, data) =>
    resendInvitation(caller, data.userId),
  );
  if (result.ok) revalidatePath("/admin");
  return result;
}

// Administrators only: the open link stops working; the user stays, unable to sign in.
export async function revokeInvitationAction(values: unknown) {
  const result = await runAction(["admin"], invitationUserSchema, values, (caller, data) =>
    revokeInvitation(caller, data.userId),
  );
  if (result.ok) revalidatePath("/admin");
  return result;
}
