import { and, eq, like, type SQL } from "drizzle-orm";
import { cases, quotes } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { stageTotals, sum, winRate, type StageTotal } from "@/lib/pipeline/figures";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";
import type { PipelineFilters } from "@/lib/validations/pipeline";
import { listVisibleQuotes, vendorView, type VendorProposal } from "./proposals";
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
 * are Decimal sums of the very rows returned, per currency.
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
        weighted: sum(inCurrency.map((q) => q.weighted)),
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
          weighted: sum(inMonth.map((q) => q.weighted)),
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
