import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";

// Every integration test file gets its own SQLite file, migrated by the real drizzle-kit
// migrations and seeded with the demo scenario, before it imports the app's connection.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-test-"));
process.env.DATABASE_PATH = path.join(dir, "test.db");
const db = openDatabase(process.env.DATABASE_PATH);
migrateDatabase(db);
seedDatabase(db);
db.$client.close();
