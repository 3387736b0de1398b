import { NextResponse } from "next/server";
import { decideProposal } from "@/server/review/decisions";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { decisionSchema } from "@/lib/validations/pipeline";

// The reviewer's `{ decision: "accept" | "changes" | "decline", comment }`.
export const POST = withApi(
  async (request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireRole("reviewer");
    const id = idFromRoute((await context.params).proposalId);
    const body = decisionSchema.parse(await readJsonBody(request, 64 * 1024));
    return NextResponse.json(await decideProposal(caller, id, body));
  },
);
