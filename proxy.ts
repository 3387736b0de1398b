import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

// Only redirects the signed-out; every page, action and handler checks the caller again.
// It also sets the Content-Security-Policy (a fresh script nonce per request) and, over https,
// Strict-Transport-Security on every response it sees.
const PUBLIC_PREFIXES = [
  "/sign-in",
  "/invitation",
  "/api/auth",
  "/api/v1/webhooks",
  // The payment provider signs its webhooks; the handler checks the signature, not a session.
  "/api/webhooks",
  "/_next",
  "/favicon",
  "/brand",
];

const isDev = process.env.NODE_ENV !== "production";

// Scripts run only with this request's nonce, which Next.js reads from the request's CSP header
// and puts on its own inline bootstrap scripts; 'strict-dynamic' lets those load the chunks.
// No 'unsafe-inline' for scripts; the dev server needs eval for fast refresh, so only there.
export function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${isDev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

// HSTS only where the app is served over https (the public URL says so, or the request came in
// so); sent over plain http it would mean nothing, and on localhost it would pin the browser.
function servedOverHttps(request: NextRequest): boolean {
  return (
    request.nextUrl.protocol === "https:" ||
    (process.env.NEXTAUTH_URL ?? "").toLowerCase().startsWith("https://")
  );
}

export async function proxy(request: NextRequest) {
  const nonce = btoa(crypto.randomUUID());
  const csp = contentSecurityPolicy(nonce);
  const secure = (response: NextResponse) => {
    response.headers.set("Content-Security-Policy", csp);
    if (servedOverHttps(request)) {
      response.headers.set("Strict-Transport-Security", "max-age=31536000; includeSubDomains");
    }
    return response;
  };
  const pass = () => {
    const headers = new Headers(request.headers);
    headers.set("x-nonce", nonce);
    headers.set("content-security-policy", csp);
    return secure(NextResponse.next({ request: { headers } }));
  };

  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PREFIXES.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return pass();
  }
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return pass();
  if (pathname.startsWith("/api/")) {
    return secure(NextResponse.json({ error: "Sign in to continue" }, { status: 401 }));
  }
  const signIn = new URL("/sign-in", request.url);
  if (pathname !== "/") signIn.searchParams.set("callbackUrl", pathname + search);
  return secure(NextResponse.redirect(signIn));
}

export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico|icon.svg).*)"],
};
