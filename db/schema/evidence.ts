import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { EVIDENCE_SUBJECTS, type EvidenceSubject } from "../../lib/evidence/subjects";
import { accounts } from "./accounts";
import { users } from "./users";

export { EVIDENCE_SUBJECTS, type EvidenceSubject };

// Where a typed value figure comes from (docs/model.md (The business case)): a note, the date it
// was given and who gave it, one row per figure of an axis, a machine or a case. account_id is
// the subject's account, so the tenant scope goes straight into the WHERE clause.
// subject_id carries no foreign key: it names a row of one of three tables. A deleted axis,
// machine or case leaves its rows behind unread (ids are never reused), and the installed
// base's undo, which puts a deleted row back with its id, finds them again.
export const valueEvidence = sqliteTable(
  "value_evidence",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    subjectType: text("subject_type", { enum: EVIDENCE_SUBJECTS }).notNull(),
    subjectId: integer("subject_id").notNull(),
    field: text("field").notNull(),
    note: text("note").notNull(),
    // The day the figure was given or measured (YYYY-MM-DD).
    givenOn: text("given_on").notNull(),
    givenBy: text("given_by").notNull(),
    updatedById: integer("updated_by_id").references(() => users.id, { onDelete: "set null" }),
    updatedAt: text("updated_at")
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`),
  },
  (t) => [
    uniqueIndex("value_evidence_subject_field_idx").on(t.subjectType, t.subjectId, t.field),
    index("value_evidence_account_idx").on(t.accountId),
  ],
);

export type ValueEvidence = typeof valueEvidence.$inferSelect;
