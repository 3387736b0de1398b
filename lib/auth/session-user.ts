import { ForbiddenError } from "@/lib/errors";
import type { Role } from "./roles";

// The caller every query takes first: who they are, their role, and (reviewers) their account.
export type SessionUser = {
  id: number;
  email: string;
  name: string;
  role: Role;
  accountId: number | null;
};

export function assertRole(user: SessionUser, ...roles: Role[]) {
  if (!roles.includes(user.role)) throw new ForbiddenError();
}
