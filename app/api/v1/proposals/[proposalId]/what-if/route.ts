import { NextResponse } from "next/server";
import { runWhatIf } from "@/server/review/decisions";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireUser } from "@/server/auth";
import { whatIfSchema } from "@/lib/validations/what-if";

// The CaseResult of the frozen proposal with the reviewer's figures: finance figures and factors
// on every value driver (lib/validations/what-if.ts). Computed on a copy; nothing is stored.
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
