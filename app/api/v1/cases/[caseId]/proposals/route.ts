import { NextResponse } from "next/server";
import { listProposals } from "@/db/queries/proposal-versions";
import { freezeProposal } from "@/server/cases/freeze";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

type Context = { params: Promise<{ caseId: string }> };

// The case's frozen versions, oldest first, each with what changed since the one before.
export const GET = withApi(async (_request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const caseId = idFromRoute((await context.params).caseId);
  return NextResponse.json({ proposals: listProposals(caller, caseId) });
});

// Freezes the case as its next proposal version.
export const POST = withApi(async (_request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const caseId = idFromRoute((await context.params).caseId);
  return NextResponse.json(freezeProposal(caller, caseId), { status: 201 });
});
