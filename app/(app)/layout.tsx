import type { ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The vendor's shell: engineers, managers and administrators. Reviewers have their own portal.
export default async function VendorLayout({ children }: { children: ReactNode }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  return <AppShell user={user}>{children}</AppShell>;
}
