import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { signInThrottle } from "@/db/schema";

// Failed sign-ins, counted per account and per client address, with a delay that doubles after
// each failure beyond a free allowance, up to a cap: never a hard lockout, so an attacker who
// knows an e-mail cannot shut its owner out for long, while guessing stays slow (OWASP ASVS 2.2.1:
// at most about 60 failed attempts per hour per account once the cap is reached). The counts
// live in SQLite, so a restart does not reset them; a key quiet for WINDOW_MS starts afresh.
export const WINDOW_MS = 15 * 60 * 1000;

export interface ThrottlePolicy {
  /** Failures allowed before any delay. */
  free: number;
  /** The first delay; each further failure doubles it. */
  baseMs: number;
  maxMs: number;
}

export const ACCOUNT_POLICY: ThrottlePolicy = { free: 3, baseMs: 1000, maxMs: 60_000 };
// One address may be an office behind one router, or the loopback of the tests, so it gets a
// larger allowance before the delays start.
export const ADDRESS_POLICY: ThrottlePolicy = { free: 30, baseMs: 1000, maxMs: 60_000 };

export function delayAfter(failures: number, policy: ThrottlePolicy): number {
  if (failures < policy.free) return 0;
  return Math.min(policy.baseMs * 2 ** (failures - policy.free), policy.maxMs);
}

const accountKey = (email: string) => `account:${email.trim().toLowerCase()}`;
const addressKey = (address: string) => `address:${address}`;

// Milliseconds until the caller may try again, or 0 when they may try now.
export function retryAfterMs(email: string, address: string, now = Date.now()): number {
  const rows = db
    .select()
    .from(signInThrottle)
    .where(inArray(signInThrottle.key, [accountKey(email), addressKey(address)]))
    .all();
  return Math.max(0, ...rows.map((r) => r.blockedUntil - now));
}

export function recordFailure(email: string, address: string, now = Date.now()) {
  const keys: [string, ThrottlePolicy][] = [
    [accountKey(email), ACCOUNT_POLICY],
    [addressKey(address), ADDRESS_POLICY],
  ];
  db.transaction((tx) => {
    for (const [key, policy] of keys) {
      const row = tx.select().from(signInThrottle).where(eq(signInThrottle.key, key)).get();
      const failures = row && now - row.lastFailureAt < WINDOW_MS ? row.failures + 1 : 1;
      const values = {
        failures,
        lastFailureAt: now,
        blockedUntil: now + delayAfter(failures, policy),
      };
      tx.insert(signInThrottle)
        .values({ key, ...values })
        .onConflictDoUpdate({ target: signInThrottle.key, set: values })
        .run();
    }
  });
}

// A successful sign-in clears the account's count. The address keeps its count: otherwise one
// valid account would let an address reset its allowance between guesses at others.
export function clearFailures(email: string) {
  db.delete(signInThrottle)
    .where(eq(signInThrottle.key, accountKey(email)))
    .run();
}

export function describeWait(ms: number): string {
  const seconds = Math.ceil(ms / 1000);
  if (seconds <= 1) return "in a second";
  if (seconds < 60) return `in ${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? "in about a minute" : `in ${minutes} minutes`;
}
