import type { ReactNode } from "react";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The scope check sits in the layout, outside the page's loading boundary, so a site the caller
// may not see answers a real 404 — the same as an id that does not exist.
export default async function SiteLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ siteId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).siteId);
  orNotFound(() => getSiteOrThrow(user, id));
  return children;
}
