import { and, asc, count, desc, eq, like, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { accounts, cases, proposals, quotes, sites } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { openWeighted, stageTotals, sum, winRate, type StageTotal } from "@/lib/pipeline/figures";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type { PipelineFilters, PipelineListParams, PipelineSort } from "@/lib/validations/pipeline";
import {
  listVisibleQuotes,
  proposalScope,
  quoteOwner,
  quoteQuery,
  vendorView,
  type VendorProposal,
} from "./proposals";
import { getSalesSettings } from "./sales-settings";

export type Pipeline = {
  stages: StageTotal[];
  quotes: VendorProposal[];
  totals: { currency: string; count: number; value: string; weighted: string }[];
  byMonth: { month: string; currency: string; count: number; value: string; weighted: string }[];
};

// Managers see every quote; an engineer sees the quotes they own (docs/product.md (Roles)).
function pipelineScope(caller: SessionUser): SQL | undefined {
  assertRole(caller, "manager", "engineer");
  return caller.role === "engineer" ? eq(quotes.ownerId, caller.id) : undefined;
}

function filterWhere(filters: PipelineFilters): SQL | undefined {
  return and(
    filters.owner ? eq(quotes.ownerId, filters.owner) : undefined,
    filters.stage ? eq(quotes.stage, filters.stage) : undefined,
    filters.account ? eq(cases.accountId, filters.account) : undefined,
    filters.closeMonth ? like(quotes.expectedCloseOn, `${filters.closeMonth}-%`) : undefined,
  );
}

/**
 * Every quote the caller may see, filtered, with totals per stage and per close month. All sums
 * are Decimal sums of the very rows returned, per currency; weighted sums cover open quotes only.
 */
export function pipeline(caller: SessionUser, filters: PipelineFilters = {}): Pipeline {
  const probabilities = getSalesSettings().stageProbabilities;
  const rows = listVisibleQuotes(caller, and(pipelineScope(caller), filterWhere(filters)));
  const list = rows.map((r) => vendorView(r, probabilities));
  const currencies = [...new Set(list.map((q) => q.currency))].sort();
  const months = [...new Set(list.map((q) => q.expectedCloseOn.slice(0, 7)))].sort();
  return {
    stages: stageTotals(list, QUOTE_STAGES),
    quotes: list,
    totals: currencies.map((currency) => {
      const inCurrency = list.filter((q) => q.currency === currency);
      return {
        currency,
        count: inCurrency.length,
        value: sum(inCurrency.map((q) => q.value)),
        weighted: openWeighted(inCurrency),
      };
    }),
    byMonth: currencies.flatMap((currency) =>
      months.map((month) => {
        const inMonth = list.filter(
          (q) => q.currency === currency && q.expectedCloseOn.startsWith(month),
        );
        return {
          month,
          currency,
          count: inMonth.length,
          value: sum(inMonth.map((q) => q.value)),
          weighted: openWeighted(inMonth),
        };
      }),
    ),
  };
}

/**
 * Accepted against declined quotes decided between the first day of `from` and the last day of
 * `to` (months, UTC), within the caller's scope and the owner and account filters.
 */
export function pipelineWinRate(
  caller: SessionUser,
  period: { from: string; to: string },
  filters: Pick<PipelineFilters, "owner" | "account"> = {},
) {
  const rows = listVisibleQuotes(
    caller,
    and(pipelineScope(caller), filterWhere({ owner: filters.owner, account: filters.account })),
  );
  const [toYear, toMonth] = period.to.split("-").map(Number);
  const end = new Date(Date.UTC(toYear, toMonth, 1)).toISOString();
  const start = `${period.from}-01T00:00:00.000Z`;
  const decided = rows.filter(
    (r) => r.decidedAt !== null && r.decidedAt >= start && r.decidedAt < end,
  );
  return { ...winRate(decided), from: period.from, to: period.to };
}

/** The owners and accounts the caller's quotes have, for the filter choices. */
export function pipelineFilterOptions(caller: SessionUser) {
  const rows = listVisibleQuotes(caller, pipelineScope(caller));
  const owners = new Map(rows.map((r) => [r.ownerId, r.ownerName]));
  const accounts = new Map(rows.map((r) => [r.accountId, r.accountName]));
  const byName = (a: { name: string }, b: { name: string }) => a.name.localeCompare(b.name);
  return {
    owners: [...owners].map(([id, name]) => ({ id, name })).sort(byName),
    accounts: [...accounts].map(([id, name]) => ({ id, name })).sort(byName),
  };
}

export const PIPELINE_PAGE_SIZE = 25;

// Each sort of the quote list as SQL. The value is stored as a decimal string, so it sorts as a
// number; the weighted value is that number times the stage's chance as the administrator set it
// (the rounding of the shown amount does not change the order). A payback that never comes sorts
// after every other one.
function sortOrder(
  sort: PipelineSort,
  probabilities: Record<string, number>,
  direction: typeof asc,
): SQL[] {
  const stageRank = sql`case ${quotes.stage} ${sql.join(
    QUOTE_STAGES.map((s, i) => sql`when ${s} then ${i}`),
    sql` `,
  )} end`;
  const chance = sql`case ${quotes.stage} ${sql.join(
    QUOTE_STAGES.map((s) => sql`when ${s} then ${probabilities[s]}`),
    sql` `,
  )} end`;
  switch (sort) {
    case "proposal":
      return [direction(sql`${cases.name} collate nocase`), direction(sql`${proposals.version}`)];
    case "account":
      return [direction(sql`${accounts.name} collate nocase`)];
    case "owner":
      return [direction(sql`${quoteOwner.name} collate nocase`)];
    case "stage":
      return [direction(stageRank)];
    case "value":
      return [direction(sql`cast(${quotes.value} as real)`)];
    case "weighted":
      return [direction(sql`cast(${quotes.value} as real) * ${chance}`)];
    case "close":
      return [direction(sql`${quotes.expectedCloseOn}`)];
    case "payback":
      return [asc(sql`${quotes.paybackYears} is null`), direction(quotes.paybackYears)];
    case "created":
      return [direction(sql`${proposals.createdAt}`)];
  }
}

/**
 * One page of the quote list, sorted in SQL, within the same scope and filters as pipeline()
 * (whose totals and charts stay over every filtered quote, not just this page).
 */
export function pipelineQuotesPage(
  caller: SessionUser,
  filters: PipelineFilters,
  list: Partial<PipelineListParams> = {},
  pageSize = PIPELINE_PAGE_SIZE,
): ListPage<VendorProposal> {
  const probabilities = getSalesSettings().stageProbabilities;
  const where = and(proposalScope(caller), pipelineScope(caller), filterWhere(filters));
  const total = db
    .select({ n: count() })
    .from(proposals)
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .where(where)
    .get()!.n;
  const window = pageWindow(total, list.page ?? 1, pageSize);
  const direction = list.dir === "asc" ? asc : desc;
  const rows = quoteQuery()
    .where(where)
    .orderBy(
      ...sortOrder(list.sort ?? "created", probabilities, direction),
      direction(proposals.id),
    )
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return {
    rows: rows.map((r) => vendorView(r, probabilities)),
    total,
    page: window.page,
    pageCount: window.pageCount,
    pageSize,
  };
}
