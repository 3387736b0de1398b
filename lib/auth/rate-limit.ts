// Failed sign-in attempts, counted per e-mail and per client address over a sliding window.
// Kept in memory: Loopshift runs as one server process, and a restart forgetting the counts is
// acceptable for a throttle (the passwords stay bcrypt-hashed either way).
export const WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_EMAIL = 5;
export const MAX_FAILURES_PER_ADDRESS = 20;

const failures = new Map<string, number[]>();

function recent(key: string, now: number): number[] {
  const kept = (failures.get(key) ?? []).filter((t) => now - t < WINDOW_MS);
  if (kept.length) failures.set(key, kept);
  else failures.delete(key);
  return kept;
}

// Milliseconds until the caller may try again, or 0 when they may try now.
export function retryAfterMs(email: string, address: string, now = Date.now()): number {
  const checks: [string, number][] = [
    [`email:${email}`, MAX_FAILURES_PER_EMAIL],
    [`addr:${address}`, MAX_FAILURES_PER_ADDRESS],
  ];
  let wait = 0;
  for (const [key, max] of checks) {
    const times = recent(key, now);
    if (times.length >= max) wait = Math.max(wait, times[times.length - max] + WINDOW_MS - now);
  }
  return wait;
}

export function recordFailure(email: string, address: string, now = Date.now()) {
  for (const key of [`email:${email}`, `addr:${address}`]) {
    failures.set(key, [...recent(key, now), now]);
  }
}

export function clearFailures(email: string) {
  failures.delete(`email:${email}`);
}

export function describeWait(ms: number): string {
  const minutes = Math.ceil(ms / 60000);
  return minutes <= 1 ? "in about a minute" : `in ${minutes} minutes`;
}
