"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { addComment, decideProposal } from "@/server/review/decisions";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { commentSchema, decisionSchema } from "@/lib/validations/pipeline";

function refresh(proposalId: number) {
  revalidatePath("/review");
  revalidatePath(`/review/proposals/${proposalId}`);
}

export async function decideAction(proposalId: number, values: unknown) {
  const result = await runAction(["reviewer"], decisionSchema, values, (caller, data) =>
    decideProposal(caller, requireId(proposalId), data),
  );
  if (result.ok) refresh(proposalId);
  return result;
}

export async function addReviewerCommentAction(proposalId: number, values: unknown) {
  const result = await runAction(["reviewer"], commentSchema, values, (caller, data) =>
    addComment(caller, requireId(proposalId), data.body),
  );
  if (result.ok) refresh(proposalId);
  return result;
}
