import { and, desc, eq, isNotNull, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import { db } from "@/db";
import { accounts, cases, proposals, quotes, sites, users } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import type { CaseInput, CaseResult } from "@/lib/engine";
import { NotFoundError } from "@/lib/errors";
import { weightedValue } from "@/lib/pipeline/figures";
import type { QuoteStage } from "@/lib/pipeline/stages";
import { accountScope } from "./accounts";
import { getSalesSettings } from "./sales-settings";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import type { VendorRevenue } from "@/lib/pipeline/revenue";
import { revenueColumnsOfQuote, revenueOfQuotes } from "./vendor-revenue";

// Frozen proposals with their sales side (the quote), as each role may see them: the vendor's
// people by their account scope, a reviewer only the proposals sent to their own account. A
// proposal outside the scope is not found, exactly like one that does not exist.

const owner = alias(users, "quote_owner");
// The owner's row in quoteQuery(), for lists that sort by the owner's name.
export const quoteOwner = owner;
const sentTo = alias(users, "quote_sent_to");

const rowColumns = {
  id: proposals.id,
  caseId: proposals.caseId,
  version: proposals.version,
  engineVersion: proposals.engineVersion,
  createdAt: proposals.createdAt,
  caseName: cases.name,
  accountId: cases.accountId,
  accountName: accounts.name,
  siteId: cases.siteId,
  siteName: sites.name,
  stage: quotes.stage,
  ownerId: quotes.ownerId,
  ownerName: owner.name,
  ownerEmail: owner.email,
  value: quotes.value,
  currency: quotes.currency,
  paybackYears: quotes.paybackYears,
  maxDiscountPct: quotes.maxDiscountPct,
  expectedCloseOn: quotes.expectedCloseOn,
  sentAt: quotes.sentAt,
  sentToId: quotes.sentToId,
  sentToName: sentTo.name,
  sentToEmail: sentTo.email,
  decidedAt: quotes.decidedAt,
  discountApprovedAt: quotes.discountApprovedAt,
  discountApprovedById: quotes.discountApprovedById,
  // Stored when the proposal was frozen; vendorViews reads them (never shown to a reviewer).
  ...revenueColumnsOfQuote,
  latestVersion: sql<number>`(select max(p2.version) from ${proposals} p2 where p2.case_id = ${proposals.caseId})`,
};

export function quoteQuery() {
  return db
    .select(rowColumns)
    .from(proposals)
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .innerJoin(owner, eq(owner.id, quotes.ownerId))
    .leftJoin(sentTo, eq(sentTo.id, quotes.sentToId));
}

export type QuoteRow = Awaited<ReturnType<ReturnType<typeof quoteQuery>["all"]>>[number];

/** What the caller may see: a reviewer their own account's sent proposals, others by account. */
export function proposalScope(caller: SessionUser): SQL | undefined {
  if (caller.role === "reviewer")
    return and(eq(cases.accountId, caller.accountId ?? -1), isNotNull(quotes.sentAt));
  return accountScope(caller);
}

export function listVisibleQuotes(caller: SessionUser, where?: SQL): QuoteRow[] {
  return quoteQuery()
    .where(and(proposalScope(caller), where))
    .orderBy(desc(proposals.createdAt), desc(proposals.id))
    .all();
}

export function getVisibleQuoteOrThrow(caller: SessionUser, id: number): QuoteRow {
  const row = quoteQuery()
    .where(and(eq(proposals.id, id), proposalScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such proposal");
  return row;
}

/** The quote and its frozen snapshot (input, result), for the proposal pages and the sandbox. */
export function getProposalSnapshotOrThrow(caller: SessionUser, id: number) {
  const quote = getVisibleQuoteOrThrow(caller, id);
  const { input, result } = db
    .select({ input: proposals.input, result: proposals.result })
    .from(proposals)
    .where(eq(proposals.id, id))
    .get()!;
  return { quote, input: input as CaseInput, result: result as CaseResult };
}

export function vendorQuoteOrThrow(caller: SessionUser, id: number) {
  assertRole(caller, ...VENDOR_ROLES);
  return getVisibleQuoteOrThrow(caller, id);
}

/** The proposal as a reviewer may read it: no weights, discounts or internal dates. */
export function reviewerView(row: QuoteRow) {
  return {
    id: row.id,
    accountId: row.accountId,
    accountName: row.accountName,
    siteName: row.siteName,
    caseName: row.caseName,
    version: row.version,
    latestVersion: row.latestVersion,
    stage: row.stage,
    value: row.value,
    currency: row.currency,
    paybackYears: row.paybackYears,
    engineVersion: row.engineVersion,
    sentAt: row.sentAt,
    decidedAt: row.decidedAt,
    ownerName: row.ownerName,
    createdAt: row.createdAt,
  };
}

/**
 * The proposal as the vendor's people read it: the quote with the vendor's revenue (what they
 * invoice) beside `value`, the customer's investment, and the revenue weighted by the stage's chance.
 */
export function vendorView(
  row: QuoteRow,
  probabilities: Record<QuoteStage, number>,
  revenue: VendorRevenue,
) {
  const probabilityPct = probabilities[row.stage];
  return {
    ...reviewerView(row),
    caseId: row.caseId,
    siteId: row.siteId,
    ownerId: row.ownerId,
    vendorRevenue: revenue.revenue,
    revenueParts: revenue,
    probabilityPct,
    weighted: weightedValue(revenue.revenue, probabilityPct, row.currency),
    expectedCloseOn: row.expectedCloseOn,
    maxDiscountPct: row.maxDiscountPct,
    discountApprovedAt: row.discountApprovedAt,
    sentToName: row.sentToName,
    sentToEmail: row.sentToEmail,
  };
}

export type ReviewerProposal = ReturnType<typeof reviewerView>;
export type VendorProposal = ReturnType<typeof vendorView>;

/**
 * The vendor's view of each row, with the revenue its quote stored when frozen (worked out of the
 * frozen input only for a quote that still lacks it).
 */
export function vendorViews(rows: QuoteRow[], probabilities: Record<QuoteStage, number>) {
  const revenue = revenueOfQuotes(rows);
  return rows.map((row) => vendorView(row, probabilities, revenue.get(row.id)!));
}

/** Each visible proposal in the shape the caller's role may read. */
export function viewFor(caller: SessionUser, row: QuoteRow): ReviewerProposal | VendorProposal {
  return caller.role === "reviewer"
    ? reviewerView(row)
    : vendorViews([row], getSalesSettings().stageProbabilities)[0];
}

export function listProposalsFor(caller: SessionUser) {
  const rows = listVisibleQuotes(caller);
  return caller.role === "reviewer"
    ? rows.map(reviewerView)
    : vendorViews(rows, getSalesSettings().stageProbabilities);
}
