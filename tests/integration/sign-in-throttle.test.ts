import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { clientAddress } from "@/server/auth/client-address";
import { authOptions } from "@/server/auth/options";
import { ACCOUNT_POLICY, WINDOW_MS, delayAfter, describeWait } from "@/server/auth/rate-limit";

// Finding: the throttle trusted X-Forwarded-For (rotating it defeated the limit), lumped every
// client without it into one key (20 failures by anyone locked out everyone), locked a known
// account for 15 minutes after five guesses, and forgot everything on a restart.
//
// The app's own credentials authorize() runs behind a real HTTP server on loopback with the
// server preload that writes the socket's peer into the request (as spawnNext starts Next.js).
type Authorize = (
  credentials: Record<string, string>,
  req: { headers: Record<string, unknown> },
) => Promise<unknown>;
const provider = authOptions.providers[0] as unknown as { options: { authorize: Authorize } };
const authorize = provider.options.authorize;

let server: http.Server;
let url: string;

beforeAll(async () => {
  // The preload spawnNext gives the Next.js server (plain JavaScript, hence the computed path).
  await import(new URL("../../lib/cli/peer-address.mjs", import.meta.url).href);
  server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      const body = JSON.parse(Buffer.concat(chunks).toString("utf8")) as Record<string, string>;
      let answer: { ok: boolean; error?: string };
      try {
        answer = { ok: Boolean(await authorize(body, { headers: { ...req.headers } })) };
      } catch (error) {
        answer = { ok: false, error: (error as Error).message };
      }
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify(answer));
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
});
afterAll(() => new Promise((resolve) => server.close(resolve)));

async function signIn(email: string, password: string, headers: Record<string, string> = {}) {
  const res = await fetch(url, {
    method: "POST",
    headers: { "content-type": "application/json", ...headers },
    body: JSON.stringify({ email, password }),
  });
  return (await res.json()) as { ok: boolean; error?: string };
}

const throttled = /^Too many failed attempts\. Try again /;

describe("the sign-in throttle", () => {
  it("rotating X-Forwarded-For does not get an attacker more guesses at an account", async () => {
    for (let i = 0; i < ACCOUNT_POLICY.free; i++) {
      const r = await signIn("manager@example.com", `guess-${i}`, {
        "x-forwarded-for": `198.51.100.${i}`,
      });
      expect(r.error).toBe("That e-mail and password do not match an active user.");
    }
    const next = await signIn("manager@example.com", "guess-x", {
      "x-forwarded-for": "198.51.100.99",
    });
    expect(next.error).toMatch(throttled);
  });

  it("a client-sent peer header is replaced by the socket's address", async () => {
    let seen: Record<string, unknown> = {};
    const probe = http.createServer((req, res) => {
      seen = { ...req.headers };
      res.end();
    });
    await new Promise<void>((resolve) => probe.listen(0, "127.0.0.1", resolve));
    await fetch(`http://127.0.0.1:${(probe.address() as AddressInfo).port}/`, {
      headers: { "x-loopshift-peer": "203.0.113.50", "x-forwarded-for": "203.0.113.51" },
    });
    await new Promise((resolve) => probe.close(resolve));
    expect(clientAddress(seen)).toBe("127.0.0.1");
  });

  it("five wrong guesses slow the owner down by seconds, not a 15-minute lockout; the delay grows", async () => {
    const t0 = Date.now();
    const owner = "engineer@example.com";
    const waits: number[] = [];
    for (let i = 0; i < 5; i++) {
      await new Promise((r) => setTimeout(r, delayAfter(i, ACCOUNT_POLICY)));
      expect((await signIn(owner, `wrong-${i}`)).ok).toBe(false);
      waits.push(delayAfter(i + 1, ACCOUNT_POLICY));
    }
    expect(waits.at(-1)).toBeLessThanOrEqual(4000);
    expect(waits).toEqual([...waits].sort((a, b) => a - b));
    const blocked = await signIn(owner, "loopshift-demo");
    expect(blocked.error).toMatch(/Try again in \d seconds\.$/);
    await new Promise((r) => setTimeout(r, 4100));
    expect(await signIn(owner, "loopshift-demo")).toEqual({ ok: true });
    expect(Date.now() - t0).toBeLessThan(30_000);
  });

  it("another client's failures do not lock out someone else at another address", async () => {
    // Many failures from TRUSTED_PROXY-forwarded 203.0.113.9, each on a different account.
    const env = process.env;
    env.TRUSTED_PROXY = "127.0.0.1";
    try {
      for (let i = 0; i < 40; i++) {
        await signIn(`nobody-${i}@example.com`, "x", { "x-forwarded-for": "203.0.113.9" });
      }
      const attacker = await signIn("nobody-new@example.com", "x", {
        "x-forwarded-for": "203.0.113.9",
      });
      expect(attacker.error).toMatch(throttled);
      expect(
        await signIn("reviewer@example.com", "loopshift-demo", {
          "x-forwarded-for": "192.0.2.44",
        }),
      ).toEqual({ ok: true });
    } finally {
      delete env.TRUSTED_PROXY;
    }
  });

  it("rotating X-Forwarded-For while spraying many accounts is still one address, and is slowed", async () => {
    const results = [];
    for (let i = 0; i < 35; i++) {
      results.push(
        await signIn(`sprayed-${i}@example.com`, "Winter2026!", {
          "x-forwarded-for": `198.51.100.${100 + i}`,
        }),
      );
    }
    expect(results.at(-1)?.error).toMatch(throttled);
  });

  it("the counts are in SQLite, so a restart does not reset them", () => {
    const other = openDatabase(process.env.DATABASE_PATH);
    const rows = other.$client
      .prepare("select key, failures, blocked_until from sign_in_throttle where key = ?")
      .all("account:manager@example.com") as { failures: number; blocked_until: number }[];
    other.$client.close();
    expect(rows).toHaveLength(1);
    expect(rows[0].failures).toBeGreaterThanOrEqual(ACCOUNT_POLICY.free);
  });
});

describe("which address is the client", () => {
  const env = (trusted?: string) => ({ LOOPSHIFT_PEER_FROM_SOCKET: "1", TRUSTED_PROXY: trusted });
  const peer = "10.0.0.2";

  it("without TRUSTED_PROXY a forged X-Forwarded-For is ignored", () => {
    expect(
      clientAddress({ "x-loopshift-peer": peer, "x-forwarded-for": "203.0.113.1" }, env()),
    ).toBe(peer);
  });

  it("behind one trusted hop the proxy's entry counts, not what the client prepended", () => {
    const headers = { "x-loopshift-peer": peer, "x-forwarded-for": "6.6.6.6, 203.0.113.1" };
    expect(clientAddress(headers, env("1"))).toBe("203.0.113.1");
    expect(clientAddress(headers, env("10.0.0.2"))).toBe("203.0.113.1");
    // A request that did not come through the proxy speaks for nobody else.
    expect(clientAddress({ ...headers, "x-loopshift-peer": "192.0.2.8" }, env("10.0.0.2"))).toBe(
      "192.0.2.8",
    );
  });

  it("a peer header in a process without the preload is not trusted", () => {
    expect(clientAddress({ "x-loopshift-peer": "203.0.113.1" }, {})).toBe("unknown");
  });

  it("the wait is told in seconds or minutes", () => {
    expect(describeWait(4000)).toBe("in 4 seconds");
    expect(describeWait(WINDOW_MS)).toBe("in 15 minutes");
  });
});
