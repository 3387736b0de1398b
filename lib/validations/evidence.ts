import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { EVIDENCE_SUBJECTS, isEvidenceField } from "@/lib/evidence/subjects";

// Which figure of which axis, machine or case.
const subjectShape = {
  subjectType: z.enum(EVIDENCE_SUBJECTS, { error: "Choose an axis, a machine or a case" }),
  subjectId: idSchema(),
  field: z.string().max(60),
};

const checkField = (
  v: { subjectType: (typeof EVIDENCE_SUBJECTS)[number]; field: string },
  ctx: z.RefinementCtx,
) => {
  if (!isEvidenceField(v.subjectType, v.field))
    ctx.addIssue({ code: "custom", path: ["field"], message: "This figure takes no source" });
};

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A real calendar day, written YYYY-MM-DD (what a date input sends). */
function isCalendarDay(text: string): boolean {
  if (!ISO_DAY.test(text)) return false;
  const day = new Date(`${text}T00:00:00Z`);
  return !Number.isNaN(day.getTime()) && day.toISOString().slice(0, 10) === text;
}

/**
 * The source of one typed figure: a note saying where it comes from, the day it was given and
 * who gave it. All three are asked: a figure "from the plant" with no name or day cannot be
 * followed up by a reviewer.
 */
export const evidenceInputSchema = z
  .object({
    ...subjectShape,
    note: z
      .string({ error: "Say where the figure comes from" })
      .trim()
      .min(1, "Say where the figure comes from, such as “maintenance log 2025, line 3”")
      .max(1000, "Keep the note under 1,000 characters"),
    givenOn: z
      .string({ error: "Enter the date the figure was given" })
      .trim()
      .refine(isCalendarDay, "Enter the date the figure was given, such as 2026-03-14"),
    givenBy: z
      .string({ error: "Say who gave the figure" })
      .trim()
      .min(1, "Say who gave the figure, such as “J. Smith, maintenance lead”")
      .max(120, "Keep it under 120 characters"),
  })
  .superRefine(checkField);

export const evidenceSubjectFieldSchema = z.object(subjectShape).superRefine(checkField);

export type EvidenceInput = z.output<typeof evidenceInputSchema>;
export type EvidenceSubjectField = z.output<typeof evidenceSubjectFieldSchema>;
