import "server-only";
import { appUrl } from "@/lib/mail/app-url";

const UNSAFE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

// next-auth's session cookie: plain over http, "__Secure-" over https, split into ".0", ".1"…
// when the token outgrows one cookie.
const SESSION_COOKIE = /^(?:__Secure-)?next-auth\.session-token(?:\.\d+)?$/;

function hasSessionCookie(request: Request): boolean {
  const header = request.headers.get("cookie");
  if (!header) return false;
  return header.split(";").some((part) => SESSION_COOKIE.test(part.split("=")[0]!.trim()));
}

/** The app's own origin, from NEXTAUTH_URL (what the browser shows in the address bar). */
export function appOrigin(): string {
  return new URL(appUrl("/")).origin;
}

// A browser attaches the session cookie to any request, whoever's page sends it, so a
// cookie-authenticated write must prove it comes from one of our own pages (ASVS 4.0 V4.2.2,
// V13.2.3). Browsers send Origin on every cross-origin POST/PUT/PATCH/DELETE and Sec-Fetch-Site
// on every request; a request with neither cannot be told apart from a forged one, so it is
// refused too. Requests without the session cookie (the signed webhook) are not a CSRF
// vector: nothing of the victim's is attached to them.
export function isCrossSiteWrite(request: Request): boolean {
  if (!UNSAFE_METHODS.has(request.method.toUpperCase())) return false;
  if (!hasSessionCookie(request)) return false;
  const origin = request.headers.get("origin");
  if (origin !== null) return origin !== appOrigin();
  const site = request.headers.get("sec-fetch-site");
  return site !== "same-origin" && site !== "none";
}
