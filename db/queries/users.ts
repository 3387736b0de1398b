import { and, asc, count, desc, eq, like, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { accounts, invitations, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type {
  ChangeRoleInput,
  CreateUserInput,
  UserListQuery,
  UserStatus,
} from "@/lib/validations/user";
import { recordAudit } from "./audit";

// The rule of awaitsFirstPassword (db/queries/invitations.ts) in SQL: a user who has invitations
// and used none has never chosen a password. Users created with a password have no invitation.
const awaitsPassword = sql`(exists (select 1 from ${invitations} i where i.user_id = ${users.id})
  and not exists (select 1 from ${invitations} i where i.user_id = ${users.id} and i.used_at is not null))`;

const statusOf = sql<UserStatus>`case when ${users.active} = 0 then 'inactive'
  when ${awaitsPassword} then 'invited' else 'active' end`;

// The newest invitation of the user, for "invited on …, link valid until …".
const latestInvitation = (column: "created_at" | "expires_at" | "revoked_at") =>
  sql<string | null>`(select i.${sql.raw(column)} from ${invitations} i
    where i.user_id = ${users.id} order by i.id desc limit 1)`;

const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  accountId: users.accountId,
  accountName: accounts.name,
  active: users.active,
  createdAt: users.createdAt,
  status: statusOf,
  invitedAt: latestInvitation("created_at"),
  inviteExpiresAt: latestInvitation("expires_at"),
  inviteRevokedAt: latestInvitation("revoked_at"),
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
  status: UserStatus;
  // The newest invitation, when the user has one (only meaningful while status is "invited").
  invitedAt: string | null;
  inviteExpiresAt: string | null;
  inviteRevokedAt: string | null;
  // Whether the newest link still works: null for users not waiting on an invitation.
  inviteLink: "open" | "expired" | "revoked" | null;
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

export const USERS_PAGE_SIZE = 25;

function inviteLinkState(
  row: Pick<UserRow, "status" | "inviteExpiresAt" | "inviteRevokedAt">,
  now: Date,
): UserRow["inviteLink"] {
  if (row.status !== "invited" || !row.inviteExpiresAt) return null;
  if (row.inviteRevokedAt) return "revoked";
  return Date.parse(row.inviteExpiresAt) <= now.getTime() ? "expired" : "open";
}

export function listUsers(
  caller: SessionUser,
  params: UserListQuery = {},
  pageSize = USERS_PAGE_SIZE,
  now = new Date(),
): ListPage<UserRow> {
  assertRole(caller, "admin");
  const filters: SQL[] = [];
  if (params.q) {
    const pattern = `%${params.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(or(like(users.name, pattern), like(users.email, pattern))!);
  }
  if (params.role) filters.push(eq(users.role, params.role));
  if (params.status) filters.push(sql`${statusOf} = ${params.status}`);
  const where = filters.length ? and(...filters) : undefined;
  const total = db.select({ n: count() }).from(users).where(where).get()!.n;
  const window = pageWindow(total, params.page ?? 1, pageSize);
  const column = sortColumns[params.sort ?? "name"];
  const rows = db
    .select(publicColumns)
    .from(users)
    .leftJoin(accounts, eq(users.accountId, accounts.id))
    .where(where)
    .orderBy(params.dir === "desc" ? desc(column) : asc(column), asc(users.id))
    .limit(window.limit)
    .offset(window.offset)
    .all()
    .map((row) => ({ ...row, inviteLink: inviteLinkState(row, now) }));
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize };
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
