import fs from "node:fs";
import os from "node:os";
import path from "node:path";

// What the in-process benchmarks share (lib/cli/bench-installed-base.ts, bench-pipeline.ts): a
// fresh database file, migrated and seeded with the demo, and the timing of one run.

/**
 * Points DATABASE_PATH at a new file in a temporary folder, migrates and seeds it. Call it before
 * anything imports @/db, which opens DATABASE_PATH on load. Returns the folder, for removal.
 */
export async function seededBenchDatabase(prefix: string): Promise<string> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), prefix));
  process.env.DATABASE_PATH = path.join(dir, "bench.db");
  const { openDatabase } = await import("../../db/client");
  const { migrateDatabase } = await import("../../db/migrate");
  const { seedDatabase } = await import("../../db/seed");
  const setup = openDatabase(process.env.DATABASE_PATH);
  migrateDatabase(setup);
  seedDatabase(setup);
  setup.$client.close();
  return dir;
}

export const median = (v: number[]) => [...v].sort((a, b) => a - b)[v.length >> 1];

/** The value of `run` and how long it took, in milliseconds. */
export function timed<T>(run: () => T): { value: T; ms: number } {
  const start = performance.now();
  const value = run();
  return { value, ms: performance.now() - start };
}

/** The same for work that ends in a promise: the time until it settles. */
export async function timedAsync<T>(run: () => T | Promise<T>): Promise<{ value: T; ms: number }> {
  const start = performance.now();
  const value = await run();
  return { value, ms: performance.now() - start };
}
