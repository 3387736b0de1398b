import "server-only";
import { getServerSession } from "next-auth";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { findSessionUser } from "@/db/queries/users";
import { ForbiddenError, UnauthorizedError } from "@/lib/errors";
import { authOptions } from "./options";
import type { Role } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";

export type { SessionUser };

// The signed-in caller as the database has them now, or null. A token issued before the user's
// current session version (signed out, deactivated, role changed, password set) counts as none.
// React's cache makes it one lookup per page render: the layout and the page share the same
// caller object, so reads keyed on it (app/(app)/cases/[caseId]/case-reads.ts) are shared too.
export const getSessionUser = cache(async function getSessionUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  const version = session?.user?.sessionVersion;
  if (!id || typeof version !== "number") return null;
  return findSessionUser(id, version) ?? null;
});

// For route handlers and server actions: throws typed errors that map to 401 / 403.
export async function requireUser(): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) throw new UnauthorizedError();
  return user;
}

export async function requireRole(...roles: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!roles.includes(user.role)) throw new ForbiddenError();
  return user;
}

// For pages: the signed-out go to the sign-in page; a page outside the caller's role does not
// exist for them (not-found, so its existence is not confirmed).
export async function requirePageUser(...roles: Role[]): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  if (roles.length && !roles.includes(user.role)) notFound();
  return user;
}
