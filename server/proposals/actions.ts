"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { addComment } from "@/server/review/decisions";
import { approveDiscount, updateQuote } from "@/db/queries/quotes";
import { sendProposal } from "@/server/proposals/send";
import { runAction } from "@/server/actions/run";
import { requireId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { caseIdSchema } from "@/lib/validations/case";
import { commentSchema, quoteUpdateSchema, sendProposalSchema } from "@/lib/validations/pipeline";

const VENDOR = VENDOR_ROLES;

// A quote's changes show on its page, its case's version list and the pipeline.
function refresh(proposalId: number) {
  revalidatePath(`/proposals/${proposalId}`);
  revalidatePath("/pipeline");
  revalidatePath("/cases", "layout");
}

export async function sendProposalAction(proposalId: number, values: unknown) {
  const result = await runAction(VENDOR, sendProposalSchema, values, (caller, data) =>
    sendProposal(caller, requireId(proposalId), data),
  );
  if (result.ok) refresh(proposalId);
  return result;
}

export async function approveDiscountAction(proposalId: number) {
  const result = await runAction(["manager"], caseIdSchema, proposalId, (caller, id) =>
    approveDiscount(caller, id),
  );
  if (result.ok) refresh(proposalId);
  return result;
}

export async function updateQuoteAction(proposalId: number, values: unknown) {
  const result = await runAction(["manager"], quoteUpdateSchema, values, (caller, data) =>
    updateQuote(caller, requireId(proposalId), data),
  );
  if (result.ok) refresh(proposalId);
  return result;
}

export async function addVendorCommentAction(proposalId: number, values: unknown) {
  const result = await runAction(VENDOR, commentSchema, values, (caller, data) =>
    addComment(caller, requireId(proposalId), data.body),
  );
  if (result.ok) refresh(proposalId);
  return result;
}
