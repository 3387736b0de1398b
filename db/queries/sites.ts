import { and, asc, count, desc, eq, getTableColumns, isNull, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { accounts, axes, machines, sites } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { pageWindow } from "@/lib/lists/list-params";
import type { SiteInput, SiteListParams } from "@/lib/validations/installed-base";
import {
  accountScope,
  assertAccountOpen,
  getAccountOrThrow,
  INSTALLED_BASE_ROLES,
} from "./accounts";

// Sites are reached through their account, so the caller's account scope is in every WHERE.
function scoped(caller: SessionUser) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return accountScope(caller);
}

export function listSites(caller: SessionUser, accountId?: number) {
  // An account outside the caller's reach is not found, exactly like a missing one.
  if (accountId !== undefined) getAccountOrThrow(caller, accountId);
  return siteList(caller, accountId === undefined ? undefined : eq(sites.accountId, accountId));
}

// The sites new work may start on (the new case's site choice): those of accounts not archived.
export function listOpenSites(caller: SessionUser) {
  return siteList(caller, isNull(accounts.archivedAt));
}

function siteList(caller: SessionUser, where: SQL | undefined) {
  return db
    .select({
      ...getTableColumns(sites),
      accountName: accounts.name,
      accountArchivedAt: accounts.archivedAt,
      machineCount: sql<number>`(select count(*) from ${machines} where ${machines.siteId} = ${sites.id})`,
      axisCount: sql<number>`(select coalesce(sum(${axes.quantity}), 0) from ${axes} where ${axes.siteId} = ${sites.id})`,
    })
    .from(sites)
    .innerJoin(accounts, eq(sites.accountId, accounts.id))
    .where(and(scoped(caller), where))
    .orderBy(asc(accounts.name), asc(sites.name))
    .all();
}

export const SITES_PAGE_SIZE = 25;

// One page of an account's sites for the account page: filtered by name, sorted and paged in SQL.
export function listSitesPage(
  caller: SessionUser,
  accountId: number,
  params: Partial<SiteListParams> = {},
) {
  getAccountOrThrow(caller, accountId);
  const q = params.q ? `%${params.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%` : undefined;
  const where = and(
    eq(sites.accountId, accountId),
    q ? sql`${sites.name} like ${q} escape '\\'` : undefined,
  );
  const { total } = db.select({ total: count() }).from(sites).where(where).get()!;
  const window = pageWindow(total, params.page ?? 1, SITES_PAGE_SIZE);
  const machineCount = sql<number>`(select count(*) from ${machines} where ${machines.siteId} = ${sites.id})`;
  const axisCount = sql<number>`(select coalesce(sum(${axes.quantity}), 0) from ${axes} where ${axes.siteId} = ${sites.id})`;
  const sortBy = {
    name: sql`lower(${sites.name})`,
    machines: machineCount,
    axes: axisCount,
  }[params.sort ?? "name"];
  const rows = db
    .select({ ...getTableColumns(sites), accountName: accounts.name, machineCount, axisCount })
    .from(sites)
    // The join keeps drizzle naming "sites" in the correlated subqueries (see listMachines).
    .innerJoin(accounts, eq(sites.accountId, accounts.id))
    .where(where)
    .orderBy(params.dir === "desc" ? desc(sortBy) : asc(sortBy), asc(sites.id))
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize: window.pageSize };
}

export function getSiteOrThrow(caller: SessionUser, id: number) {
  const row = db
    .select({ ...getTableColumns(sites), accountName: accounts.name })
    .from(sites)
    .innerJoin(accounts, eq(sites.accountId, accounts.id))
    .where(and(eq(sites.id, id), scoped(caller)))
    .get();
  if (!row) throw new NotFoundError("No such site");
  return row;
}

function assertNameFree(accountId: number, name: string, exceptId?: number) {
  const clash = db
    .select({ id: sites.id })
    .from(sites)
    .where(and(eq(sites.accountId, accountId), sql`lower(${sites.name}) = lower(${name})`))
    .get();
  if (clash && clash.id !== exceptId)
    throw new ConflictError(`This account already has a site named "${name}"`);
}

export function createSite(caller: SessionUser, accountId: number, input: SiteInput) {
  getAccountOrThrow(caller, accountId);
  assertAccountOpen(accountId);
  assertNameFree(accountId, input.name);
  const [row] = db
    .insert(sites)
    .values({ ...input, accountId })
    .returning()
    .all();
  return row;
}

export function updateSite(caller: SessionUser, id: number, input: SiteInput) {
  const site = getSiteOrThrow(caller, id);
  assertNameFree(site.accountId, input.name, id);
  db.update(sites).set(input).where(eq(sites.id, id)).run();
}
