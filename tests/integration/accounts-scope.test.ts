import { describe, expect, it } from "vitest";
import { getAccountOrThrow, listAccounts, listAccountOptions } from "@/db/queries/accounts";
import { NotFoundError, ForbiddenError } from "@/lib/errors";
import { caller } from "../support/callers";

const names = (rows: { name: string }[]) => rows.map((r) => r.name).sort();

describe("who sees which customer account (docs/product.md (Roles))", () => {
  it("an engineer sees the accounts they own and those shared with them, nothing else", () => {
    expect(names(listAccounts(caller("engineer@example.com")))).toEqual([
      "Cartonia Packaging Plant",
      "Webline Print Finishing",
    ]);
    // engineer2 owns the lab-automation account and is shared on the print finisher's.
    expect(names(listAccounts(caller("engineer2@example.com")))).toEqual([
      "Pipetteworks Lab Automation",
      "Webline Print Finishing",
    ]);
  });

  it("a manager sees every account", () => {
    expect(listAccounts(caller("manager@example.com"))).toHaveLength(3);
  });

  it("an engineer asking for another engineer's account gets not-found, as if it did not exist", () => {
    const engineer = caller("engineer@example.com");
    const other = listAccounts(caller("manager@example.com")).find(
      (a) => a.name === "Pipetteworks Lab Automation",
    )!;
    expect(() => getAccountOrThrow(engineer, other.id)).toThrow(NotFoundError);
    expect(() => getAccountOrThrow(engineer, 999_999)).toThrow(NotFoundError);
  });

  it("a reviewer reaches their own account only; any other id is not found", () => {
    const reviewer = caller("reviewer@example.com");
    expect(getAccountOrThrow(reviewer, reviewer.accountId!).name).toBe("Cartonia Packaging Plant");
    for (const a of listAccounts(caller("manager@example.com")).filter(
      (x) => x.id !== reviewer.accountId,
    )) {
      expect(() => getAccountOrThrow(reviewer, a.id)).toThrow(NotFoundError);
    }
  });

  it("administrators see every account; reviewers cannot list accounts at all", () => {
    expect(() => listAccounts(caller("reviewer@example.com"))).toThrow(ForbiddenError);
    expect(listAccounts(caller("admin@example.com"))).toHaveLength(3);
    expect(listAccountOptions(caller("admin@example.com"))).toHaveLength(3);
    expect(() => listAccountOptions(caller("engineer@example.com"))).toThrow(ForbiddenError);
  });
});
