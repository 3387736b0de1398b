import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Checked in the layout, outside the page's loading boundary, so that other roles get a real 404.
export default async function CatalogueLayout({ children }: { children: ReactNode }) {
  await requirePageUser(...VENDOR_ROLES);
  return children;
}
