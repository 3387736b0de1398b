import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Cases are the vendor's: reviewers get a real 404 (checked outside the pages' loading boundary).
export default async function CasesLayout({ children }: { children: ReactNode }) {
  await requirePageUser(...VENDOR_ROLES);
  return children;
}
