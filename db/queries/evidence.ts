import { and, eq, inArray, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { axes, caseAxes, valueEvidence } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import {
  evidenceFieldLabel,
  type EvidenceEntry,
  type EvidenceSubject,
} from "@/lib/evidence/subjects";
import type { EvidenceInput, EvidenceSubjectField } from "@/lib/validations/evidence";
import { getAxisOrThrow } from "./axes";
import { recordAudit } from "./audit";
import { getCaseOrThrow } from "./cases";
import { getMachineOrThrow } from "./machines";
import { getVisibleQuoteOrThrow } from "./proposals";
import { getSiteOrThrow } from "./sites";

// The sources of typed value figures (db/schema/evidence.ts). Every read and write finds the
// subject in the caller's scope first (another account's axis is "No such axis", as a missing
// one), and takes the account from the subject, never from the caller's input.

const entryColumns = {
  subjectType: valueEvidence.subjectType,
  subjectId: valueEvidence.subjectId,
  field: valueEvidence.field,
  note: valueEvidence.note,
  givenOn: valueEvidence.givenOn,
  givenBy: valueEvidence.givenBy,
};

/** The subject in the caller's scope: its account and the words the audit log names it by. */
function subjectInScope(
  caller: SessionUser,
  subjectType: EvidenceSubject,
  subjectId: number,
): { accountId: number; name: string } {
  switch (subjectType) {
    case "axis": {
      const axis = getAxisOrThrow(caller, subjectId);
      return { accountId: getSiteOrThrow(caller, axis.siteId).accountId, name: axis.label };
    }
    case "machine": {
      const machine = getMachineOrThrow(caller, subjectId);
      return { accountId: getSiteOrThrow(caller, machine.siteId).accountId, name: machine.name };
    }
    case "case": {
      const row = getCaseOrThrow(caller, subjectId);
      return { accountId: row.accountId, name: row.name };
    }
  }
}

/** The evidence of one axis, machine or case, by field. */
export function listSubjectEvidence(
  caller: SessionUser,
  subjectType: EvidenceSubject,
  subjectId: number,
): EvidenceEntry[] {
  const { accountId } = subjectInScope(caller, subjectType, subjectId);
  return db
    .select(entryColumns)
    .from(valueEvidence)
    .where(
      and(
        eq(valueEvidence.accountId, accountId),
        eq(valueEvidence.subjectType, subjectType),
        eq(valueEvidence.subjectId, subjectId),
      ),
    )
    .all();
}

/**
 * The evidence of everything a case's value rests on: the case itself, its axes and their
 * machines. The results and the headline read it (lib/results/value-reliance.ts).
 */
export function listCaseEvidence(caller: SessionUser, caseId: number): EvidenceEntry[] {
  const row = getCaseOrThrow(caller, caseId);
  const picked = db
    .select({ axisId: caseAxes.axisId, machineId: axes.machineId })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .where(eq(caseAxes.caseId, caseId))
    .all();
  return evidenceOf(row.accountId, caseId, {
    axisIds: picked.map((p) => p.axisId),
    machineIds: [...new Set(picked.map((p) => p.machineId))],
  });
}

/**
 * The evidence of the subjects a frozen proposal's input names (its axes and machines, by the
 * ids it was frozen with) and of its case, as recorded now: the proposal keeps its figures, the
 * sources beside them may have been added since.
 */
export function listProposalEvidence(
  caller: SessionUser,
  caseId: number,
  subjects: { axisIds: number[]; machineIds: number[] },
): EvidenceEntry[] {
  const row = getCaseOrThrow(caller, caseId);
  return evidenceOf(row.accountId, caseId, subjects);
}

/**
 * The same for the customer's reviewer, who reaches the proposal but not the case: the scope is
 * the proposal's (another account's proposal is not found), the sources read only.
 */
export function listReviewedProposalEvidence(
  caller: SessionUser,
  proposalId: number,
  subjects: { axisIds: number[]; machineIds: number[] },
): EvidenceEntry[] {
  const quote = getVisibleQuoteOrThrow(caller, proposalId);
  return evidenceOf(quote.accountId, quote.caseId, subjects);
}

/**
 * A frozen proposal's sources for whoever asks: the customer's reviewer through the proposal sent
 * to them, the vendor's people through its case (the workbook and dossier downloads).
 */
export function listProposalEvidenceFor(
  caller: SessionUser,
  proposal: { id: number; caseId: number },
  subjects: { axisIds: number[]; machineIds: number[] },
): EvidenceEntry[] {
  return caller.role === "reviewer"
    ? listReviewedProposalEvidence(caller, proposal.id, subjects)
    : listProposalEvidence(caller, proposal.caseId, subjects);
}

function evidenceOf(
  accountId: number,
  caseId: number,
  subjects: { axisIds: number[]; machineIds: number[] },
): EvidenceEntry[] {
  const of = (type: EvidenceSubject, ids: number[]) =>
    ids.length === 0
      ? undefined
      : and(eq(valueEvidence.subjectType, type), inArray(valueEvidence.subjectId, ids));
  return db
    .select(entryColumns)
    .from(valueEvidence)
    .where(
      and(
        eq(valueEvidence.accountId, accountId),
        or(
          and(eq(valueEvidence.subjectType, "case"), eq(valueEvidence.subjectId, caseId)),
          of("axis", subjects.axisIds),
          of("machine", subjects.machineIds),
        ),
      ),
    )
    .all();
}

/** Records (or replaces) the source of one figure, with its audit line, in one transaction. */
export function saveEvidence(caller: SessionUser, input: EvidenceInput): EvidenceEntry {
  assertRole(caller, ...VENDOR_ROLES);
  const subject = subjectInScope(caller, input.subjectType, input.subjectId);
  const values = {
    note: input.note,
    givenOn: input.givenOn,
    givenBy: input.givenBy,
    updatedById: caller.id,
    updatedAt: sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`,
  };
  return db.transaction(() => {
    db.insert(valueEvidence)
      .values({
        accountId: subject.accountId,
        subjectType: input.subjectType,
        subjectId: input.subjectId,
        field: input.field,
        ...values,
      })
      .onConflictDoUpdate({
        target: [valueEvidence.subjectType, valueEvidence.subjectId, valueEvidence.field],
        set: values,
      })
      .run();
    recordAudit({
      actor: caller,
      action: "evidence.save",
      targetType: input.subjectType,
      targetId: input.subjectId,
      detail: `${evidenceFieldLabel(input.subjectType, input.field)} of ${subject.name}: ${input.givenBy}, ${input.givenOn}`,
    });
    const { subjectType, subjectId, field, note, givenOn, givenBy } = input;
    return { subjectType, subjectId, field, note, givenOn, givenBy };
  });
}

/** Removes the source of one figure; true when there was one. */
export function clearEvidence(caller: SessionUser, input: EvidenceSubjectField): boolean {
  assertRole(caller, ...VENDOR_ROLES);
  const subject = subjectInScope(caller, input.subjectType, input.subjectId);
  return db.transaction(() => {
    const removed = db
      .delete(valueEvidence)
      .where(
        and(
          eq(valueEvidence.accountId, subject.accountId),
          eq(valueEvidence.subjectType, input.subjectType),
          eq(valueEvidence.subjectId, input.subjectId),
          eq(valueEvidence.field, input.field),
        ),
      )
      .run().changes;
    if (removed > 0)
      recordAudit({
        actor: caller,
        action: "evidence.clear",
        targetType: input.subjectType,
        targetId: input.subjectId,
        detail: `${evidenceFieldLabel(input.subjectType, input.field)} of ${subject.name}`,
      });
    return removed > 0;
  });
}
