import type { ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { requirePageUser } from "@/server/auth";

// The vendor's shell: engineers, managers and administrators. Reviewers have their own portal.
export default async function VendorLayout({ children }: { children: ReactNode }) {
  const user = await requirePageUser("engineer", "manager", "admin");
  return <AppShell user={user}>{children}</AppShell>;
}
