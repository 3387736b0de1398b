import { readJsonBody, withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { createDossierCheckout } from "@/server/payments/checkout";
import { checkoutRequestSchema } from "@/lib/validations/dossier";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Starts paying for a proposal's dossier: { proposalId } in, the hosted checkout's URL out. The
// price comes from the administrators' setting, never from the request.
export const POST = withApi(async (request: Request) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const { proposalId } = checkoutRequestSchema.parse(await readJsonBody(request, 16 * 1024));
  const { url, sessionId } = await createDossierCheckout(caller, proposalId);
  return Response.json({ url, sessionId }, { status: 201 });
});
