import { randomBytes } from "node:crypto";
import { and, eq, exists, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { accounts, accountShares, quotes, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { appUrl } from "@/lib/mail/app-url";
import { invitationMail, proposalSentMail } from "@/lib/mail/messages";
import { deliverMail, enqueueMail, type MailDelivery } from "@/lib/mail/queue";
import { SENDABLE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import type { QuoteUpdateInput, SendProposalInput } from "@/lib/validations/pipeline";
import { recordAudit } from "./audit";
import { awaitsFirstPassword, createInvitation } from "./invitations";
import { proposalFacts } from "./proposal-facts";
import { getProposalSnapshotOrThrow, vendorQuoteOrThrow, type QuoteRow } from "./proposals";
import { setQuoteStage } from "./quote-stage";
import { getSalesSettings } from "./sales-settings";
import { findUserForSignIn } from "./users";

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
  if (quote.maxDiscountPct > thresholdPct && !quote.discountApprovedAt)
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
  const { input: caseInput } = getProposalSnapshotOrThrow(caller, proposalId);
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
            invitationUrl: appUrl(`/invitation/${token}`),
            expiresAt,
            email: reviewer.email,
          });
        })()
      : proposalSentMail({
          recipientName: reviewer.name,
          senderName: caller.name,
          proposal: facts,
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

/** A manager approves the kit discount of a proposal, so that it may be sent. */
export function approveDiscount(caller: SessionUser, proposalId: number) {
  assertRole(caller, "manager");
  const quote = vendorQuoteOrThrow(caller, proposalId);
  if (quote.discountApprovedAt)
    throw new ConflictError("The discount of this proposal is already approved.");
  const threshold = getSalesSettings().discountThresholdPct;
  if (quote.maxDiscountPct <= threshold)
    throw new ConflictError(
      `This proposal's largest discount (${quote.maxDiscountPct} %) is within the ${threshold} % that needs no approval.`,
    );
  const stamp = new Date().toISOString();
  db.update(quotes)
    .set({ discountApprovedById: caller.id, discountApprovedAt: stamp, updatedAt: stamp })
    .where(eq(quotes.proposalId, proposalId))
    .run();
  recordAudit({
    actor: caller,
    action: "proposal.approve-discount",
    targetType: "proposal",
    targetId: proposalId,
    detail: `${label(quote)}: up to ${quote.maxDiscountPct} % (threshold ${threshold} %)`,
  });
}

// Who may own a quote of an account: a manager, or an engineer who owns or shares the account.
function assertCanOwn(ownerId: number, accountId: number) {
  const row = db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(
      and(
        eq(users.id, ownerId),
        eq(users.active, true),
        or(
          eq(users.role, "manager"),
          and(
            eq(users.role, "engineer"),
            or(
              exists(
                db
                  .select({ one: sql`1` })
                  .from(accounts)
                  .where(and(eq(accounts.id, accountId), eq(accounts.ownerId, ownerId))),
              ),
              exists(
                db
                  .select({ one: sql`1` })
                  .from(accountShares)
                  .where(
                    and(eq(accountShares.accountId, accountId), eq(accountShares.userId, ownerId)),
                  ),
              ),
            ),
          ),
        ),
      ),
    )
    .get();
  if (!row)
    throw new NotFoundError(
      "No such owner: choose an active manager, or an engineer who works on this account",
    );
  return row;
}

/** A manager moves a quote's stage, owner or expected close date; each change is audited. */
export function updateQuote(caller: SessionUser, proposalId: number, input: QuoteUpdateInput) {
  assertRole(caller, "manager");
  const quote = vendorQuoteOrThrow(caller, proposalId);
  const changes: string[] = [];
  const newOwner =
    input.ownerId !== undefined && input.ownerId !== quote.ownerId
      ? assertCanOwn(input.ownerId, quote.accountId)
      : null;
  db.transaction((tx) => {
    const stamp = new Date().toISOString();
    if (newOwner) {
      tx.update(quotes)
        .set({ ownerId: newOwner.id, updatedAt: stamp })
        .where(eq(quotes.proposalId, proposalId))
        .run();
      changes.push(`owner ${quote.ownerName} → ${newOwner.name}`);
    }
    // The stage first: a decided stage dates the close to today unless a date is given with it.
    if (input.stage && input.stage !== quote.stage) {
      setQuoteStage(tx, quote, input.stage);
      changes.push(`stage ${STAGE_LABELS[quote.stage]} → ${STAGE_LABELS[input.stage]}`);
    }
    if (input.expectedCloseOn && input.expectedCloseOn !== quote.expectedCloseOn) {
      tx.update(quotes)
        .set({ expectedCloseOn: input.expectedCloseOn, updatedAt: stamp })
        .where(eq(quotes.proposalId, proposalId))
        .run();
      changes.push(`expected close ${quote.expectedCloseOn} → ${input.expectedCloseOn}`);
    }
    for (const change of changes)
      recordAudit({
        actor: caller,
        action: "quote.update",
        targetType: "proposal",
        targetId: proposalId,
        detail: `${label(quote)}: ${change}`,
      });
  });
  return { changes };
}

/** Who may own a quote of this account, for the manager's owner choice. */
export function listOwnerOptions(caller: SessionUser, accountId: number) {
  assertRole(caller, "manager");
  return db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(
      and(
        eq(users.active, true),
        or(
          eq(users.role, "manager"),
          and(
            eq(users.role, "engineer"),
            or(
              exists(
                db
                  .select({ one: sql`1` })
                  .from(accounts)
                  .where(and(eq(accounts.id, accountId), eq(accounts.ownerId, users.id))),
              ),
              exists(
                db
                  .select({ one: sql`1` })
                  .from(accountShares)
                  .where(
                    and(eq(accountShares.accountId, accountId), eq(accountShares.userId, users.id)),
                  ),
              ),
            ),
          ),
        ),
      ),
    )
    .orderBy(users.name)
    .all();
}

/** The account's reviewers, offered as recipients when a proposal is sent. */
export function listAccountReviewers(caller: SessionUser, proposalId: number) {
  const quote = vendorQuoteOrThrow(caller, proposalId);
  return db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(
      and(eq(users.role, "reviewer"), eq(users.accountId, quote.accountId), eq(users.active, true)),
    )
    .orderBy(users.name)
    .all();
}
