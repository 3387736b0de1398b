import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { createAccount, renameAccount } from "@/db/queries/account-changes";
import { getAccountDetailOrThrow, listAccounts } from "@/db/queries/accounts";
import { listAudit } from "@/db/queries/audit";
import { createUser, setUserActive } from "@/db/queries/users";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { FieldConflictError } from "@/lib/field-conflict-error";
import {
  createAccountSchema,
  createAccountSchemaFor,
  OWNER_REQUIRED,
  renameAccountSchema,
} from "@/lib/validations/account";
import { createUserSchema } from "@/lib/validations/user";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");
const reviewer = () => caller("reviewer@example.com");

const lastAudit = () => listAudit(admin(), 1)[0];
const auditCount = () => listAudit(admin(), 10_000).length;

function fieldError(run: () => unknown): { field: string; message: string } {
  try {
    run();
  } catch (error) {
    if (error instanceof FieldConflictError) return { field: error.field, message: error.message };
    throw error;
  }
  throw new Error("expected a field conflict");
}

describe("creating an account", () => {
  it("an engineer's new account is theirs, whatever owner the request names, and is audited", () => {
    const input = createAccountSchema.parse({
      name: "  Invented Bottling Works ",
      ownerId: String(engineer2().id),
    });
    const row = createAccount(engineer(), input);
    expect(row.name).toBe("Invented Bottling Works");
    expect(row.ownerId).toBe(engineer().id);
    expect(listAccounts(engineer()).map((a) => a.name)).toContain("Invented Bottling Works");
    expect(listAccounts(engineer2()).map((a) => a.name)).not.toContain("Invented Bottling Works");
    expect(lastAudit()).toMatchObject({
      action: "account.create",
      actorEmail: "engineer@example.com",
      targetType: "account",
      targetId: String(row.id),
      detail: "Invented Bottling Works, owned by Demo Engineer",
    });
  });

  it("refuses a name already taken in other capitals, naming the field, and writes nothing", () => {
    createAccount(engineer(), { name: "Invented Foundry" });
    const before = auditCount();
    // engineer2 cannot see the first one, but names are unique across all accounts.
    const error = fieldError(() => createAccount(engineer2(), { name: "INVENTED foundry" }));
    expect(error.field).toBe("name");
    expect(error.message).toMatch(/^Account name: an account named "Invented Foundry"/);
    expect(listAccounts(admin()).filter((a) => /invented foundry/i.test(a.name))).toHaveLength(1);
    expect(auditCount()).toBe(before);
  });

  it("validates the name with messages naming it", () => {
    const blank = createAccountSchema.safeParse({ name: " \n " });
    expect(blank.success).toBe(false);
    expect(blank.error!.issues[0]).toMatchObject({
      path: ["name"],
      message: "Enter the account name",
    });
    const long = createAccountSchema.safeParse({ name: "x".repeat(121) });
    expect(long.error!.issues[0].message).toBe("Keep the account name under 120 characters");
    // A line break would forge an audit line or a mail header: it becomes a space.
    expect(createAccountSchema.parse({ name: "Two\r\nLines" }).name).toBe("Two Lines");
  });

  it("a manager or administrator must choose an active engineer as the owner", () => {
    expect(
      createAccountSchemaFor(true).safeParse({ name: "X", ownerId: "" }).error!.issues[0],
    ).toMatchObject({ path: ["ownerId"], message: OWNER_REQUIRED });
    expect(createAccountSchemaFor(false).safeParse({ name: "X", ownerId: "" }).success).toBe(true);

    expect(fieldError(() => createAccount(manager(), { name: "Invented Mill" }))).toEqual({
      field: "ownerId",
      message: OWNER_REQUIRED,
    });
    // Not an engineer: the manager themself, a reviewer.
    for (const who of [manager(), reviewer()])
      expect(
        fieldError(() => createAccount(admin(), { name: "Invented Mill", ownerId: who.id })),
      ).toEqual({ field: "ownerId", message: "Owner: choose an active engineer." });

    const row = createAccount(manager(), { name: "Invented Mill", ownerId: engineer2().id });
    expect(row.ownerId).toBe(engineer2().id);
    expect(lastAudit()).toMatchObject({
      action: "account.create",
      actorEmail: "manager@example.com",
      detail: "Invented Mill, owned by Second Demo Engineer",
    });
  });

  it("refuses a deactivated engineer as the owner", () => {
    const parked = createUser(
      admin(),
      createUserSchema.parse({
        email: "parked.engineer@example.com",
        name: "Parked Engineer",
        role: "engineer",
        accountId: "",
        password: "long-enough-pw",
      }),
    );
    setUserActive(admin(), parked.id, false);
    expect(
      fieldError(() => createAccount(admin(), { name: "Invented Kiln", ownerId: parked.id })).field,
    ).toBe("ownerId");
    expect(listAccounts(admin()).some((a) => a.name === "Invented Kiln")).toBe(false);
  });

  it("a reviewer may not create accounts", () => {
    expect(() => createAccount(reviewer(), { name: "Invented Dairy" })).toThrow(ForbiddenError);
  });

  it("writes nothing when the audit row cannot be written (one transaction)", () => {
    db.$client.exec(
      "create temp trigger refuse_audit before insert on audit_log begin select raise(abort, 'audit refused'); end",
    );
    try {
      expect(() => createAccount(engineer(), { name: "Invented Half Write" })).toThrow(
        /audit refused/,
      );
    } finally {
      db.$client.exec("drop trigger refuse_audit");
    }
    expect(listAccounts(admin()).some((a) => a.name === "Invented Half Write")).toBe(false);
  });
});

