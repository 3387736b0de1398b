import { and, eq, like, type SQL } from "drizzle-orm";
import { cases, quotes } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { openWeighted, stageTotals, sum, winRate, type StageTotal } from "@/lib/pipeline/figures";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";
import type { ListPage } from "@/lib/lists/list-params";
import { quotePage } from "@/lib/pipeline/sort-quotes";
import type { PipelineFilters, PipelineListParams } from "@/lib/validations/pipeline";
import { listVisibleQuotes, vendorViews, type VendorProposal } from "./proposals";
import { getSalesSettings } from "./sales-settings";

export type Pipeline = {
  stages: StageTotal[];
  quotes: VendorProposal[];
  totals: GroupTotal[];
  byMonth: (GroupTotal & { month: string })[];
};

// Per currency (and month): how many quotes, the customer's investment (`value`), the vendor's
// revenue, and that revenue weighted over the open quotes only.
type GroupTotal = {
  currency: string;
  count: number;
  value: string;
  revenue: string;
  weighted: string;
};

function groupTotal(currency: string, rows: VendorProposal[]): GroupTotal {
  return {
    currency,
    count: rows.length,
    value: sum(rows.map((q) => q.value)),
    revenue: sum(rows.map((q) => q.vendorRevenue)),
    weighted: openWeighted(rows),
  };
}

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
  const list = vendorViews(rows, probabilities);
  const currencies = [...new Set(list.map((q) => q.currency))].sort();
  const months = [...new Set(list.map((q) => q.expectedCloseOn.slice(0, 7)))].sort();
  return {
    stages: stageTotals(list, QUOTE_STAGES),
    quotes: list,
    totals: currencies.map((currency) =>
      groupTotal(
        currency,
        list.filter((q) => q.currency === currency),
      ),
    ),
    byMonth: currencies.flatMap((currency) =>
      months.map((month) => ({
        month,
        ...groupTotal(
          currency,
          list.filter((q) => q.currency === currency && q.expectedCloseOn.startsWith(month)),
        ),
      })),
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

/**
 * One page of the quote list, sorted on the server, within the same scope and filters as
 * pipeline() (whose totals and charts stay over every filtered quote, not just this page). Pass
 * the quotes pipeline() already returned to spare reading them twice.
 */
export function pipelineQuotesPage(
  caller: SessionUser,
  filters: PipelineFilters,
  list: Partial<PipelineListParams> = {},
  pageSize = PIPELINE_PAGE_SIZE,
  quotes: VendorProposal[] = pipeline(caller, filters).quotes,
): ListPage<VendorProposal> {
  return quotePage(
    quotes,
    { sort: list.sort ?? "created", dir: list.dir ?? "desc", page: list.page ?? 1 },
    pageSize,
  );
}
