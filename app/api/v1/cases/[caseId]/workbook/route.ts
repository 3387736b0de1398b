import { buildCaseInput, getCaseOrThrow } from "@/db/queries/cases";
import { caseResult } from "@/server/cases/results";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { caseInputSchema } from "@/lib/engine";
import { buildProposalWorkbook } from "@/lib/workbook";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { listCaseEvidence } from "@/db/queries/evidence";
import { indexEvidence } from "@/lib/evidence/subjects";

// The case as it stands as an .xlsx whose formulas recompute every figure; no version, since
// nothing is frozen (GET /api/v1/proposals/{id}/workbook gives a frozen one).
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ caseId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const caseId = idFromRoute((await context.params).caseId);
    const found = getCaseOrThrow(caller, caseId);
    const input = buildCaseInput(caller, caseId);
    const result = caseResult(caller, caseId);
    const workbook = await buildProposalWorkbook(caseInputSchema.parse(input), result, {
      title: `${found.name}: retrofit business case`,
      accountName: found.accountName,
      siteName: found.siteName,
      caseName: found.name,
      version: null,
      engineVersion: result.engineVersion,
      generatedAt: new Date().toISOString(),
      evidence: { caseId, index: indexEvidence(listCaseEvidence(caller, caseId)) },
    });
    // An ASCII file name: the header cannot carry the case name's other characters as they are.
    const file = `${found.name.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "") || "case"}.xlsx`;
    return new Response(new Uint8Array(workbook), {
      headers: {
        "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "content-disposition": `attachment; filename="${file}"`,
        "cache-control": "no-store",
      },
    });
  },
);
