import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditLog } from "@/db/schema";
import { updateCaseDetails } from "@/db/queries/case-details";
import { createCase, getCaseOrThrow, listCases } from "@/db/queries/cases";
import { listSites } from "@/db/queries/sites";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { caseDetailsSchema } from "@/lib/validations/case";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const updates = (caseId: number) =>
  db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.action, "case.update"), eq(auditLog.targetId, String(caseId))))
    .all();

function newCase() {
  const site = listSites(manager()).find((s) => s.name === "North hall")!;
  return createCase(engineer(), { name: "Before the rename", siteId: site.id });
}

describe("editing a case's name and notes", () => {
  it("renames, stores the notes, audits what changed, and writes nothing when nothing changed", () => {
    const c = newCase();
    updateCaseDetails(
      engineer(),
      c.id,
      caseDetailsSchema.parse({ name: "  After the rename ", notes: "Line 2 first." }),
    );
    const found = getCaseOrThrow(engineer(), c.id);
    expect(found).toMatchObject({ name: "After the rename", notes: "Line 2 first." });
    expect(updates(c.id).map((a) => a.detail)).toEqual([
      "After the rename: name “Before the rename” → “After the rename”; notes (13 characters)",
    ]);

    // Blank notes are none.
    updateCaseDetails(
      engineer(),
      c.id,
      caseDetailsSchema.parse({ name: "After the rename", notes: "  " }),
    );
    expect(getCaseOrThrow(engineer(), c.id).notes).toBeNull();
    expect(updates(c.id).at(-1)!.detail).toBe("After the rename: notes cleared");

    const stamp = getCaseOrThrow(engineer(), c.id).updatedAt;
    expect(
      updateCaseDetails(engineer(), c.id, caseDetailsSchema.parse({ name: "After the rename" })),
    ).toEqual({ changes: [] });
    expect(getCaseOrThrow(engineer(), c.id).updatedAt).toBe(stamp);
    expect(updates(c.id)).toHaveLength(2);
  });

  it("names the field in its validation messages", () => {
    const messages = (values: unknown) => {
      const parsed = caseDetailsSchema.safeParse(values);
      return parsed.success ? [] : parsed.error.issues.map((i) => i.message);
    };
    expect(messages({ name: "" })).toEqual(["Enter a name for the case"]);
    expect(messages({ name: "n".repeat(121) })).toEqual(["Keep the name under 120 characters"]);
    expect(messages({ name: "Fine", notes: "n".repeat(4001) })).toEqual([
      "Keep the notes under 4,000 characters",
    ]);
  });

  it("another engineer's case is not found, a reviewer is refused, a manager may edit", () => {
    const c = newCase();
    const input = caseDetailsSchema.parse({ name: "Taken over", notes: "x" });
    expect(listCases(engineer2()).map((x) => x.id)).not.toContain(c.id);
    expect(() => updateCaseDetails(engineer2(), c.id, input)).toThrow(
      new NotFoundError("No such case"),
    );
    expect(() => updateCaseDetails(reviewer(), c.id, input)).toThrow(ForbiddenError);
    expect(getCaseOrThrow(engineer(), c.id).name).toBe("Before the rename");
    expect(updates(c.id)).toEqual([]);

    updateCaseDetails(manager(), c.id, input);
    expect(getCaseOrThrow(engineer(), c.id).name).toBe("Taken over");
    expect(updates(c.id)[0].actorEmail).toBe("manager@example.com");
  });

  it("is one transaction: when the audit row cannot be written, the name stays", () => {
    const c = newCase();
    db.run(
      sql.raw(
        `CREATE TEMP TRIGGER refuse_update_audit BEFORE INSERT ON audit_log WHEN NEW.action = 'case.update' BEGIN SELECT RAISE(ABORT, 'audit refused'); END`,
      ),
    );
    try {
      expect(() =>
        updateCaseDetails(engineer(), c.id, caseDetailsSchema.parse({ name: "Half rename" })),
      ).toThrow(/audit refused/);
    } finally {
      db.run(sql.raw("DROP TRIGGER refuse_update_audit"));
    }
    expect(getCaseOrThrow(engineer(), c.id).name).toBe("Before the rename");
  });
});
