import { NextResponse } from "next/server";
import { approveDiscount } from "@/db/queries/quotes";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";

// A sales manager approves a kit discount above the administrator's threshold.
export const POST = withApi(
  async (_request: Request, context: { params: Promise<{ proposalId: string }> }) => {
    const caller = await requireRole("manager");
    const id = idFromRoute((await context.params).proposalId);
    approveDiscount(caller, id);
    return NextResponse.json({ approved: true });
  },
);
