import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The installed base is the vendor's: reviewers get a real 404 here (checked in the layout,
// outside the pages' loading boundaries). Each query checks the account scope again.
export default async function InstalledBaseLayout({ children }: { children: ReactNode }) {
  await requirePageUser(...VENDOR_ROLES);
  return children;
}
