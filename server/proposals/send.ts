import "server-only";
import { randomBytes } from "node:crypto";
import { db } from "@/db";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { SessionUser } from "@/lib/auth/session-user";
import { ConflictError } from "@/lib/errors";
import { appUrl } from "@/lib/mail/app-url";
import { invitationMail, proposalSentMail } from "@/lib/mail/messages";
import { deliverMail, enqueueMail, type MailDelivery } from "@/server/mail/queue";
import { SENDABLE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import type { SendProposalInput } from "@/lib/validations/pipeline";
import { recordAudit } from "@/db/queries/audit";
import { awaitsFirstPassword, createInvitation } from "@/db/queries/invitations";
import {
  getProposalSnapshotOrThrow,
  vendorQuoteOrThrow,
  type QuoteRow,
} from "@/db/queries/proposals";
import { setQuoteStage } from "@/db/queries/quote-stage";
import { getSalesSettings } from "@/db/queries/sales-settings";
import { findUserForSignIn } from "@/db/queries/users";
import { proposalFacts, proposalValue } from "./facts";
import { needsDiscountApproval } from "@/lib/pipeline/discount";

const label = (q: QuoteRow) => `${q.caseName} v${q.version}`;

/** Why this quote cannot be sent now, or null when it can. */
export function sendBlocker(
  quote: QuoteRow,
  thresholdPct = getSalesSettings().discountThresholdPct,
) {
  if (quote.stage === "replaced")
    return `Version ${quote.version} was replaced by version ${quote.latestVersion}; send the newest version instead.`;
  if (!SENDABLE_STAGES.includes(quote.stage))
    return `This proposal is already ${STAGE_LABELS[quote.stage].toLowerCase()}; freeze a new version to send again.`;
  if (needsDiscountApproval(quote, thresholdPct))
    return `This proposal gives a kit discount of up to ${quote.maxDiscountPct} %, above the ${thresholdPct} % that may be sent without approval. A sales manager must approve the discount first.`;
  return null;
}

export type SendResult = {
  proposalId: number;
  stage: "sent";
  reviewer: { id: number; email: string; name: string; invited: boolean };
  mail: MailDelivery;
};

/**
 * Sends a proposal to the customer's reviewer: creates the reviewer for the proposal's account
 * when the address is new, with a single-use invitation to choose a password; mails them; the
 * quote becomes "sent". The user, invitation, stage, audit entry and message are written in one
 * transaction; the message is delivered after it, and a mail server that is down only queues it.
 */
export async function sendProposal(
  caller: SessionUser,
  proposalId: number,
  input: SendProposalInput,
): Promise<SendResult> {
  const quote = vendorQuoteOrThrow(caller, proposalId);
  const blocker = sendBlocker(quote);
  if (blocker) throw new ConflictError(blocker);
  const { input: caseInput, result } = getProposalSnapshotOrThrow(caller, proposalId);
  const existing = findUserForSignIn(input.email);
  if (existing && (existing.role !== "reviewer" || existing.accountId !== quote.accountId))
    throw new ConflictError(
      `${input.email} is already registered for someone else. Use the reviewer's own address at ${quote.accountName}, or ask an administrator.`,
    );
  if (existing && !existing.active)
    throw new ConflictError(
      `${input.email} has been deactivated. Ask an administrator to activate the reviewer first.`,
    );
  const invite = !existing || awaitsFirstPassword(existing.id);
  // A password nobody knows until the invitation sets one; hashed outside the transaction.
  const placeholderHash = existing ? null : hashPassword(randomBytes(32).toString("base64url"));
  const facts = proposalFacts(quote, caseInput);
  const value = proposalValue(result) ?? undefined;

  const { reviewer, mailId } = db.transaction((tx) => {
    const reviewer = existing
      ? { id: existing.id, email: existing.email, name: existing.name }
      : tx
          .insert(users)
          .values({
            email: input.email,
            name: input.name,
            role: "reviewer",
            accountId: quote.accountId,
            passwordHash: placeholderHash!,
          })
          .returning({ id: users.id, email: users.email, name: users.name })
          .get();
    if (!existing)
      recordAudit({
        actor: caller,
        action: "user.invite",
        targetType: "user",
        targetId: reviewer.id,
        detail: `${reviewer.email} as reviewer of ${quote.accountName}`,
      });
    const content = invite
      ? (() => {
          const { token, expiresAt } = createInvitation(tx, {
            userId: reviewer.id,
            proposalId,
            createdById: caller.id,
          });
          return invitationMail({
            recipientName: reviewer.name,
            senderName: caller.name,
            proposal: facts,
            value,
            invitationUrl: appUrl(`/invitation/${token}`),
            expiresAt,
            email: reviewer.email,
          });
        })()
      : proposalSentMail({
          recipientName: reviewer.name,
          senderName: caller.name,
          proposal: facts,
          value,
          proposalUrl: appUrl(`/review/proposals/${proposalId}`),
        });
    setQuoteStage(tx, quote, "sent", { sentAt: new Date().toISOString(), sentToId: reviewer.id });
    recordAudit({
      actor: caller,
      action: "proposal.send",
      targetType: "proposal",
      targetId: proposalId,
      detail: `${label(quote)} to ${reviewer.email}`,
    });
    const mailId = enqueueMail(tx, { email: reviewer.email, name: reviewer.name }, content);
    return { reviewer, mailId };
  });
  const mail = await deliverMail([mailId]);
  return {
    proposalId,
    stage: "sent",
    reviewer: { ...reviewer, invited: invite },
    mail,
  };
}
