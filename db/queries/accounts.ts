import { and, asc, eq, exists, or, sql, type AnyColumn, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import { db } from "@/db";
import { accounts, accountShares, users } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
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
};

// The vendor's roles may browse the installed base; a reviewer sees proposals only.
export const INSTALLED_BASE_ROLES = VENDOR_ROLES;

export function listAccounts(caller: SessionUser): AccountRow[] {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return db
    .select({
      id: accounts.id,
      name: accounts.name,
      ownerId: accounts.ownerId,
      ownerName: users.name,
      shareCount: sql<number>`(select count(*) from ${accountShares} where ${accountShares.accountId} = ${accounts.id})`,
      createdAt: accounts.createdAt,
    })
    .from(accounts)
    .innerJoin(users, eq(users.id, accounts.ownerId))
    .where(accountScope(caller))
    .orderBy(asc(accounts.name))
    .all();
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
