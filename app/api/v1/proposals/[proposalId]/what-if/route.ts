import { NextResponse } from "next/server";
import { runWhatIf } from "@/server/review/decisions";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireUser } from "@/server/auth";
import { whatIfSchema } from "@/lib/validations/pipeline";

// The CaseResult of the frozen proposal with other finance figures (tariffPerKWh,
// tariffEscalationPct, discountRatePct, horizonYears). Nothing is stored or changed.
export const POST = withApi(
  async (request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireUser();
    const id = idFromRoute((await context.params).proposalId);
    const body = whatIfSchema.parse(await readJsonBody(request, 64 * 1024));
    return NextResponse.json(runWhatIf(caller, id, body), {
      headers: { "cache-control": "no-store" },
    });
  },
);
