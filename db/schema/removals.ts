import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { cases } from "./cases";
import { users } from "./users";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// An axis that left an open case because it, its machine or its site was deleted. The case's own
// row in case_axes goes with the axis; this line stays so the case can say what was removed and
// by whom. Issued proposals need no such line: they hold their frozen input.
export const caseRemovedAxes = sqliteTable(
  "case_removed_axes",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    caseId: integer("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    axisLabel: text("axis_label").notNull(),
    machineName: text("machine_name").notNull(),
    // What was deleted: the axis itself, its machine or its site.
    removedWith: text("removed_with", { enum: ["axis", "machine", "site"] }).notNull(),
    removedById: integer("removed_by_id").references(() => users.id, { onDelete: "set null" }),
    removedAt: text("removed_at").notNull().default(now),
  },
  (t) => [index("case_removed_axes_case_idx").on(t.caseId)],
);

// The rows a delete took away, kept for a short while so that the person who deleted them can
// put them back with the same ids (undo). Expired entries are purged on the next delete.
export const deletionUndo = sqliteTable(
  "deletion_undo",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: ["axis", "machine", "site"] }).notNull(),
    label: text("label").notNull(),
    payload: text("payload", { mode: "json" }).$type<Record<string, unknown[]>>().notNull(),
    createdAt: text("created_at").notNull().default(now),
    expiresAt: text("expires_at").notNull(),
  },
  (t) => [index("deletion_undo_user_idx").on(t.userId)],
);

export type CaseRemovedAxis = typeof caseRemovedAxes.$inferSelect;
export type DeletionUndo = typeof deletionUndo.$inferSelect;