describe("renaming an account", () => {
  const webline = () => listAccounts(manager()).find((a) => a.name.startsWith("Webline"))!;

  it("the owner, a shared engineer, a manager and an administrator may rename; each is audited", () => {
    const id = createAccount(engineer(), { name: "Invented Press Shop" }).id;
    renameAccount(engineer(), { accountId: id, name: "Invented Press Shop North" });
    expect(lastAudit()).toMatchObject({
      action: "account.rename",
      detail: "Invented Press Shop renamed to Invented Press Shop North",
    });
    renameAccount(manager(), { accountId: id, name: "Invented Press Shop East" });
    renameAccount(admin(), { accountId: id, name: "Invented Press Shop West" });
    expect(getAccountDetailOrThrow(engineer(), id).name).toBe("Invented Press Shop West");

    // engineer2 is shared on the print finisher's account, which engineer owns.
    const shared = webline();
    expect(shared.ownerId).toBe(engineer().id);
    renameAccount(engineer2(), { accountId: shared.id, name: "Webline Print Finishing Ltd" });
    expect(lastAudit()).toMatchObject({
      action: "account.rename",
      actorEmail: "engineer2@example.com",
      detail: "Webline Print Finishing renamed to Webline Print Finishing Ltd",
    });
    renameAccount(engineer2(), { accountId: shared.id, name: "Webline Print Finishing" });
  });

  it("another engineer's account is not found; a reviewer is refused", () => {
    const id = createAccount(engineer(), { name: "Invented Cannery" }).id;
    expect(() => renameAccount(engineer2(), { accountId: id, name: "Taken Over" })).toThrow(
      NotFoundError,
    );
    expect(() => renameAccount(reviewer(), { accountId: id, name: "Taken Over" })).toThrow(
      ForbiddenError,
    );
    expect(getAccountDetailOrThrow(manager(), id).name).toBe("Invented Cannery");
  });

  it("refuses another account's name, naming the field; a change of capitals alone is allowed", () => {
    const id = createAccount(engineer(), { name: "Invented Tannery" }).id;
    const error = fieldError(() =>
      renameAccount(engineer(), { accountId: id, name: "cartonia packaging plant" }),
    );
    expect(error).toMatchObject({ field: "name" });
    expect(error.message).toContain("Cartonia Packaging Plant");
    renameAccount(engineer(), { accountId: id, name: "INVENTED Tannery" });
    expect(getAccountDetailOrThrow(engineer(), id).name).toBe("INVENTED Tannery");
    expect(
      renameAccountSchema.safeParse({ accountId: id, name: "" }).error!.issues[0],
    ).toMatchObject({ path: ["name"], message: "Enter the account name" });
  });
});
