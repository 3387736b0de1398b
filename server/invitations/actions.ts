"use server";
import "server-only";

import { acceptInvitation } from "@/db/queries/invitations";
import { failed, invalid, type ActionResult } from "@/server/actions/result";
import { setPasswordSchema } from "@/lib/validations/invitation";

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
