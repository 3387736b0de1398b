import path from "node:path";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { openDatabase, type Db } from "./client";

export const MIGRATIONS_FOLDER = path.resolve(__dirname, "../drizzle");

export function migrateDatabase(db: Db) {
  migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
}

if (require.main === module) {
  migrateDatabase(openDatabase());
  console.log("Database migrated.");
}
