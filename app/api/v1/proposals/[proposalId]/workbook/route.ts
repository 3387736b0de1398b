import { getProposalSnapshotOrThrow } from "@/db/queries/proposals";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireUser } from "@/server/auth";
import { parseFrozenInput } from "@/lib/results/stored-input-problems";
import { buildProposalWorkbook } from "@/lib/workbook";
import { listProposalEvidenceFor } from "@/db/queries/evidence";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";

// A frozen proposal as an .xlsx: built from the input and result stored when it was frozen, so
// it reads the same whatever happened to the case since. A reviewer downloads the workbooks of
// the proposals sent to their account; any other id is not found.
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireUser();
    const proposalId = idFromRoute((await context.params).proposalId);
    const { quote, input, result } = getProposalSnapshotOrThrow(caller, proposalId);
    const proposal = { ...quote, input, result };
    // The sources beside the frozen figures, as recorded now: the reviewer reads them through the
    // proposal sent to them, the vendor's people through the case (db/queries/evidence.ts).
    const evidence = listProposalEvidenceFor(caller, quote, frozenSubjects(input));
    const workbook = await buildProposalWorkbook(parseFrozenInput(proposal), proposal.result, {
      title: `${proposal.caseName}: retrofit proposal, version ${proposal.version}`,
      accountName: proposal.accountName,
      siteName: proposal.siteName,
      caseName: proposal.caseName,
      version: proposal.version,
      engineVersion: proposal.engineVersion,
      generatedAt: new Date().toISOString(),
      evidence: { caseId: quote.caseId, index: indexEvidence(evidence) },
    });
    // An ASCII file name: the header cannot carry the case name's other characters as they are.
    const base = proposal.caseName.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "") || "case";
    return new Response(new Uint8Array(workbook), {
      headers: {
        "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "content-disposition": `attachment; filename="${base}-v${proposal.version}.xlsx"`,
      },
    });
  },
);
