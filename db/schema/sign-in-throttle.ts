import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";

// Failed sign-ins per key ("account:<e-mail>" or "address:<client address>"), kept in SQLite so
// a restart does not hand an attacker a fresh allowance. Times are epoch milliseconds.
export const signInThrottle = sqliteTable("sign_in_throttle", {
  key: text("key").primaryKey(),
  failures: integer("failures").notNull(),
  lastFailureAt: integer("last_failure_at").notNull(),
  blockedUntil: integer("blocked_until").notNull(),
});
