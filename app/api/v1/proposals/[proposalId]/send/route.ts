import { NextResponse } from "next/server";
import { sendProposal } from "@/server/proposals/send";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { sendProposalSchema } from "@/lib/validations/pipeline";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Sends the proposal to the customer's reviewer `{ email, name }`; `mail.status` is "queued"
// with a notice when the mail server did not take the message yet (it is retried).
export const POST = withApi(
  async (request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const id = idFromRoute((await context.params).proposalId);
    const body = sendProposalSchema.parse(await readJsonBody(request, 64 * 1024));
    return NextResponse.json(await sendProposal(caller, id, body));
  },
);
