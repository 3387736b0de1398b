import {
  and,
  asc,
  count,
  desc,
  eq,
  exists,
  isNull,
  or,
  getTableColumns,
  sql,
  type AnyColumn,
  type SQL,
} from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import { db } from "@/db";
import { accounts, accountShares, users } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type { AccountListParams, AccountSort } from "@/lib/validations/account";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The account-access rule, named once: a user works on an account they own or that is shared with
// them. Either side may be a value or a column of the outer query; the owner check reads an
// alias of accounts so that it never compares an outer column with itself.
const ownedAccount = alias(accounts, "owned_account");
export function ownsOrSharesAccount(
  userId: number | AnyColumn,
  accountId: number | AnyColumn,
): SQL {
  return or(
    exists(
      db
        .select({ one: sql`1` })
        .from(ownedAccount)
        .where(and(eq(ownedAccount.id, accountId), eq(ownedAccount.ownerId, userId))),
    ),
    exists(
      db
        .select({ one: sql`1` })
        .from(accountShares)
        .where(and(eq(accountShares.accountId, accountId), eq(accountShares.userId, userId))),
    ),
  )!;
}

// The WHERE clause that limits accounts to what the caller may see: managers and admins see all,
// engineers the accounts they own or are shared on, reviewers their own account.
export function accountScope(caller: SessionUser): SQL | undefined {
  switch (caller.role) {
    case "manager":
    case "admin":
      return undefined;
    case "engineer":
      return ownsOrSharesAccount(caller.id, accounts.id);
    case "reviewer":
      return eq(accounts.id, caller.accountId ?? -1);
  }
}

export type AccountRow = {
  id: number;
  name: string;
  ownerId: number;
  ownerName: string;
  shareCount: number;
  createdAt: string;
  archivedAt: string | null;
};

// The vendor's roles may browse the installed base; a reviewer sees proposals only.
export const INSTALLED_BASE_ROLES = VENDOR_ROLES;

export const ACCOUNTS_PAGE_SIZE = 25;

const accountRowColumns = {
  id: accounts.id,
  name: accounts.name,
  ownerId: accounts.ownerId,
  ownerName: users.name,
  shareCount: sql<number>`(select count(*) from ${accountShares} where ${accountShares.accountId} = ${accounts.id})`,
  createdAt: accounts.createdAt,
  archivedAt: accounts.archivedAt,
};

// Names sort as a reader expects, without capitals first.
const sortColumns: Record<AccountSort, SQL | AnyColumn> = {
  name: sql`lower(${accounts.name})`,
  owner: sql`lower(${users.name})`,
  created: accounts.createdAt,
};

function containsText(column: AnyColumn, text: string): SQL {
  const pattern = `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
  return sql`${column} like ${pattern} escape '\\'`;
}

// The caller's accounts with the list's filters: archived ones only when asked for.
function accountListWhere(caller: SessionUser, params: Partial<AccountListParams>) {
  return and(
    accountScope(caller),
    params.archived === "show" ? undefined : isNull(accounts.archivedAt),
    params.q
      ? or(containsText(accounts.name, params.q), containsText(users.name, params.q))
      : undefined,
  );
}

/**
 * Every account the caller may see that is not archived (or every one, with
 * `{ archived: "show" }`), by name: for callers that want the whole list (the JSON API).
 */
export function listAccounts(
  caller: SessionUser,
  params: Pick<Partial<AccountListParams>, "archived"> = {},
): AccountRow[] {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return db
    .select(accountRowColumns)
    .from(accounts)
    .innerJoin(users, eq(users.id, accounts.ownerId))
    .where(accountListWhere(caller, params))
    .orderBy(asc(sortColumns.name), asc(accounts.id))
    .all();
}

/** One page of the accounts list, filtered, sorted and paged in SQL. */
export function listAccountsPage(
  caller: SessionUser,
  params: Partial<AccountListParams> = {},
): ListPage<AccountRow> {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  const where = accountListWhere(caller, params);
  const [{ total }] = db
    .select({ total: count() })
    .from(accounts)
    .innerJoin(users, eq(users.id, accounts.ownerId))
    .where(where)
    .all();
  const window = pageWindow(total, params.page ?? 1, ACCOUNTS_PAGE_SIZE);
  const column = sortColumns[params.sort ?? "name"];
  const rows = db
    .select(accountRowColumns)
    .from(accounts)
    .innerJoin(users, eq(users.id, accounts.ownerId))
    .where(where)
    // Ties (one owner, one creation instant) follow the id in the same direction, so that
    // "newest first" is newest first even within a millisecond.
    .orderBy(
      ...(params.dir === "desc"
        ? [desc(column), desc(accounts.id)]
        : [asc(column), asc(accounts.id)]),
    )
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize: window.pageSize };
}

export function getAccountOrThrow(caller: SessionUser, id: number) {
  const row = db
    .select()
    .from(accounts)
    .where(and(eq(accounts.id, id), accountScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such account");
  return row;
}

// Names and ids only, for the administrator's "reviewer of which account" choice.
export function listAccountOptions(caller: SessionUser) {
  assertRole(caller, "admin");
  return db
    .select({ id: accounts.id, name: accounts.name })
    .from(accounts)
    .orderBy(asc(accounts.name))
    .all();
}

// What the account page shows: the account with its owner's name and the engineers it is shared
// with, by name.
export function getAccountDetailOrThrow(caller: SessionUser, id: number) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  const row = db
    .select({ ...getTableColumns(accounts), ownerName: users.name })
    .from(accounts)
    .innerJoin(users, eq(users.id, accounts.ownerId))
    .where(and(eq(accounts.id, id), accountScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such account");
  const shares = db
    .select({ userId: users.id, name: users.name, active: users.active })
    .from(accountShares)
    .innerJoin(users, eq(users.id, accountShares.userId))
    .where(eq(accountShares.accountId, id))
    .orderBy(asc(users.name), asc(users.id))
    .all();
  return { ...row, shares };
}

// New work (a site, a case) starts on open accounts only: an archived one is restored first.
export function assertAccountOpen(accountId: number) {
  const row = db
    .select({ name: accounts.name, archivedAt: accounts.archivedAt })
    .from(accounts)
    .where(eq(accounts.id, accountId))
    .get();
  if (row?.archivedAt)
    throw new ConflictError(
      `${row.name} is archived: restore the account before adding sites or cases to it.`,
    );
}

// The engineers who may own an account or be shared on one: active engineers, by name.
export function listActiveEngineers(caller: SessionUser) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.role, "engineer"), eq(users.active, true)))
    .orderBy(asc(users.name), asc(users.id))
    .all();
}
