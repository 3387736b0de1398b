import Database from "better-sqlite3";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { launchBrowser } from "./support/browser";
import { baseUrl, request, signInOverHttp } from "./support/http";

// Issue 13 over real HTTP against the built app: the open redirect (13.2), the throttle's client
// address (13.3), sign-out ending saved tokens (13.7), the CSP nonce and HSTS (13.8).
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("after signing in with a hostile callbackUrl", () => {
  it.each(["/%5Cevil.example", "/%09/evil.example", "/%5C/evil.example"])(
    "a callbackUrl of %s lands on the app's own home",
    async (callbackUrl) => {
      const context = await browser.newContext();
      const page = await context.newPage();
      // Nothing may leave for another host; a request there would fail anyway on this machine.
      const offsite: string[] = [];
      page.on("request", (r) => {
        if (new URL(r.url()).host !== new URL(baseUrl()).host) offsite.push(r.url());
      });
      await page.goto(`${baseUrl()}/sign-in?callbackUrl=${callbackUrl}`);
      await page.getByLabel("E-mail").fill("engineer@example.com");
      await page.getByLabel("Password").fill("loopshift-demo");
      await page.getByRole("button", { name: "Sign in", exact: true }).click();
      await page.waitForURL(`${baseUrl()}/accounts`);
      expect(new URL(page.url()).origin).toBe(new URL(baseUrl()).origin);
      expect(offsite).toEqual([]);
      await context.close();
    },
  );
});

describe("signing out", () => {
  it("a session cookie saved before sign-out no longer opens the API", async () => {
    const { jar } = await signInOverHttp("engineer2@example.com", "loopshift-demo");
    const saved = jar.header();
    expect((await request(jar, "/api/v1/accounts")).status).toBe(200);

    const csrf = (await (await request(jar, "/api/auth/csrf")).json()) as { csrfToken: string };
    const out = await request(jar, "/api/auth/signout", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, json: "true" }),
    });
    expect(out.status).toBeLessThan(400);

    const replay = await fetch(`${baseUrl()}/api/v1/accounts`, {
      headers: { cookie: saved },
      redirect: "manual",
    });
    expect(replay.status).toBe(401);
  });
});

describe("the sign-in throttle's client address", () => {
  it("a forged X-Forwarded-For or peer header does not change the address the app records", async () => {
    const jar = (await signInOverHttp("engineer@example.com", "loopshift-demo")).jar;
    const csrf = (await (await request(jar, "/api/auth/csrf")).json()) as { csrfToken: string };
    await request(jar, "/api/auth/callback/credentials", {
      method: "POST",
      headers: {
        "content-type": "application/x-www-form-urlencoded",
        "x-forwarded-for": "203.0.113.77",
        "x-loopshift-peer": "203.0.113.78",
      },
      body: new URLSearchParams({
        csrfToken: csrf.csrfToken,
        email: "forged-address@example.com",
        password: "wrong",
        json: "true",
      }),
    });
    const db = new Database(inject("databasePath"), { readonly: true });
    const rows = db
      .prepare("select detail from audit_log where target_id = ? order by id desc")
      .all("forged-address@example.com") as { detail: string }[];
    db.close();
    expect(rows[0]?.detail).toMatch(/^from (127\.0\.0\.1|::1)$/);
  });
});

describe("security headers", () => {
  it("each page gets a fresh script nonce, every script carries it, and no 'unsafe-inline' script is allowed", async () => {
    const first = await request(null, "/sign-in");
    const second = await request(null, "/sign-in");
    const csp = first.headers.get("content-security-policy") ?? "";
    const scriptSrc = csp.split(";").find((d) => d.trim().startsWith("script-src")) ?? "";
    expect(scriptSrc).not.toContain("'unsafe-inline'");
    const nonce = /'nonce-([^']+)'/.exec(scriptSrc)?.[1];
    expect(nonce).toBeTruthy();
    expect(second.headers.get("content-security-policy")).not.toContain(nonce!);
    const html = await first.text();
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  });

  it("the page's scripts run under that policy: the form validates in the browser", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const refused: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy/i.test(m.text())) refused.push(m.text());
    });
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await page.getByText("Enter your password").waitFor();
    expect(refused).toEqual([]);
    await context.close();
  });

  it("over plain http there is no HSTS header", async () => {
    expect((await request(null, "/sign-in")).headers.get("strict-transport-security")).toBeNull();
  });
});
