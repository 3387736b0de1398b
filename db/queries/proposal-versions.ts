import { and, asc, eq, getTableColumns, sql } from "drizzle-orm";
import { db } from "@/db";
import {
  accounts,
  cases,
  proposals,
  quotes,
  sites,
  users,
  type Proposal,
  type QuoteStage,
} from "@/db/schema";
import { ENGINE_VERSION, type CaseInput, type CaseResult } from "@/lib/engine";
import type { SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import { recordAudit } from "./audit";
import { caseScope, getCaseOrThrow, touchCase, type CaseRow } from "./cases";
import { proposalChanges } from "./proposal-changes";
import { openQuoteFor } from "./quote-open";

// A case's frozen proposal versions: storing the next one, listing them with what changed, and
// finding one in the caller's scope.

/**
 * Stores the case's next proposal version: the input as the engine received it, its result and
 * the engine version. Nothing updates a proposal afterwards (the database refuses it); its sales
 * side starts as a quote ready to send, and replaces the case's older open quotes. Freezing
 * (evaluate, then store) is server/cases/freeze.ts.
 */
export function storeProposalVersion(
  caller: SessionUser,
  found: CaseRow,
  input: CaseInput,
  result: CaseResult,
): Proposal {
  const caseId = found.id;
  const proposal = db.transaction((tx) => {
    const [{ last }] = tx
      .select({ last: sql<number | null>`max(${proposals.version})` })
      .from(proposals)
      .where(eq(proposals.caseId, caseId))
      .all();
    const [row] = tx
      .insert(proposals)
      .values({
        caseId,
        version: (last ?? 0) + 1,
        input,
        result,
        engineVersion: ENGINE_VERSION,
        createdById: caller.id,
      })
      .returning()
      .all();
    openQuoteFor(tx, row, found.ownerId);
    return row;
  });
  // Sending a proposal moves a case still being modelled to "proposed"; won and lost stay.
  if (found.stage === "draft" || found.stage === "modelled")
    touchCase(caseId, found.updatedAt, { stage: "proposed" });
  recordAudit({
    actor: caller,
    action: "proposal.freeze",
    targetType: "proposal",
    targetId: proposal.id,
    detail: `${found.name} v${proposal.version}`,
  });
  return proposal;
}

export type ProposalSummary = {
  id: number;
  caseId: number;
  version: number;
  engineVersion: string;
  createdAt: string;
  createdById: number;
  createdByName: string;
  currency: string;
  capex: string;
  npv: string;
  paybackYears: number | null;
  stage: QuoteStage;
  changes: string[];
};

/** The case's proposals, oldest first, each with what changed since the version before. */
export function listProposals(caller: SessionUser, caseId: number): ProposalSummary[] {
  return listProposalsOf(getCaseOrThrow(caller, caseId));
}

/** listProposals for a case the caller has already been checked against (a getCaseOrThrow row). */
export function listProposalsOf(found: CaseRow): ProposalSummary[] {
  const caseId = found.id;
  const rows = db
    .select({ ...getTableColumns(proposals), createdByName: users.name, stage: quotes.stage })
    .from(proposals)
    .innerJoin(users, eq(users.id, proposals.createdById))
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .where(eq(proposals.caseId, caseId))
    .orderBy(asc(proposals.version))
    .all();
  return rows.map((row, i) => ({
    id: row.id,
    caseId: row.caseId,
    version: row.version,
    engineVersion: row.engineVersion,
    createdAt: row.createdAt,
    createdById: row.createdById,
    createdByName: row.createdByName,
    currency: row.result.currency,
    capex: row.result.totals.capex,
    npv: row.result.scenarios.physics.npv,
    paybackYears: row.result.scenarios.physics.paybackYears,
    stage: row.stage,
    changes: proposalChanges(i === 0 ? null : rows[i - 1], row, i === 0 ? 0 : rows[i - 1].version),
  }));
}

/** Proposals with the names of their case, account and site; the caller adds the scope. */
export function proposalWithCaseQuery() {
  return db
    .select({
      ...getTableColumns(proposals),
      caseName: cases.name,
      accountId: cases.accountId,
      accountName: accounts.name,
      siteId: cases.siteId,
      siteName: sites.name,
    })
    .from(proposals)
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .$dynamic();
}

export function getProposalOrThrow(caller: SessionUser, id: number) {
  const row = proposalWithCaseQuery()
    .where(and(eq(proposals.id, id), caseScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such proposal");
  return row;
}
