import { NextRequest } from "next/server";
import { afterEach, describe, expect, it } from "vitest";
import { proxy } from "@/proxy";

// Finding 13.8: HSTS when served over https, and a nonce-based CSP without 'unsafe-inline'
// scripts, set by the app's proxy on every response it answers (passing, 401 and redirects).
const savedUrl = process.env.NEXTAUTH_URL;
afterEach(() => {
  process.env.NEXTAUTH_URL = savedUrl;
});

describe("headers the proxy sets", () => {
  it("a browser on the https deployment is told to keep to https (HSTS)", async () => {
    process.env.NEXTAUTH_URL = "https://loopshift.example.com";
    for (const path of ["/sign-in", "/accounts", "/api/v1/accounts"]) {
      const res = await proxy(new NextRequest(`https://loopshift.example.com${path}`));
      expect(res.headers.get("strict-transport-security")).toBe(
        "max-age=31536000; includeSubDomains",
      );
    }
  });

  it("over plain http no HSTS is sent", async () => {
    process.env.NEXTAUTH_URL = "http://localhost:3000";
    const res = await proxy(new NextRequest("http://localhost:3000/sign-in"));
    expect(res.headers.get("strict-transport-security")).toBeNull();
  });

  it("the redirect of the signed-out and the API's 401 carry the CSP too, with a nonce and no 'unsafe-inline' script", async () => {
    for (const path of ["/accounts", "/api/v1/accounts"]) {
      const csp = (await proxy(new NextRequest(`http://localhost:3000${path}`))).headers.get(
        "content-security-policy",
      );
      expect(csp).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
      expect(csp?.split(";").find((d) => d.includes("script-src"))).not.toContain(
        "'unsafe-inline'",
      );
    }
  });
});
