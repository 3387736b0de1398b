import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { recordAudit } from "@/db/queries/audit";
import { findUserForSignIn, revokeSessions } from "@/db/queries/users";
import { signInSchema } from "@/lib/validations/sign-in";
import { sameOriginPath } from "@/lib/auth/callback-url";
import { clientAddress } from "./client-address";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { clearFailures, describeWait, recordFailure, retryAfterMs } from "./rate-limit";

const UNKNOWN_USER_HASH = hashPassword("no user has this password");

export const WRONG_CREDENTIALS = "That e-mail and password do not match an active user.";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "Loopshift",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) throw new Error(WRONG_CREDENTIALS);
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers as Record<string, unknown> | undefined);

        const wait = retryAfterMs(email, address);
        if (wait > 0) {
          throw new Error(`Too many failed attempts. Try again ${describeWait(wait)}.`);
        }
        const user = findUserForSignIn(email);
        // Unknown and inactive users cost one bcrypt comparison too, and get the same message, so
        // neither the timing nor the text tells which e-mail addresses have accounts.
        const ok = await verifyPassword(password, user?.passwordHash ?? UNKNOWN_USER_HASH);
        if (!user || !user.active || !ok) {
          recordFailure(email, address);
          recordAudit({
            actor: user ? { id: user.id, email: user.email } : null,
            action: "sign-in.failed",
            targetType: "user",
            targetId: email,
            detail: `from ${address}`,
          });
          throw new Error(WRONG_CREDENTIALS);
        }
        clearFailures(email);
        recordAudit({
          actor: user,
          action: "sign-in",
          targetType: "user",
          targetId: user.id,
          detail: `from ${address}`,
        });
        return {
          id: String(user.id),
          email: user.email,
          name: user.name,
          role: user.role,
          accountId: user.accountId,
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  callbacks: {
    // next-auth's default accepts any url starting with "/", which a browser may read as another
    // host ("/\evil.example"); only paths that stay on our origin are kept.
    async redirect({ url, baseUrl }) {
      const path = sameOriginPath(url, baseUrl);
      return path ? `${baseUrl}${path}` : baseUrl;
    },
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = user.role;
        token.accountId = user.accountId ?? null;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    async session({ session, token }) {
      session.user = {
        id: token.uid as number,
        email: token.email ?? "",
        name: token.name ?? "",
        role: token.role!,
        accountId: token.accountId ?? null,
        // getSessionUser compares it with the user's current version on every request.
        sessionVersion: typeof token.sv === "number" ? token.sv : null,
      };
      return session;
    },
  },
  events: {
    // Signing out ends the session on the server too: a copy of the token saved before stops
    // working (OWASP ASVS 3.3.1), not only the cookie in this browser.
    async signOut({ token }) {
      if (typeof token?.uid === "number") revokeSessions(token.uid);
    },
  },
};
