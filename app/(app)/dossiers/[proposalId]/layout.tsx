import type { ReactNode } from "react";
import { getProposalOrThrow } from "@/db/queries/proposal-versions";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// A proposal outside the caller's accounts answers a real 404, the same as a missing one.
export default async function DossierLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).proposalId);
  orNotFound(() => getProposalOrThrow(user, id));
  return children;
}
