import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";

describe("the database file", () => {
  it("is migrated by drizzle-kit's migrations, in WAL mode with foreign keys enforced", async () => {
    const { db } = await import("@/db");
    const raw = db.$client as Database.Database;
    expect(raw.pragma("journal_mode", { simple: true })).toBe("wal");
    expect(raw.pragma("foreign_keys", { simple: true })).toBe(1);
    expect(Number(raw.pragma("busy_timeout", { simple: true }))).toBeGreaterThan(0);
    const applied = raw.prepare("select count(*) as n from __drizzle_migrations").get() as {
      n: number;
    };
    expect(applied.n).toBeGreaterThan(0);
    expect(() =>
      raw.prepare("insert into account_shares (account_id, user_id) values (999, 999)").run(),
    ).toThrow(/FOREIGN KEY/);
  });
});
