import type { ReactNode } from "react";
import { getVisibleQuoteOrThrow } from "@/db/queries/proposals";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";

// A proposal not sent to the reviewer's own account answers a real 404, like a missing one.
export default async function ReviewProposalLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ proposalId: string }>;
}) {
  const user = await requirePageUser("reviewer");
  const id = idParam((await params).proposalId);
  orNotFound(() => getVisibleQuoteOrThrow(user, id));
  return children;
}
