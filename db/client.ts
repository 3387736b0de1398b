import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { drizzle } from "drizzle-orm/better-sqlite3";
import * as schema from "./schema";

export const DEFAULT_DATABASE_PATH = "data/loopshift.db";

export function databasePath(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.env.DATABASE_PATH || DEFAULT_DATABASE_PATH);
}

// One place that opens the SQLite file with the pragmas the product relies on. Used by the app's
// connection (db/index.ts) and by the command-line tools (migrate, seed, start), which must not
// import the "server-only" guard.
export function openDatabase(file = databasePath()) {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("synchronous = NORMAL");
  return drizzle(sqlite, { schema });
}

export type Db = ReturnType<typeof openDatabase>;
