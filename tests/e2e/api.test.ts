import { describe, expect, it } from "vitest";
import { z } from "zod";
import { baseUrl, request, signInOverHttp } from "./support/http";

const sessionSchema = z.object({
  user: z.object({
    id: z.number().int(),
    email: z.string().email(),
    name: z.string(),
    role: z.enum(["engineer", "manager", "reviewer", "admin"]),
    accountId: z.number().int().nullable(),
  }),
  expires: z.string(),
});

const errorSchema = z.object({ error: z.string() });

describe("sign-in over HTTP (next-auth credentials)", () => {
  const demo = [
    ["admin@example.com", "admin"],
    ["engineer@example.com", "engineer"],
    ["engineer2@example.com", "engineer"],
    ["manager@example.com", "manager"],
    ["reviewer@example.com", "reviewer"],
  ] as const;

  it.each(demo)(
    "%s signs in and the session carries id, role %s and account",
    async (email, role) => {
      const { jar, error } = await signInOverHttp(email, "loopshift-demo");
      expect(error).toBeNull();
      const session = sessionSchema.parse(await (await request(jar, "/api/auth/session")).json());
      expect(session.user).toMatchObject({ email, role });
      expect(session.user.accountId === null).toBe(role !== "reviewer");
    },
  );

  it("the session cookie is httpOnly", async () => {
    const { jar } = await signInOverHttp("engineer@example.com", "loopshift-demo");
    expect(jar.header()).toContain("next-auth.session-token");
    const csrf = await request(null, "/api/auth/csrf");
    expect(csrf.headers.getSetCookie().join("\n")).toMatch(/HttpOnly/i);
  });

  it("a wrong password is refused with a plain message and no session", async () => {
    const { jar, error } = await signInOverHttp("manager@example.com", "not-the-password");
    expect(error).toBe("That e-mail and password do not match an active user.");
    expect(await (await request(jar, "/api/auth/session")).json()).toEqual({});
  });

  it("repeated failures for one e-mail are throttled with a time to try again", async () => {
    for (let i = 0; i < 5; i++) await signInOverHttp("someone.unknown@example.com", `wrong-${i}`);
    const blocked = await signInOverHttp("someone.unknown@example.com", "any-password");
    // A delay that grows with each failure (seconds here), never a 15-minute lockout.
    // Attempts made while blocked do not count, so the wait here is a second or a few.
    expect(blocked.error).toMatch(
      /^Too many failed attempts\. Try again in (a second|\d+ seconds)\.$/,
    );
  });
});

describe("the API answers JSON, never an HTML page", () => {
  it("a signed-out POST /api/v1/evaluate gets 401", async () => {
    const res = await request(null, "/api/v1/evaluate", { method: "POST", body: "{}" });
    expect(res.status).toBe(401);
    expect(res.headers.get("content-type")).toContain("application/json");
    errorSchema.parse(await res.json());
  });

  it("an unknown API path gets a JSON 404 for a signed-in user", async () => {
    const { jar } = await signInOverHttp("engineer@example.com", "loopshift-demo");
    const res = await request(jar, "/api/v1/no-such-thing");
    expect(res.status).toBe(404);
    expect(errorSchema.parse(await res.json()).error).toBe("No such API endpoint");
  });

  it("a signed-out page request is redirected to the sign-in page", async () => {
    const res = await request(null, "/admin");
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toContain("/sign-in?callbackUrl=%2Fadmin");
  });
});

describe("role homes and the administrator's area", () => {
  it.each([
    ["reviewer@example.com", 404],
    ["engineer@example.com", 404],
    ["manager@example.com", 404],
    ["admin@example.com", 200],
  ])("/admin for %s answers %i", async (email, status) => {
    const { jar } = await signInOverHttp(email, "loopshift-demo");
    expect((await request(jar, "/admin")).status).toBe(status);
  });

  it.each([
    ["engineer@example.com", "/accounts"],
    ["manager@example.com", "/accounts"],
    ["reviewer@example.com", "/review"],
    ["admin@example.com", "/admin"],
  ])("%s is sent from / to %s", async (email, home) => {
    const { jar } = await signInOverHttp(email, "loopshift-demo");
    const res = await request(jar, "/");
    expect(res.status).toBe(307);
    expect(new URL(res.headers.get("location")!, baseUrl()).pathname).toBe(home);
  });
});

describe("security headers and self-hosted fonts", () => {
  it("sends a CSP without unsafe-eval, frame-ancestors 'none', nosniff and a referrer policy", async () => {
    const res = await request(null, "/sign-in");
    const csp = res.headers.get("content-security-policy") ?? "";
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain("unsafe-eval");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  });

  it("the built CSS loads Lato from the app itself and no font from outside", async () => {
    const html = await (await request(null, "/sign-in")).text();
    const sheets = [...html.matchAll(/href="(\/_next\/static\/[^"]+\.css)"/g)].map((m) => m[1]);
    expect(sheets.length).toBeGreaterThan(0);
    const css = (await Promise.all(sheets.map(async (s) => (await request(null, s)).text()))).join(
      "\n",
    );
    expect(css).toMatch(/font-family:\s*["']?Lato/);
    const urls = [...css.matchAll(/url\(([^)]+)\)/g)].map((m) => m[1].replace(/["']/g, ""));
    const fontUrls = urls.filter((u) => /\.woff2?$/.test(u));
    expect(fontUrls.length).toBeGreaterThan(0);
    for (const u of urls) expect(u).not.toMatch(/^(https?:)?\/\//);
    const font = await request(
      null,
      new URL(fontUrls[0], `${baseUrl()}/_next/static/css/`).pathname,
    );
    expect(font.status).toBe(200);
  });
});
