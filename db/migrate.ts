import path from "node:path";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { backfillVendorRevenue } from "./backfill-vendor-revenue";
import { openDatabase, type Db } from "./client";

// Commands run from the project root (npm scripts, tests, the bundled benchmark).
export const MIGRATIONS_FOLDER = path.resolve("drizzle");

/** Applies the migrations, then fills in what a migration cannot compute in SQL. */
export function migrateDatabase(db: Db) {
  migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
  // Exact decimal sums of the frozen inputs (0013): decimal.js, not SQLite's floating point.
  backfillVendorRevenue(db);
}

if (require.main === module) {
  migrateDatabase(openDatabase());
  console.log("Database migrated.");
}
