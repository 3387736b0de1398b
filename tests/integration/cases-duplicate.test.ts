import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditLog, cases } from "@/db/schema";
import { duplicateCase, updateCaseDetails } from "@/db/queries/case-details";
import { getCaseOrThrow, listCases } from "@/db/queries/cases";
import { listCaseAxes } from "@/db/queries/case-axes";
import { listProposals } from "@/db/queries/proposal-versions";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { caseDetailsSchema, duplicateCaseSchema } from "@/lib/validations/case";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const caseNamed = (name: string) => listCases(manager()).find((c) => c.name === name)!;
const casesCount = () =>
  db
    .select({ n: sql<number>`count(*)` })
    .from(cases)
    .get()!.n;
const auditsOf = (action: string, targetId: number) =>
  db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.action, action), eq(auditLog.targetId, String(targetId))))
    .all();

// The seeded case that has been sent and has notes added here, to show what a copy keeps.
function sourceCase() {
  const source = caseNamed("North hall cartoners, phase 1");
  updateCaseDetails(
    engineer(),
    source.id,
    caseDetailsSchema.parse({ name: source.name, notes: "Night shift only.\nAsk for the keys." }),
  );
  return getCaseOrThrow(engineer(), source.id);
}

describe("duplicating a case", () => {
  it("copies site, assumptions, notes, axes and their terms into a new draft owned by the caller, without proposals", () => {
    const source = sourceCase();
    expect(source.stage).not.toBe("draft");
    expect(listProposals(engineer(), source.id).length).toBeGreaterThan(0);

    // A manager copies the engineer's case: the copy is the manager's.
    const copy = duplicateCase(
      manager(),
      source.id,
      duplicateCaseSchema.parse({ name: `${source.name} (copy)` }),
    );
    const found = getCaseOrThrow(manager(), copy.id);
    expect(found).toMatchObject({
      name: `${source.name} (copy)`,
      siteId: source.siteId,
      accountId: source.accountId,
      notes: "Night shift only.\nAsk for the keys.",
      stage: "draft",
      ownerId: manager().id,
      assumptions: source.assumptions,
      latestVersion: null,
    });
    // Every axis with its kit, discount, hours, commissioning cost and saving.
    expect(listCaseAxes(manager(), copy.id)).toEqual(listCaseAxes(manager(), source.id));
    expect(listProposals(manager(), copy.id)).toEqual([]);

    const audits = auditsOf("case.duplicate", copy.id);
    expect(audits).toHaveLength(1);
    expect(audits[0].actorEmail).toBe("manager@example.com");
    expect(audits[0].detail).toBe(
      `“${source.name} (copy)” copied from “${source.name}” with ${listCaseAxes(manager(), source.id).length} axes`,
    );
  });

  it("names the field in its validation messages", () => {
    const messages = (name: unknown) => {
      const parsed = duplicateCaseSchema.safeParse({ name });
      return parsed.success ? [] : parsed.error.issues.map((i) => i.message);
    };
    expect(messages("   ")).toEqual(["Enter a name for the case"]);
    expect(messages("x".repeat(121))).toEqual(["Keep the name under 120 characters"]);
    expect(messages(undefined)).toEqual(["Enter a name for the case"]);
  });

  it("another engineer's case is not found, a reviewer is refused, and neither adds a case", () => {
    const source = caseNamed("North hall cartoners, phase 1");
    const before = casesCount();
    const input = duplicateCaseSchema.parse({ name: "Copy attempt" });
    expect(() => duplicateCase(engineer2(), source.id, input)).toThrow(
      new NotFoundError("No such case"),
    );
    expect(() => duplicateCase(reviewer(), source.id, input)).toThrow(ForbiddenError);
    expect(() => duplicateCase(engineer(), 99_999_999, input)).toThrow(NotFoundError);
    expect(casesCount()).toBe(before);
  });

  it("is one transaction: when the audit row cannot be written, no case and no axis rows are left", () => {
    const source = caseNamed("North hall cartoners, phase 1");
    const before = casesCount();
    db.run(
      sql.raw(
        `CREATE TEMP TRIGGER refuse_copy_audit BEFORE INSERT ON audit_log WHEN NEW.action = 'case.duplicate' BEGIN SELECT RAISE(ABORT, 'audit refused'); END`,
      ),
    );
    try {
      expect(() =>
        duplicateCase(engineer(), source.id, duplicateCaseSchema.parse({ name: "Half copy" })),
      ).toThrow(/audit refused/);
    } finally {
      db.run(sql.raw("DROP TRIGGER refuse_copy_audit"));
    }
    expect(casesCount()).toBe(before);
    expect(db.select().from(cases).where(eq(cases.name, "Half copy")).all()).toEqual([]);
  });
});
