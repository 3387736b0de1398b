import "./node-async-storage";
import { RequestCookies } from "next/dist/compiled/@edge-runtime/cookies";
import { workAsyncStorage } from "next/dist/server/app-render/work-async-storage.external";
import { workUnitAsyncStorage } from "next/dist/server/app-render/work-unit-async-storage.external";
import { encode } from "next-auth/jwt";
import type { SessionUser } from "@/lib/auth/session-user";

// Route handlers and server actions read the caller through next-auth's getServerSession, which
// reads next/headers; outside `next start` those need the request scope Next.js sets up for every
// request. This runs a call inside such a scope, with the signed session cookie of a seeded user
// (minted with the same secret the app verifies it with), so the real handler and action run
// in-process, authentication included. It is Next.js's internal storage, used by tests only.
const SECRET = "integration-test-session-secret";
process.env.NEXTAUTH_SECRET ??= SECRET;
process.env.NEXTAUTH_URL ??= "http://localhost:3000";

async function sessionCookie(user: SessionUser | null): Promise<string> {
  if (!user) return "";
  const token = await encode({
    secret: process.env.NEXTAUTH_SECRET!,
    token: {
      sub: String(user.id),
      uid: user.id,
      role: user.role,
      accountId: user.accountId,
      email: user.email,
      name: user.name,
      // The session version the token was issued under (server/auth/options.ts): seeded users start
      // at 0, and a token of another version is refused as signed out.
      sv: (user as { sessionVersion?: number }).sessionVersion ?? 0,
    },
  });
  return `next-auth.session-token=${token}`;
}

/** Runs `call` as one request of `user` (null: signed out). */
export async function asRequestOf<T>(user: SessionUser | null, call: () => Promise<T>): Promise<T> {
  const headers = new Headers({ cookie: await sessionCookie(user) });
  const cookies = new RequestCookies(headers);
  const workStore = {
    route: "/integration-test",
    page: "/integration-test",
    isStaticGeneration: false,
    forceStatic: false,
    dynamicShouldError: false,
    pendingRevalidates: {},
    pendingRevalidatedTags: [],
  };
  const requestStore = {
    type: "request",
    phase: "action",
    headers,
    cookies,
    userspaceMutableCookies: cookies,
    mutableCookies: cookies,
    implicitTags: { tags: [], expirationsByCacheKind: new Map() },
  };
  return workAsyncStorage.run(workStore as never, () =>
    workUnitAsyncStorage.run(requestStore as never, call),
  );
}
