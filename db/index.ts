import "server-only";
import { openDatabase, type Db } from "./client";

// The app's one connection, kept across hot reloads in development.
const globalForDb = globalThis as unknown as { loopshiftDb?: Db };

export const db: Db = globalForDb.loopshiftDb ?? openDatabase();
if (process.env.NODE_ENV !== "production") globalForDb.loopshiftDb = db;
