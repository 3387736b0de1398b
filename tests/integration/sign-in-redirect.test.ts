import { describe, expect, it } from "vitest";
import { sameOriginPath } from "@/lib/auth/callback-url";
import { authOptions } from "@/server/auth/options";

// Finding: after sign-in, callbackUrl=/%5Cevil.example (also /%09/…, /%5C/…) sent the browser to
// another host, because browsers read "\" as "/" and drop tabs. Values are as the page receives
// them, after the query string is decoded.
const APP = "http://loopshift.test:3000";
const offsite = [
  "/\\evil.example",
  "/\t/evil.example",
  "/\\/evil.example",
  "//evil.example",
  "/.//evil.example",
  "/\n/evil.example",
  "https://evil.example/accounts",
  "javascript:alert(1)",
  "http://loopshift.test:3001/accounts",
];

describe("the destination after signing in", () => {
  it.each(offsite)(
    "a callbackUrl of %j is refused, so the user lands on the app's own home",
    (value) => {
      expect(sameOriginPath(value, APP)).toBeUndefined();
    },
  );

  it("a path of the app itself is kept, with its query", () => {
    expect(sameOriginPath("/cases/3?tab=result", APP)).toBe("/cases/3?tab=result");
    expect(sameOriginPath(`${APP}/pipeline`, APP)).toBe("/pipeline");
    // An encoded backslash that survives decoding stays a path segment on our own host.
    expect(sameOriginPath("/%5Cevil.example", APP)).toBe("/%5Cevil.example");
  });

  it.each(offsite)(
    "next-auth's redirect callback turns %j into the app's own home",
    async (value) => {
      const redirect = authOptions.callbacks!.redirect!;
      const target = await redirect({ url: value, baseUrl: APP });
      expect(target).toBe(APP);
      expect(new URL(target).host).toBe("loopshift.test:3000");
    },
  );

  it("next-auth's redirect callback keeps a path of the app", async () => {
    const redirect = authOptions.callbacks!.redirect!;
    expect(await redirect({ url: "/review", baseUrl: APP })).toBe(`${APP}/review`);
  });
});
