import type { SessionUser } from "@/lib/auth/session-user";

// Who may change what on an account the caller can already see (the scope itself is
// accountScope in db/queries/accounts.ts). Named once so that the account page shows exactly the
// controls the queries accept.
export function accountPermissions(caller: Pick<SessionUser, "id" | "role">, ownerId: number) {
  const leads = caller.role === "manager" || caller.role === "admin";
  const owns = caller.role === "engineer" && caller.id === ownerId;
  return {
    // The owner, the engineers it is shared with, managers and administrators.
    rename: caller.role !== "reviewer",
    // Sharing and archiving stay with the owner and the people who lead the sales team.
    share: leads || owns,
    archive: leads || owns,
    // Only managers and administrators hand an account to another engineer.
    reassign: leads,
  };
}

export type AccountPermissions = ReturnType<typeof accountPermissions>;
