import type { ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { requirePageUser } from "@/server/auth";

// The customer's finance reviewer sees only their own account's proposals.
export default async function ReviewLayout({ children }: { children: ReactNode }) {
  const user = await requirePageUser("reviewer");
  const account = user.accountId ? getAccountOrThrow(user, user.accountId) : null;
  return (
    <AppShell
      user={user}
      context={account ? `Reviewing for ${account.name}` : undefined}
      paymentsBanner={false}
    >
      {children}
    </AppShell>
  );
}
