import { NextResponse } from "next/server";
import { buildCaseInput, getCaseOrThrow } from "@/db/queries/cases";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The case with `input`, the full CaseInput the engine receives for it (docs/model.md).
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ caseId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const caseId = idFromRoute((await context.params).caseId);
    const found = getCaseOrThrow(caller, caseId);
    return NextResponse.json({ ...found, input: buildCaseInput(caller, caseId) });
  },
);
