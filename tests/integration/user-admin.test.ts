import bcrypt from "bcryptjs";
import { describe, expect, it } from "vitest";
import { listAudit, listAuditPage } from "@/db/queries/audit";
import {
  changeRole,
  createUser,
  findActiveUserById,
  findUserForSignIn,
  listUsers,
  setUserActive,
} from "@/db/queries/users";
import { ConflictError, ForbiddenError } from "@/lib/errors";
import { createUserSchema } from "@/lib/validations/user";
import { caller } from "../support/callers";

describe("user administration", () => {
  const admin = () => caller("admin@example.com");

  it("stores demo passwords as bcrypt hashes of cost 10 or more (OWASP password storage)", () => {
    const hash = findUserForSignIn("engineer@example.com")!.passwordHash;
    expect(hash).toMatch(/^\$2[aby]\$(\d\d)\$/);
    expect(Number(hash.slice(4, 6))).toBeGreaterThanOrEqual(10);
    expect(bcrypt.compareSync("loopshift-demo", hash)).toBe(true);
  });

  it("lists, filters and sorts users for the administrator only", () => {
    expect(listUsers(admin()).rows.map((u) => u.email)).toHaveLength(5);
    expect(
      listUsers(admin(), { role: "engineer" })
        .rows.map((u) => u.email)
        .sort(),
    ).toEqual(["engineer2@example.com", "engineer@example.com"]);
    expect(listUsers(admin(), { q: "REVIEW" }).rows.map((u) => u.email)).toEqual([
      "reviewer@example.com",
    ]);
    const byEmailDesc = listUsers(admin(), { sort: "email", dir: "desc" }).rows.map((u) => u.email);
    expect(byEmailDesc).toEqual([...byEmailDesc].sort().reverse());
    expect(() => listUsers(caller("manager@example.com"))).toThrow(ForbiddenError);
  });

  it("creates a user with a role, refuses a duplicate e-mail, and audits it", () => {
    const input = createUserSchema.parse({
      email: "New.Person@Example.com",
      name: "New Person",
      role: "manager",
      accountId: "",
      password: "long-enough-pw",
    });
    expect(input.email).toBe("new.person@example.com");
    const created = createUser(admin(), input);
    expect(findActiveUserById(created.id)?.role).toBe("manager");
    expect(() => createUser(admin(), input)).toThrow(ConflictError);
    expect(listAudit(admin())[0]).toMatchObject({
      action: "user.create",
      actorEmail: "admin@example.com",
    });
  });

  it("requires a customer account for a reviewer, with the message on that field", () => {
    const result = createUserSchema.safeParse({
      email: "r@example.com",
      name: "R",
      role: "reviewer",
      accountId: "",
      password: "long-enough-pw",
    });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]).toMatchObject({
      path: ["accountId"],
      message: "A reviewer must belong to a customer account",
    });
  });

  it("changes a role and records who did it, newest first in the audit log", () => {
    const manager = caller("manager@example.com");
    changeRole(admin(), { userId: manager.id, role: "engineer", accountId: null });
    expect(findActiveUserById(manager.id)?.role).toBe("engineer");
    const [latest] = listAudit(admin());
    expect(latest.action).toBe("user.role");
    expect(latest.detail).toContain("manager → engineer");
    changeRole(admin(), { userId: manager.id, role: "manager", accountId: null });
    expect(() =>
      changeRole(admin(), { userId: admin().id, role: "engineer", accountId: null }),
    ).toThrow(ConflictError);
  });

  it("a deactivated user no longer resolves as a session user", () => {
    const engineer2 = caller("engineer2@example.com");
    setUserActive(admin(), engineer2.id, false);
    expect(findActiveUserById(engineer2.id)).toBeUndefined();
    setUserActive(admin(), engineer2.id, true);
    expect(findActiveUserById(engineer2.id)?.email).toBe("engineer2@example.com");
    expect(() => setUserActive(admin(), admin().id, false)).toThrow(ConflictError);
    expect(() => setUserActive(caller("engineer@example.com"), engineer2.id, false)).toThrow(
      ForbiddenError,
    );
  });

  it("pages, filters and sorts the audit log on the server, for the administrator only", () => {
    const engineer2 = caller("engineer2@example.com");
    setUserActive(admin(), engineer2.id, false);
    setUserActive(admin(), engineer2.id, true);
    const all = listAuditPage(admin(), {}, 1000);
    expect(all.total).toBe(all.rows.length);
    const newestFirst = all.rows.map((e) => e.at);
    expect(newestFirst).toEqual([...newestFirst].sort().reverse());
    const oldestFirst = listAuditPage(admin(), { dir: "asc" }, 1000).rows.map((e) => e.id);
    expect(oldestFirst).toEqual(all.rows.map((e) => e.id).reverse());

    const deactivations = listAuditPage(admin(), { q: "user.deactivate" });
    expect(deactivations.rows.length).toBeGreaterThan(0);
    expect(deactivations.rows.every((e) => e.action === "user.deactivate")).toBe(true);
    // The text filter also finds the actor's e-mail, and a "%" is a plain character.
    expect(listAuditPage(admin(), { q: "admin@example" }).total).toBe(
      all.rows.filter(
        (e) => e.actorEmail === "admin@example.com" || e.detail?.includes("admin@example"),
      ).length,
    );
    expect(listAuditPage(admin(), { q: "%" }).total).toBe(
      all.rows.filter((e) => [e.action, e.actorEmail, e.detail].some((t) => t?.includes("%")))
        .length,
    );

    const page2 = listAuditPage(admin(), { page: 2 }, 2);
    expect(page2.page).toBe(2);
    expect(page2.rows.map((e) => e.id)).toEqual(all.rows.slice(2, 4).map((e) => e.id));
    expect(() => listAuditPage(caller("manager@example.com"))).toThrow(ForbiddenError);
  });
});
