import { NextResponse } from "next/server";
import { getProposalSnapshotOrThrow, viewFor } from "@/db/queries/proposals";
import { updateQuote } from "@/db/queries/quotes";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole, requireUser } from "@/server/auth";
import { quoteUpdateSchema } from "@/lib/validations/pipeline";

type Context = { params: Promise<{ proposalId: string }> };

// One proposal with its frozen input and result; any id outside the caller's scope is a 404.
export const GET = withApi(async (_request: Request, context: Context) => {
  const caller = await requireUser();
  const id = idFromRoute((await context.params).proposalId);
  const { quote, input, result } = getProposalSnapshotOrThrow(caller, id);
  return NextResponse.json({ ...viewFor(caller, quote), input, result });
});

// A manager moves the quote's stage, owner or expected close date (the frozen figures stay).
export const PATCH = withApi(async (request: Request, context: Context) => {
  const caller = await requireRole("manager");
  const id = idFromRoute((await context.params).proposalId);
  const body = quoteUpdateSchema.parse(await readJsonBody(request, 64 * 1024));
  const { changes } = updateQuote(caller, id, body);
  const { quote } = getProposalSnapshotOrThrow(caller, id);
  return NextResponse.json({ ...viewFor(caller, quote), changes });
});
