import { eq } from "drizzle-orm";
import { db } from "@/db";
import { caseAxes, cases } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import type { CaseDetailsInput, DuplicateCaseInput } from "@/lib/validations/case";
import { recordAudit } from "./audit";
import { getCaseOrThrow, touchCase } from "./cases";

// A case's own words (name, notes) and copying a case into a new draft.

const quoted = (s: string) => `“${s}”`;

/** Renames the case and replaces its notes; audited with what changed. */
export function updateCaseDetails(caller: SessionUser, caseId: number, input: CaseDetailsInput) {
  const found = getCaseOrThrow(caller, caseId);
  const changes: string[] = [];
  if (input.name !== found.name) changes.push(`name ${quoted(found.name)} → ${quoted(input.name)}`);
  if ((input.notes ?? null) !== (found.notes ?? null))
    changes.push(input.notes ? `notes (${input.notes.length} characters)` : "notes cleared");
  if (changes.length === 0) return { changes };
  db.transaction(() => {
    touchCase(caseId, found.updatedAt, { name: input.name, notes: input.notes });
    recordAudit({
      actor: caller,
      action: "case.update",
      targetType: "case",
      targetId: caseId,
      detail: `${input.name}: ${changes.join("; ")}`,
    });
  });
  return { changes };
}

/**
 * A new draft case owned by the caller, on the same site, with the copied case's assumptions,
 * notes, axes and their retrofit terms. Proposals, quotes and the stage stay with the original:
 * the copy has sent nothing yet.
 */
export function duplicateCase(caller: SessionUser, caseId: number, input: DuplicateCaseInput) {
  const source = getCaseOrThrow(caller, caseId);
  const terms = db.select().from(caseAxes).where(eq(caseAxes.caseId, caseId)).all();
  return db.transaction((tx) => {
    const [copy] = tx
      .insert(cases)
      .values({
        accountId: source.accountId,
        siteId: source.siteId,
        ownerId: caller.id,
        name: input.name,
        notes: source.notes,
        stage: "draft",
        assumptions: source.assumptions,
      })
      .returning()
      .all();
    for (let i = 0; i < terms.length; i += 500) {
      tx.insert(caseAxes)
        .values(terms.slice(i, i + 500).map((t) => ({ ...t, caseId: copy.id })))
        .run();
    }
    recordAudit({
      actor: caller,
      action: "case.duplicate",
      targetType: "case",
      targetId: copy.id,
      detail: `${quoted(input.name)} copied from ${quoted(source.name)} with ${terms.length} ${
        terms.length === 1 ? "axis" : "axes"
      }`,
    });
    return copy;
  });
}
