import type { ReactNode } from "react";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";

// The scope check sits in the layout, outside the page's loading boundary, so an account the
// caller may not see answers a real 404 — the same as an id that does not exist.
export default async function AccountLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ accountId: string }>;
}) {
  const user = await requirePageUser("engineer", "manager", "admin");
  const id = idParam((await params).accountId);
  orNotFound(() => getAccountOrThrow(user, id));
  return children;
}
