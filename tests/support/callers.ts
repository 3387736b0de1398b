import { findUserForSignIn } from "@/db/queries/users";
import type { SessionUser } from "@/lib/auth/session-user";

// The seeded demo user with this e-mail, as the caller that queries take.
export function caller(email: string): SessionUser {
  const u = findUserForSignIn(email);
  if (!u) throw new Error(`no seeded user ${email}`);
  return { id: u.id, email: u.email, name: u.name, role: u.role, accountId: u.accountId };
}
