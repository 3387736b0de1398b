import { getDossierAccess, getDossierSettings } from "@/db/queries/dossiers";
import { jsonError, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { buildDossier } from "@/lib/dossier";
import { parseFrozenInput } from "@/lib/results/stored-input-problems";
import { buildDossierWorkbook } from "@/lib/workbook";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { listProposalEvidenceFor } from "@/db/queries/evidence";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";

// The dossier workbook of a proposal: 402 until its account has paid (with the price, for the
// vendor's people who may buy it), then the .xlsx, built from the frozen input with the recorded
// seed and ranges. The customer's reviewer reads it too, for a proposal sent to their account.
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES, "reviewer");
    const id = idFromRoute((await context.params).proposalId);
    const { proposal, grant, price } = getDossierAccess(caller, id);
    if (!grant && caller.role === "reviewer") {
      return jsonError(
        402,
        "This proposal's dossier has not been bought yet; your supplier can add it to the proposal",
      );
    }
    if (!grant) {
      return jsonError(402, "This proposal's dossier is not paid for yet", {
        price: { amount: price.amount, currency: price.currency },
        checkout: { method: "POST", url: "/api/v1/payments/checkout", body: { proposalId: id } },
      });
    }
    const input = parseFrozenInput(proposal);
    const settings = getDossierSettings(caller, id);
    const dossier = buildDossier(input, settings);
    const workbook = await buildDossierWorkbook(input, dossier, {
      title: `${proposal.caseName}: dossier of proposal version ${proposal.version}`,
      accountName: proposal.accountName,
      siteName: proposal.siteName,
      caseName: proposal.caseName,
      version: proposal.version,
      engineVersion: dossier.result.engineVersion,
      generatedAt: new Date().toISOString(),
      // The Sources sheet after Cautions, for whoever downloads it (db/queries/evidence.ts).
      evidence: {
        caseId: proposal.caseId,
        index: indexEvidence(listProposalEvidenceFor(caller, proposal, frozenSubjects(input))),
      },
    });
    const base = proposal.caseName.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "") || "case";
    return new Response(new Uint8Array(workbook), {
      headers: {
        "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "content-disposition": `attachment; filename="${base}-v${proposal.version}-dossier.xlsx"`,
        "x-dossier-seed": String(settings.seed),
      },
    });
  },
);
