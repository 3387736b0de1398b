import { and, asc, count, desc, eq, or, sql, type Column, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { accounts, cases, sites, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type { CaseListParams } from "@/lib/validations/case-lists";
import { caseColumns, caseQuery, caseScope, type CaseRow } from "./cases";

export const CASES_PAGE_SIZE = 25;

const sortColumns = {
  name: cases.name,
  account: accounts.name,
  stage: cases.stage,
  axes: caseColumns.axisCount,
  owner: users.name,
  updated: cases.updatedAt,
} satisfies Record<CaseListParams["sort"], unknown>;

// The text as a LIKE pattern that matches it anywhere, its own % and _ taken literally.
export function containsPattern(text: string) {
  return `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}
export const contains = (column: Column, text: string) =>
  sql`${column} like ${containsPattern(text)} escape '\\'`;

/** One page of the caller's cases, filtered (text, stage), sorted and paged in SQL. */
export function listCasesPage(
  caller: SessionUser,
  params: Partial<CaseListParams>,
  pageSize = CASES_PAGE_SIZE,
): ListPage<CaseRow> {
  const filters: (SQL | undefined)[] = [caseScope(caller)];
  if (params.stage) filters.push(eq(cases.stage, params.stage));
  if (params.q)
    filters.push(
      or(
        contains(cases.name, params.q),
        contains(accounts.name, params.q),
        contains(sites.name, params.q),
        contains(users.name, params.q),
      ),
    );
  const where = and(...filters);
  const [{ total }] = db
    .select({ total: count() })
    .from(cases)
    .innerJoin(accounts, eq(cases.accountId, accounts.id))
    .innerJoin(sites, eq(cases.siteId, sites.id))
    .innerJoin(users, eq(cases.ownerId, users.id))
    .where(where)
    .all();
  const window = pageWindow(total, params.page ?? 1, pageSize);
  const column = sortColumns[params.sort ?? "updated"];
  const order = (params.dir ?? (params.sort ? "asc" : "desc")) === "desc" ? desc : asc;
  const rows = caseQuery()
    .where(where)
    .orderBy(order(column), order(cases.id))
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize };
}
