import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { sites } from "./installed-base";
import { users } from "./users";

// One committed (or refused) import of a spreadsheet into a site.
export const imports = sqliteTable(
  "imports",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    siteId: integer("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    userId: integer("user_id").references(() => users.id, { onDelete: "set null" }),
    fileName: text("file_name").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    rowsRead: integer("rows_read").notNull(),
    rowsImported: integer("rows_imported").notNull(),
    errorCount: integer("error_count").notNull(),
    machinesCreated: integer("machines_created").notNull().default(0),
    at: text("at")
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`),
  },
  (t) => [index("imports_site_idx").on(t.siteId, t.at)],
);

export type ImportRecord = typeof imports.$inferSelect;
