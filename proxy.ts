import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

// Only redirects the signed-out; every page, action and handler checks the caller again.
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

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PREFIXES.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return NextResponse.next();
  }
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  if (pathname.startsWith("/api/")) {
    return NextResponse.json({ error: "Sign in to continue" }, { status: 401 });
  }
  const signIn = new URL("/sign-in", request.url);
  if (pathname !== "/") signIn.searchParams.set("callbackUrl", pathname + search);
  return NextResponse.redirect(signIn);
}

export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico|icon.svg).*)"],
};
