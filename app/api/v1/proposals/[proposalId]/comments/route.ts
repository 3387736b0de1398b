import { NextResponse } from "next/server";
import { addComment } from "@/server/review/decisions";
import { listComments } from "@/db/queries/proposal-comments";
import { readJsonBody, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireUser } from "@/server/auth";
import { commentSchema } from "@/lib/validations/pipeline";

type Context = { params: Promise<{ proposalId: string }> };

// The proposal's conversation between the customer's reviewer and the vendor, oldest first.
export const GET = withApi(async (_request: Request, context: Context) => {
  const caller = await requireUser();
  const id = idFromRoute((await context.params).proposalId);
  return NextResponse.json({ comments: listComments(caller, id) });
});

export const POST = withApi(async (request: Request, context: Context) => {
  const caller = await requireUser();
  const id = idFromRoute((await context.params).proposalId);
  const { body } = commentSchema.parse(await readJsonBody(request, 64 * 1024));
  return NextResponse.json(await addComment(caller, id, body), { status: 201 });
});
