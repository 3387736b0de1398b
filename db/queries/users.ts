import { and, asc, desc, eq, like, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { accounts, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { ChangeRoleInput, CreateUserInput, UserListParams } from "@/lib/validations/user";
import { recordAudit } from "./audit";

const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  accountId: users.accountId,
  accountName: accounts.name,
  active: users.active,
  createdAt: users.createdAt,
};

export type UserRow = {
  id: number;
  email: string;
  name: string;
  role: SessionUser["role"];
  accountId: number | null;
  accountName: string | null;
  active: boolean;
  createdAt: string;
};

// Sign-in runs before there is a caller, so this is the one lookup that takes none.
export function findUserForSignIn(email: string) {
  return db.select().from(users).where(eq(users.email, email.trim().toLowerCase())).get();
}

// The session's user as the database has them now: a deactivated user or a changed role takes
// effect on the next request, not when the token expires.
export function findActiveUserById(id: number): SessionUser | undefined {
  const row = db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      accountId: users.accountId,
    })
    .from(users)
    .where(and(eq(users.id, id), eq(users.active, true)))
    .get();
  return row ?? undefined;
}

// The session version a new token is issued under.
export function sessionVersionOf(id: number): number | undefined {
  return db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, id)).get()?.v;
}

// The token's user when the token was issued under their current session version, else undefined:
// signing out, deactivation and a role change end every token issued before.
export function findSessionUser(id: number, version: number): SessionUser | undefined {
  const row = db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      accountId: users.accountId,
    })
    .from(users)
    .where(and(eq(users.id, id), eq(users.active, true), eq(users.sessionVersion, version)))
    .get();
  return row ?? undefined;
}

// Ends every session of the user (server side; their saved tokens stop working).
export function revokeSessions(id: number) {
  db.update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, id))
    .run();
}

const sortColumns = {
  name: users.name,
  email: users.email,
  role: users.role,
  createdAt: users.createdAt,
};

export function listUsers(caller: SessionUser, params: UserListParams = {}): UserRow[] {
  assertRole(caller, "admin");
  const filters: SQL[] = [];
  if (params.q) {
    const pattern = `%${params.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(or(like(users.name, pattern), like(users.email, pattern))!);
  }
  if (params.role) filters.push(eq(users.role, params.role));
  const column = sortColumns[params.sort ?? "name"];
  return db
    .select(publicColumns)
    .from(users)
    .leftJoin(accounts, eq(users.accountId, accounts.id))
    .where(filters.length ? and(...filters) : undefined)
    .orderBy(params.dir === "desc" ? desc(column) : asc(column), asc(users.id))
    .all();
}

function getUserOrThrow(id: number) {
  const row = db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new NotFoundError("No such user");
  return row;
}

function assertAccountExists(accountId: number | null) {
  if (accountId == null) return;
  const row = db.select({ id: accounts.id }).from(accounts).where(eq(accounts.id, accountId)).get();
  if (!row) throw new NotFoundError("No such account");
}

export function createUser(caller: SessionUser, input: CreateUserInput) {
  assertRole(caller, "admin");
  if (findUserForSignIn(input.email))
    throw new ConflictError("A user with this e-mail already exists");
  assertAccountExists(input.accountId);
  const passwordHash = hashPassword(input.password);
  const row = db.transaction((tx) => {
    const [created] = tx
      .insert(users)
      .values({
        email: input.email,
        name: input.name,
        role: input.role,
        accountId: input.role === "reviewer" ? input.accountId : null,
        passwordHash,
      })
      .returning({ id: users.id, email: users.email })
      .all();
    return created;
  });
  recordAudit({
    actor: caller,
    action: "user.create",
    targetType: "user",
    targetId: row.id,
    detail: `${row.email} as ${input.role}`,
  });
  return row;
}

export function changeRole(caller: SessionUser, input: ChangeRoleInput) {
  assertRole(caller, "admin");
  const target = getUserOrThrow(input.userId);
  if (target.id === caller.id && input.role !== "admin") {
    throw new ConflictError("You cannot remove your own administrator role");
  }
  assertAccountExists(input.accountId);
  const accountId = input.role === "reviewer" ? input.accountId : null;
  // A new role ends the user's sessions, so no token keeps the old role's claims.
  db.update(users)
    .set({ role: input.role, accountId, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, target.id))
    .run();
  recordAudit({
    actor: caller,
    action: "user.role",
    targetType: "user",
    targetId: target.id,
    detail: `${target.email}: ${target.role} → ${input.role}`,
  });
}

export function setUserActive(caller: SessionUser, userId: number, active: boolean) {
  assertRole(caller, "admin");
  const target = getUserOrThrow(userId);
  if (target.id === caller.id && !active) throw new ConflictError("You cannot deactivate yourself");
  db.update(users)
    .set({ active, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, target.id))
    .run();
  recordAudit({
    actor: caller,
    action: active ? "user.activate" : "user.deactivate",
    targetType: "user",
    targetId: target.id,
    detail: target.email,
  });
}
