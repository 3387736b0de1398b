import { describe, expect, it } from "vitest";
import {
  MAX_FAILURES_PER_EMAIL,
  WINDOW_MS,
  clearFailures,
  describeWait,
  recordFailure,
  retryAfterMs,
} from "@/lib/auth/rate-limit";

describe("sign-in throttling", () => {
  it("blocks an e-mail after repeated failures and says when to try again", () => {
    const t0 = 1_000_000;
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) {
      expect(retryAfterMs("a@example.com", "10.0.0.1", t0 + i)).toBe(0);
      recordFailure("a@example.com", "10.0.0.1", t0 + i);
    }
    const wait = retryAfterMs("a@example.com", "10.0.0.9", t0 + 10);
    expect(wait).toBeGreaterThan(WINDOW_MS - 100);
    expect(describeWait(wait)).toBe("in 15 minutes");
    expect(retryAfterMs("a@example.com", "10.0.0.1", t0 + WINDOW_MS + 10)).toBe(0);
  });

  it("a successful sign-in clears the e-mail's count", () => {
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) recordFailure("b@example.com", "10.0.0.2", 5);
    expect(retryAfterMs("b@example.com", "10.0.0.3", 6)).toBeGreaterThan(0);
    clearFailures("b@example.com");
    expect(retryAfterMs("b@example.com", "10.0.0.3", 6)).toBe(0);
  });

  it("blocks one address trying many e-mails", () => {
    for (let i = 0; i < 20; i++) recordFailure(`u${i}@example.com`, "10.9.9.9", 100);
    expect(retryAfterMs("fresh@example.com", "10.9.9.9", 101)).toBeGreaterThan(0);
    expect(retryAfterMs("fresh@example.com", "10.9.9.8", 101)).toBe(0);
  });
});
