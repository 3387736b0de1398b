import { sql } from "drizzle-orm";
import {
  index,
  integer,
  primaryKey,
  sqliteTable,
  text,
  type AnySQLiteColumn,
} from "drizzle-orm/sqlite-core";
import { users } from "./users";

// A customer account of the vendor: the company whose installed base is modelled.
export const accounts = sqliteTable(
  "accounts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull().unique(),
    ownerId: integer("owner_id")
      .notNull()
      .references((): AnySQLiteColumn => users.id),
    createdAt: text("created_at")
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`),
    // Set when the account is archived: it leaves the working lists, but its cases, proposals and
    // pipeline history stay readable, and restoring clears it.
    archivedAt: text("archived_at"),
  },
  (t) => [index("accounts_owner_idx").on(t.ownerId)],
);

// Engineers other than the owner who may work on an account.
export const accountShares = sqliteTable(
  "account_shares",
  {
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [
    primaryKey({ columns: [t.accountId, t.userId] }),
    index("account_shares_user_idx").on(t.userId),
  ],
);

export type Account = typeof accounts.$inferSelect;
