import "server-only";
import { db } from "@/db";
import { proposalComments } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { evaluateCase, type CaseResult } from "@/lib/engine";
import { ConflictError } from "@/lib/errors";
import { appUrl } from "@/lib/mail/app-url";
import { commentMail, decisionMail } from "@/lib/mail/messages";
import { deliverMail, enqueueMail, type MailDelivery } from "@/server/mail/queue";
import { DECIDABLE_STAGES, STAGE_LABELS, type QuoteStage } from "@/lib/pipeline/stages";
import type { DecisionInput } from "@/lib/validations/pipeline";
import type { WhatIfInput } from "@/lib/validations/what-if";
import { applyWhatIf } from "@/lib/review/what-if";
import { recordAudit } from "@/db/queries/audit";
import { proposalFacts } from "@/server/proposals/facts";
import { getProposalSnapshotOrThrow } from "@/db/queries/proposals";
import { setQuoteStage } from "@/db/queries/quote-stage";

const STAGE_OF_DECISION: Record<DecisionInput["decision"], QuoteStage> = {
  accept: "accepted",
  changes: "changes",
  decline: "declined",
};

/**
 * The proposal's engine result with the reviewer's own finance figures (tariff, escalation,
 * discount rate, horizon) in place of the proposal's: computed on the frozen input, never stored.
 */
export function runWhatIf(
  caller: SessionUser,
  proposalId: number,
  overrides: WhatIfInput,
): CaseResult {
  const { input } = getProposalSnapshotOrThrow(caller, proposalId);
  return evaluateCase(applyWhatIf(input, overrides));
}

/**
 * The reviewer decides: the stage moves, the decision and its comment join the thread, the audit
 * log records it and the quote's owner is mailed (queued if the mail server is down).
 */
export async function decideProposal(
  caller: SessionUser,
  proposalId: number,
  input: DecisionInput,
): Promise<{ stage: QuoteStage; mail: MailDelivery }> {
  assertRole(caller, "reviewer");
  const { quote, input: caseInput } = getProposalSnapshotOrThrow(caller, proposalId);
  if (quote.stage === "replaced")
    throw new ConflictError(
      `Version ${quote.version} was replaced by version ${quote.latestVersion}; decide on the newest version.`,
    );
  if (!DECIDABLE_STAGES.includes(quote.stage))
    throw new ConflictError(
      `This proposal is already ${STAGE_LABELS[quote.stage].toLowerCase()}; the decision cannot be changed here. Write a comment to your contact instead.`,
    );
  const stage = STAGE_OF_DECISION[input.decision];
  const mailId = db.transaction((tx) => {
    setQuoteStage(tx, quote, stage);
    tx.insert(proposalComments)
      .values({ proposalId, authorId: caller.id, body: input.comment, decision: input.decision })
      .run();
    recordAudit({
      actor: caller,
      action: "proposal.decision",
      targetType: "proposal",
      targetId: proposalId,
      detail: `${quote.caseName} v${quote.version}: ${input.decision}${input.comment ? ` — ${input.comment.slice(0, 200)}` : ""}`,
    });
    return enqueueMail(
      tx,
      { email: quote.ownerEmail, name: quote.ownerName },
      decisionMail({
        recipientName: quote.ownerName,
        reviewerName: caller.name,
        decision: input.decision,
        comment: input.comment,
        proposal: proposalFacts(quote, caseInput),
        proposalUrl: appUrl(`/proposals/${proposalId}`),
      }),
    );
  });
  return { stage, mail: await deliverMail([mailId]) };
}

/**
 * A comment on the proposal's thread. The other side hears of it by mail: the reviewer's comment
 * goes to the quote's owner, a vendor comment to the reviewer the proposal was sent to.
 */
export async function addComment(
  caller: SessionUser,
  proposalId: number,
  body: string,
): Promise<{ id: number; mail: MailDelivery | null }> {
  const { quote, input } = getProposalSnapshotOrThrow(caller, proposalId);
  const fromReviewer = caller.role === "reviewer";
  const recipient = fromReviewer
    ? { email: quote.ownerEmail, name: quote.ownerName, url: `/proposals/${proposalId}` }
    : quote.sentToEmail
      ? {
          email: quote.sentToEmail,
          name: quote.sentToName ?? quote.sentToEmail,
          url: `/review/proposals/${proposalId}`,
        }
      : null;
  const { id, mailId } = db.transaction((tx) => {
    const row = tx
      .insert(proposalComments)
      .values({ proposalId, authorId: caller.id, body })
      .returning({ id: proposalComments.id })
      .get();
    const mailId =
      recipient && recipient.email !== caller.email
        ? enqueueMail(
            tx,
            { email: recipient.email, name: recipient.name },
            commentMail({
              recipientName: recipient.name,
              authorName: caller.name,
              body,
              proposal: proposalFacts(quote, input),
              proposalUrl: appUrl(recipient.url),
            }),
          )
        : null;
    return { id: row.id, mailId };
  });
  return { id, mail: mailId === null ? null : await deliverMail([mailId]) };
}
