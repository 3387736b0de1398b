import type { Session } from "next-auth";
import type { JWT } from "next-auth/jwt";
import { describe, expect, it } from "vitest";
import {
  changeRole,
  findSessionUser,
  findUserForSignIn,
  sessionVersionOf,
  setUserActive,
} from "@/db/queries/users";
import { authOptions } from "@/server/auth/options";
import { caller } from "../support/callers";

// Finding: a token saved before sign-out kept working until it expired (8 hours). Each token now
// carries the user's session version, and getSessionUser accepts it only while it is current.
// These steps are next-auth's own: the jwt callback at sign-in, the session callback on each
// request, the signOut event; then the lookup getSessionUser makes.
const callbacks = authOptions.callbacks!;

async function issueToken(email: string): Promise<JWT> {
  const u = findUserForSignIn(email)!;
  const user = {
    id: String(u.id),
    email: u.email,
    name: u.name,
    role: u.role,
    accountId: u.accountId,
    sessionVersion: sessionVersionOf(u.id)!,
  };
  const jwt = callbacks.jwt as (p: { token: JWT; user?: typeof user }) => Promise<JWT>;
  return jwt({ token: { email: u.email, name: u.name }, user });
}

// What getSessionUser returns for a request carrying this token.
async function userOfRequestWith(token: JWT) {
  const session = callbacks.session as (p: { session: Session; token: JWT }) => Promise<Session>;
  const { user } = await session({ session: { expires: "" } as Session, token });
  return typeof user.sessionVersion === "number"
    ? findSessionUser(user.id, user.sessionVersion)
    : undefined;
}

async function signOut(token: JWT) {
  const event = authOptions.events!.signOut as (m: { token: JWT }) => Promise<void>;
  await event({ token });
}

describe("ending sessions on the server", () => {
  it("a token saved before sign-out no longer signs anyone in", async () => {
    const saved = await issueToken("engineer@example.com");
    expect((await userOfRequestWith(saved))?.email).toBe("engineer@example.com");
    await signOut(saved);
    expect(await userOfRequestWith(saved)).toBeUndefined();
    // Signing in again gives a token that works.
    expect((await userOfRequestWith(await issueToken("engineer@example.com")))?.email).toBe(
      "engineer@example.com",
    );
  });

  it("a deactivated user's saved token stops working, and reactivation does not revive it", async () => {
    const saved = await issueToken("engineer2@example.com");
    const target = caller("engineer2@example.com");
    setUserActive(caller("admin@example.com"), target.id, false);
    expect(await userOfRequestWith(saved)).toBeUndefined();
    setUserActive(caller("admin@example.com"), target.id, true);
    expect(await userOfRequestWith(saved)).toBeUndefined();
  });

  it("a user whose role changed must sign in again; their old token carries no role", async () => {
    const saved = await issueToken("manager@example.com");
    changeRole(caller("admin@example.com"), {
      userId: caller("manager@example.com").id,
      role: "engineer",
      accountId: null,
    });
    expect(await userOfRequestWith(saved)).toBeUndefined();
    expect((await userOfRequestWith(await issueToken("manager@example.com")))?.role).toBe(
      "engineer",
    );
  });

  it("a token from before session versions existed is refused", async () => {
    const saved = await issueToken("reviewer@example.com");
    delete saved.sv;
    expect(await userOfRequestWith(saved)).toBeUndefined();
  });
});
