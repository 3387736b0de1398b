import { and, asc, count, desc, eq, lt, or, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { proposals, quotes, users } from "@/db/schema";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type { ProposalListParams } from "@/lib/validations/case-lists";
import { contains } from "./case-list";
import type { CaseRow } from "./cases";
import { proposalChanges } from "./proposal-changes";
import type { ProposalSummary } from "./proposal-versions";

export const PROPOSALS_PAGE_SIZE = 10;

const sortColumns = {
  version: proposals.version,
  stage: quotes.stage,
  by: users.name,
} satisfies Record<ProposalListParams["sort"], unknown>;

/**
 * One page of a case's proposal versions (a case already fetched in the caller's scope), filtered
 * by quote stage and text (who froze it, or "v3"), sorted and paged in SQL. What changed is
 * worked out for the rows of the page only, each against the version before it.
 */
export function listProposalsPage(
  found: CaseRow,
  params: Partial<ProposalListParams>,
  pageSize = PROPOSALS_PAGE_SIZE,
): ListPage<ProposalSummary> {
  const filters: (SQL | undefined)[] = [eq(proposals.caseId, found.id)];
  if (params.stage) filters.push(eq(quotes.stage, params.stage));
  if (params.q) {
    const q = params.q.replace(/^v(?=\d+$)/i, "");
    filters.push(
      or(
        contains(users.name, params.q),
        /^\d+$/.test(q) ? eq(proposals.version, Number(q)) : undefined,
      ),
    );
  }
  const where = and(...filters);
  const [{ total }] = db
    .select({ total: count() })
    .from(proposals)
    .innerJoin(users, eq(users.id, proposals.createdById))
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .where(where)
    .all();
  const window = pageWindow(total, params.page ?? 1, pageSize);
  const order = params.dir === "asc" ? asc : desc;
  const rows = db
    .select({ proposal: proposals, createdByName: users.name, stage: quotes.stage })
    .from(proposals)
    .innerJoin(users, eq(users.id, proposals.createdById))
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .where(where)
    .orderBy(order(sortColumns[params.sort ?? "version"]), order(proposals.version))
    .limit(window.limit)
    .offset(window.offset)
    .all();
  const summaries = rows.map(({ proposal: row, createdByName, stage }) => {
    const before =
      db
        .select()
        .from(proposals)
        .where(and(eq(proposals.caseId, found.id), lt(proposals.version, row.version)))
        .orderBy(desc(proposals.version))
        .limit(1)
        .get() ?? null;
    return {
      id: row.id,
      caseId: row.caseId,
      version: row.version,
      engineVersion: row.engineVersion,
      createdAt: row.createdAt,
      createdById: row.createdById,
      createdByName,
      currency: row.result.currency,
      capex: row.result.totals.capex,
      npv: row.result.scenarios.physics.npv,
      paybackYears: row.result.scenarios.physics.paybackYears,
      stage,
      changes: proposalChanges(before, row, before?.version ?? 0),
    };
  });
  return { rows: summaries, total, page: window.page, pageCount: window.pageCount, pageSize };
}
