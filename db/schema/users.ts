import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { accounts } from "./accounts";

import { ROLES, type Role } from "../../lib/auth/roles";

// The word list lives in lib/auth/roles.ts, below the database, so pure code can use it.
export { ROLES, type Role };

export const users = sqliteTable(
  "users",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    email: text("email").notNull().unique(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    // Only reviewers belong to a customer account; vendor staff have none.
    accountId: integer("account_id").references(() => accounts.id, { onDelete: "set null" }),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    // Each session token carries the version it was issued under; signing out, deactivation and a
    // role change raise it, so every token issued before stops working on its next request.
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: text("created_at")
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`),
  },
  (t) => [index("users_account_idx").on(t.accountId)],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
