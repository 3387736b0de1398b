import Decimal from "decimal.js";
import type { ListPage } from "../lists/list-params";
import { pageWindow } from "../lists/list-params";
import { QUOTE_STAGES, type QuoteStage } from "./stages";

// The pipeline sorts its quotes on the server, after the vendor's revenue has been read from each
// frozen input (lib/pipeline/revenue.ts): that figure is not a column SQL could order by. The
// whole filtered list is already in hand for the totals and charts, so sorting it here costs
// nothing more, and every column sorts the same way.

export type SortableQuote = {
  id: number;
  caseName: string;
  version: number;
  accountName: string;
  ownerName: string;
  stage: QuoteStage;
  vendorRevenue: string;
  value: string;
  probabilityPct: number;
  weighted: string;
  expectedCloseOn: string;
  paybackYears: number | null;
  createdAt: string;
};

export type QuoteSort =
  | "created"
  | "proposal"
  | "account"
  | "owner"
  | "stage"
  | "revenue"
  | "investment"
  | "chance"
  | "weighted"
  | "close"
  | "payback";

const text = (a: string, b: string) => a.localeCompare(b, "en", { sensitivity: "base" });
const amount = (a: string, b: string) => new Decimal(a).comparedTo(b);
const number = (a: number, b: number) => a - b;

const COMPARE: Record<
  Exclude<QuoteSort, "payback">,
  (a: SortableQuote, b: SortableQuote) => number
> = {
  created: (a, b) => text(a.createdAt, b.createdAt),
  proposal: (a, b) => text(a.caseName, b.caseName) || number(a.version, b.version),
  account: (a, b) => text(a.accountName, b.accountName),
  owner: (a, b) => text(a.ownerName, b.ownerName),
  stage: (a, b) => number(QUOTE_STAGES.indexOf(a.stage), QUOTE_STAGES.indexOf(b.stage)),
  revenue: (a, b) => amount(a.vendorRevenue, b.vendorRevenue),
  investment: (a, b) => amount(a.value, b.value),
  chance: (a, b) => number(a.probabilityPct, b.probabilityPct),
  weighted: (a, b) => amount(a.weighted, b.weighted),
  close: (a, b) => text(a.expectedCloseOn, b.expectedCloseOn),
};

/**
 * The quotes in the order asked; equal ones by their id in the same direction, so that paging
 * never shows a quote twice. A payback that never comes sorts after every other one either way.
 */
export function sortQuotes<T extends SortableQuote>(
  quotes: readonly T[],
  sort: QuoteSort,
  dir: "asc" | "desc",
): T[] {
  const sign = dir === "asc" ? 1 : -1;
  return [...quotes].sort((a, b) => {
    if (sort === "payback") {
      if ((a.paybackYears === null) !== (b.paybackYears === null))
        return a.paybackYears === null ? 1 : -1;
      const byPayback = number(a.paybackYears ?? 0, b.paybackYears ?? 0);
      if (byPayback !== 0) return sign * byPayback;
    } else {
      const by = COMPARE[sort](a, b);
      if (by !== 0) return sign * by;
    }
    return sign * (a.id - b.id);
  });
}

/** One page of the sorted quotes. */
export function quotePage<T extends SortableQuote>(
  quotes: readonly T[],
  list: { sort: QuoteSort; dir: "asc" | "desc"; page: number },
  pageSize: number,
): ListPage<T> {
  const window = pageWindow(quotes.length, list.page, pageSize);
  return {
    rows: sortQuotes(quotes, list.sort, list.dir).slice(window.offset, window.offset + pageSize),
    total: quotes.length,
    page: window.page,
    pageCount: window.pageCount,
    pageSize,
  };
}

// The sums per stage or per close month sort too.
export type GroupSort = "label" | "count" | "revenue" | "weighted" | "investment";
export const GROUP_SORTS = ["label", "count", "revenue", "weighted", "investment"] as const;

export function sortGroups<
  T extends { count: number; value: string; revenue: string; weighted: string },
>(rows: readonly T[], sort: GroupSort, dir: "asc" | "desc"): T[] {
  const sign = dir === "asc" ? 1 : -1;
  const by: Record<Exclude<GroupSort, "label">, (a: T, b: T) => number> = {
    count: (a, b) => number(a.count, b.count),
    revenue: (a, b) => amount(a.revenue, b.revenue),
    weighted: (a, b) => amount(a.weighted, b.weighted),
    investment: (a, b) => amount(a.value, b.value),
  };
  // "label" keeps the order given (the stages' own order, months in time), reversed for desc.
  const indexed = rows.map((row, i) => ({ row, i }));
  indexed.sort((a, b) => {
    const d = sort === "label" ? 0 : by[sort](a.row, b.row);
    return sign * (d !== 0 ? d : a.i - b.i);
  });
  return indexed.map((x) => x.row);
}
