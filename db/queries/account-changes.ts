import { and, eq, ne, sql } from "drizzle-orm";
import { db } from "@/db";
import { accounts, accountShares, users } from "@/db/schema";
import { accountPermissions } from "@/lib/accounts/permissions";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, ForbiddenError } from "@/lib/errors";
import { FieldConflictError } from "@/lib/field-conflict-error";
import {
  OWNER_REQUIRED,
  type CreateAccountInput,
  type ReassignOwnerInput,
  type RenameAccountInput,
} from "@/lib/validations/account";
import { getAccountDetailOrThrow, INSTALLED_BASE_ROLES } from "./accounts";
import { recordAudit } from "./audit";

// Creating and changing customer accounts (the rules in words: docs/accounts.md). Each change
// reads the account in the caller's scope first (another engineer's account is not found), then
// checks what the caller's role may do (lib/accounts/permissions.ts), and writes its rows and its
// audit row in one transaction.

type Account = ReturnType<typeof getAccountDetailOrThrow>;

function audit(caller: SessionUser, action: string, account: { id: number }, detail: string) {
  recordAudit({ actor: caller, action, targetType: "account", targetId: account.id, detail });
}

// Names are unique whatever their capitals, so "Acme" and "ACME" never both appear in a picker.
function assertNameFree(name: string, exceptId?: number) {
  const clash = db
    .select({ id: accounts.id, name: accounts.name })
    .from(accounts)
    .where(
      and(
        sql`lower(${accounts.name}) = lower(${name})`,
        exceptId === undefined ? undefined : ne(accounts.id, exceptId),
      ),
    )
    .get();
  if (clash)
    throw new FieldConflictError(
      "name",
      `Account name: an account named "${clash.name}" already exists. Choose another name.`,
    );
}

// Owners and share targets are active engineers; anyone else is refused by name of the field.
function activeEngineerOrThrow(userId: number, field: string, message: string) {
  const row = db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.role, "engineer"), eq(users.active, true)))
    .get();
  if (!row) throw new FieldConflictError(field, message);
  return row;
}

function editableAccount(caller: SessionUser, id: number, may: "rename" | "share" | "archive") {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  const account = getAccountDetailOrThrow(caller, id);
  if (!accountPermissions(caller, account.ownerId)[may]) {
    throw new ForbiddenError(
      may === "share"
        ? "Only the account's owner, a manager or an administrator may change who it is shared with."
        : "Only the account's owner, a manager or an administrator may archive or restore it.",
    );
  }
  return account;
}

export function createAccount(caller: SessionUser, input: CreateAccountInput) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  // An engineer's new account is theirs; a manager or administrator hands it to an engineer.
  let ownerId = caller.id;
  let ownerName = caller.name;
  if (caller.role !== "engineer") {
    if (input.ownerId === undefined) throw new FieldConflictError("ownerId", OWNER_REQUIRED);
    const owner = activeEngineerOrThrow(
      input.ownerId,
      "ownerId",
      "Owner: choose an active engineer.",
    );
    ownerId = owner.id;
    ownerName = owner.name;
  }
  return db.transaction(() => {
    assertNameFree(input.name);
    const [row] = db.insert(accounts).values({ name: input.name, ownerId }).returning().all();
    audit(caller, "account.create", row, `${row.name}, owned by ${ownerName}`);
    return row;
  });
}

export function renameAccount(caller: SessionUser, input: RenameAccountInput) {
  const account = editableAccount(caller, input.accountId, "rename");
  if (account.name === input.name) return;
  db.transaction(() => {
    assertNameFree(input.name, account.id);
    db.update(accounts).set({ name: input.name }).where(eq(accounts.id, account.id)).run();
    audit(caller, "account.rename", account, `${account.name} renamed to ${input.name}`);
  });
}

export function shareAccount(caller: SessionUser, accountId: number, userId: number) {
  const account = editableAccount(caller, accountId, "share");
  const engineer = activeEngineerOrThrow(
    userId,
    "userId",
    "Engineer: choose an active engineer to share with.",
  );
  if (engineer.id === account.ownerId)
    throw new FieldConflictError(
      "userId",
      `Engineer: ${engineer.name} owns ${account.name} already; choose another engineer.`,
    );
  if (account.shares.some((s) => s.userId === engineer.id))
    throw new FieldConflictError(
      "userId",
      `Engineer: ${account.name} is already shared with ${engineer.name}.`,
    );
  db.transaction(() => {
    db.insert(accountShares).values({ accountId: account.id, userId: engineer.id }).run();
    audit(caller, "account.share", account, `${account.name} shared with ${engineer.name}`);
  });
}

export function unshareAccount(caller: SessionUser, accountId: number, userId: number) {
  const account = editableAccount(caller, accountId, "share");
  const share = account.shares.find((s) => s.userId === userId);
  if (!share) throw new ConflictError(`${account.name} is not shared with that engineer.`);
  db.transaction(() => {
    db.delete(accountShares)
      .where(and(eq(accountShares.accountId, account.id), eq(accountShares.userId, userId)))
      .run();
    audit(
      caller,
      "account.unshare",
      account,
      `${account.name} no longer shared with ${share.name}`,
    );
  });
}

export function reassignOwner(caller: SessionUser, input: ReassignOwnerInput) {
  assertRole(caller, "manager", "admin");
  const account = getAccountDetailOrThrow(caller, input.accountId);
  const owner = activeEngineerOrThrow(
    input.ownerId,
    "ownerId",
    "New owner: choose an active engineer.",
  );
  if (owner.id === account.ownerId)
    throw new FieldConflictError(
      "ownerId",
      `New owner: ${owner.name} owns ${account.name} already; choose another engineer.`,
    );
  // The new owner needs no share of their own; the previous owner keeps access only through a
  // share, when asked for. All in one transaction: a failure leaves owner and shares as they were.
  db.transaction(() => {
    db.delete(accountShares)
      .where(and(eq(accountShares.accountId, account.id), eq(accountShares.userId, owner.id)))
      .run();
    if (input.keepPreviousOwner)
      db.insert(accountShares)
        .values({ accountId: account.id, userId: account.ownerId })
        .onConflictDoNothing()
        .run();
    db.update(accounts).set({ ownerId: owner.id }).where(eq(accounts.id, account.id)).run();
    audit(
      caller,
      "account.reassign",
      account,
      `${account.name}: owner ${account.ownerName} → ${owner.name}` +
        (input.keepPreviousOwner
          ? `; ${account.ownerName} stays on the share list`
          : `; ${account.ownerName} no longer has access`),
    );
  });
}

export function archiveAccount(caller: SessionUser, accountId: number) {
  const account: Account = editableAccount(caller, accountId, "archive");
  if (account.archivedAt) throw new ConflictError(`${account.name} is archived already.`);
  db.transaction(() => {
    db.update(accounts)
      .set({ archivedAt: new Date().toISOString() })
      .where(eq(accounts.id, account.id))
      .run();
    audit(caller, "account.archive", account, `${account.name} archived`);
  });
}

export function restoreAccount(caller: SessionUser, accountId: number) {
  const account = editableAccount(caller, accountId, "archive");
  if (!account.archivedAt) throw new ConflictError(`${account.name} is not archived.`);
  db.transaction(() => {
    db.update(accounts).set({ archivedAt: null }).where(eq(accounts.id, account.id)).run();
    audit(caller, "account.restore", account, `${account.name} restored`);
  });
}
