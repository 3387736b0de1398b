import { describe, expect, it } from "vitest";
import { db } from "@/db";
import {
  createAccount,
  reassignOwner,
  shareAccount,
  unshareAccount,
} from "@/db/queries/account-changes";
import { getAccountDetailOrThrow, listAccounts } from "@/db/queries/accounts";
import { listAudit } from "@/db/queries/audit";
import { createUser, setUserActive } from "@/db/queries/users";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { FieldConflictError } from "@/lib/field-conflict-error";
import { reassignOwnerSchema, shareAccountSchema } from "@/lib/validations/account";
import { createUserSchema } from "@/lib/validations/user";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");
const reviewer = () => caller("reviewer@example.com");

const lastAudit = () => listAudit(admin(), 1)[0];
const auditCount = () => listAudit(admin(), 10_000).length;
const sharedWith = (id: number) => getAccountDetailOrThrow(manager(), id).shares.map((s) => s.name);

function thirdEngineer(email: string, name: string) {
  try {
    return caller(email);
  } catch {
    createUser(
      admin(),
      createUserSchema.parse({
        email,
        name,
        role: "engineer",
        accountId: "",
        password: "long-enough-pw",
      }),
    );
    return caller(email);
  }
}

function fieldError(run: () => unknown) {
  try {
    run();
  } catch (error) {
    if (error instanceof FieldConflictError) return { field: error.field, message: error.message };
    throw error;
  }
  throw new Error("expected a field conflict");
}

let counter = 0;
const newAccount = () =>
  createAccount(engineer(), { name: `Invented Sharing Account ${++counter}` });

describe("sharing an account", () => {
  it("the owner shares with an engineer, who then reads and edits it; stopping ends that", () => {
    const account = newAccount();
    expect(() => getAccountDetailOrThrow(engineer2(), account.id)).toThrow(NotFoundError);
    shareAccount(engineer(), account.id, engineer2().id);
    expect(lastAudit()).toMatchObject({
      action: "account.share",
      actorEmail: "engineer@example.com",
      targetId: String(account.id),
      detail: `${account.name} shared with Second Demo Engineer`,
    });
    expect(getAccountDetailOrThrow(engineer2(), account.id).name).toBe(account.name);
    expect(listAccounts(engineer2()).map((a) => a.id)).toContain(account.id);

    unshareAccount(engineer(), account.id, engineer2().id);
    expect(lastAudit()).toMatchObject({
      action: "account.unshare",
      detail: `${account.name} no longer shared with Second Demo Engineer`,
    });
    expect(() => getAccountDetailOrThrow(engineer2(), account.id)).toThrow(NotFoundError);
  });

  it("managers and administrators may share; a shared engineer may not; others find nothing", () => {
    const account = newAccount();
    const third = thirdEngineer("third.engineer@example.com", "Third Engineer");
    shareAccount(manager(), account.id, engineer2().id);
    // engineer2 is shared, not the owner: refused, and nothing changes.
    expect(() => shareAccount(engineer2(), account.id, third.id)).toThrow(ForbiddenError);
    expect(() => unshareAccount(engineer2(), account.id, engineer2().id)).toThrow(ForbiddenError);
    // third has no access at all: the account does not exist for them.
    expect(() => shareAccount(third, account.id, third.id)).toThrow(NotFoundError);
    expect(() => shareAccount(reviewer(), account.id, third.id)).toThrow(ForbiddenError);
    expect(sharedWith(account.id)).toEqual(["Second Demo Engineer"]);
    shareAccount(admin(), account.id, third.id);
    expect(sharedWith(account.id)).toEqual(["Second Demo Engineer", "Third Engineer"]);
    unshareAccount(manager(), account.id, third.id);
    expect(sharedWith(account.id)).toEqual(["Second Demo Engineer"]);
  });

  it("only active engineers are share targets; the owner and a second share get a clear message", () => {
    const account = newAccount();
    const parked = thirdEngineer("parked.sharer@example.com", "Parked Sharer");
    setUserActive(admin(), parked.id, false);
    const before = auditCount();
    for (const who of [manager(), admin(), reviewer()])
      expect(fieldError(() => shareAccount(engineer(), account.id, who.id))).toEqual({
        field: "userId",
        message: "Engineer: choose an active engineer to share with.",
      });
    expect(fieldError(() => shareAccount(engineer(), account.id, parked.id)).field).toBe("userId");
    expect(fieldError(() => shareAccount(engineer(), account.id, engineer().id))).toEqual({
      field: "userId",
      message: `Engineer: Demo Engineer owns ${account.name} already; choose another engineer.`,
    });
    shareAccount(engineer(), account.id, engineer2().id);
    expect(fieldError(() => shareAccount(engineer(), account.id, engineer2().id))).toEqual({
      field: "userId",
      message: `Engineer: ${account.name} is already shared with Second Demo Engineer.`,
    });
    expect(auditCount()).toBe(before + 1);
    expect(() => unshareAccount(engineer(), account.id, manager().id)).toThrow(ConflictError);
    expect(
      shareAccountSchema.safeParse({ accountId: account.id, userId: "" }).error!.issues[0],
    ).toMatchObject({ path: ["userId"], message: "Choose an engineer to share with" });
  });
});

