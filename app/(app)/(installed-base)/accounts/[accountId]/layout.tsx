import type { ReactNode } from "react";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The scope check sits in the layout, outside the page's loading boundary, so an account the
// caller may not see answers a real 404 — the same as an id that does not exist.
export default async function AccountLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ accountId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).accountId);
  orNotFound(() => getAccountOrThrow(user, id));
  return children;
}
