import { and, eq, or } from "drizzle-orm";
import { db } from "@/db";
import { quotes, users } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { STAGE_LABELS } from "@/lib/pipeline/stages";
import type { QuoteUpdateInput } from "@/lib/validations/pipeline";
import { recordAudit } from "./audit";
import { ownsOrSharesAccount } from "./accounts";
import { vendorQuoteOrThrow, type QuoteRow } from "./proposals";
import { setQuoteStage } from "./quote-stage";
import { getSalesSettings } from "./sales-settings";
import { discountAboveThreshold } from "@/lib/pipeline/discount";

// Sending a proposal (user, invitation, stage and mail together) is server/proposals/send.ts.
const label = (q: QuoteRow) => `${q.caseName} v${q.version}`;

/** A manager approves the kit discount of a proposal, so that it may be sent. */
export function approveDiscount(caller: SessionUser, proposalId: number) {
  assertRole(caller, "manager");
  const quote = vendorQuoteOrThrow(caller, proposalId);
  if (quote.discountApprovedAt)
    throw new ConflictError("The discount of this proposal is already approved.");
  const threshold = getSalesSettings().discountThresholdPct;
  if (!discountAboveThreshold(quote.maxDiscountPct, threshold))
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
          and(eq(users.role, "engineer"), ownsOrSharesAccount(ownerId, accountId)),
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
          and(eq(users.role, "engineer"), ownsOrSharesAccount(users.id, accountId)),
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