describe("reassigning the owner", () => {
  it("a manager hands the account over; the old owner loses access unless kept on the share list", () => {
    const account = newAccount();
    reassignOwner(manager(), {
      accountId: account.id,
      ownerId: engineer2().id,
      keepPreviousOwner: false,
    });
    expect(getAccountDetailOrThrow(engineer2(), account.id).ownerId).toBe(engineer2().id);
    expect(() => getAccountDetailOrThrow(engineer(), account.id)).toThrow(NotFoundError);
    expect(lastAudit()).toMatchObject({
      action: "account.reassign",
      actorEmail: "manager@example.com",
      detail: `${account.name}: owner Demo Engineer → Second Demo Engineer; Demo Engineer no longer has access`,
    });

    reassignOwner(admin(), {
      accountId: account.id,
      ownerId: engineer().id,
      keepPreviousOwner: true,
    });
    expect(getAccountDetailOrThrow(engineer(), account.id).ownerId).toBe(engineer().id);
    expect(sharedWith(account.id)).toEqual(["Second Demo Engineer"]);
    expect(getAccountDetailOrThrow(engineer2(), account.id).name).toBe(account.name);
    expect(lastAudit()!.detail).toBe(
      `${account.name}: owner Second Demo Engineer → Demo Engineer; Second Demo Engineer stays on the share list`,
    );
  });

  it("a new owner who was shared leaves the share list (an owner needs no share)", () => {
    const account = newAccount();
    shareAccount(engineer(), account.id, engineer2().id);
    reassignOwner(manager(), {
      accountId: account.id,
      ownerId: engineer2().id,
      keepPreviousOwner: false,
    });
    expect(sharedWith(account.id)).toEqual([]);
  });

  it("engineers, the owner and shared ones alike, may not reassign; nor may a reviewer", () => {
    const account = newAccount();
    shareAccount(engineer(), account.id, engineer2().id);
    const input = { accountId: account.id, ownerId: engineer2().id, keepPreviousOwner: false };
    expect(() => reassignOwner(engineer(), input)).toThrow(ForbiddenError);
    expect(() => reassignOwner(engineer2(), input)).toThrow(ForbiddenError);
    expect(() => reassignOwner(reviewer(), input)).toThrow(ForbiddenError);
    expect(getAccountDetailOrThrow(manager(), account.id).ownerId).toBe(engineer().id);
  });

  it("refuses a target that is not an active engineer, or the current owner, naming the field", () => {
    const account = newAccount();
    const before = auditCount();
    expect(
      fieldError(() =>
        reassignOwner(manager(), {
          accountId: account.id,
          ownerId: manager().id,
          keepPreviousOwner: false,
        }),
      ),
    ).toEqual({ field: "ownerId", message: "New owner: choose an active engineer." });
    expect(
      fieldError(() =>
        reassignOwner(manager(), {
          accountId: account.id,
          ownerId: engineer().id,
          keepPreviousOwner: false,
        }),
      ).message,
    ).toBe(`New owner: Demo Engineer owns ${account.name} already; choose another engineer.`);
    expect(() =>
      reassignOwner(manager(), {
        accountId: 999_999,
        ownerId: engineer2().id,
        keepPreviousOwner: false,
      }),
    ).toThrow(NotFoundError);
    expect(auditCount()).toBe(before);
    expect(
      reassignOwnerSchema.safeParse({ accountId: account.id, ownerId: "" }).error!.issues[0],
    ).toMatchObject({ path: ["ownerId"], message: "Choose the new owner" });
  });

  it("a step failing part-way leaves the owner and the shares as they were", () => {
    const account = newAccount();
    const third = thirdEngineer("fourth.engineer@example.com", "Fourth Engineer");
    shareAccount(engineer(), account.id, engineer2().id);
    shareAccount(engineer(), account.id, third.id);
    const before = auditCount();
    // The share changes run first; the owner's update is then refused by the database.
    db.$client.exec(
      `create temp trigger refuse_owner before update of owner_id on accounts when new.id = ${account.id} begin select raise(abort, 'owner change refused'); end`,
    );
    try {
      expect(() =>
        reassignOwner(manager(), {
          accountId: account.id,
          ownerId: engineer2().id,
          keepPreviousOwner: true,
        }),
      ).toThrow(/owner change refused/);
    } finally {
      db.$client.exec("drop trigger refuse_owner");
    }
    const after = getAccountDetailOrThrow(manager(), account.id);
    expect(after.ownerId).toBe(engineer().id);
    expect(after.shares.map((s) => s.name)).toEqual(["Fourth Engineer", "Second Demo Engineer"]);
    expect(auditCount()).toBe(before);
  });
});
