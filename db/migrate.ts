import path from "node:path";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { openDatabase, type Db } from "./client";

// Commands run from the project root (npm scripts, tests, the bundled benchmark).
export const MIGRATIONS_FOLDER = path.resolve("drizzle");

export function migrateDatabase(db: Db) {
  migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
}

if (require.main === module) {
  migrateDatabase(openDatabase());
  console.log("Database migrated.");
}
