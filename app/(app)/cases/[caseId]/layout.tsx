import type { ReactNode } from "react";
import { getCaseOrThrow } from "@/db/queries/cases";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// A case outside the caller's accounts answers a real 404, the same as a missing one.
export default async function CaseLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ caseId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).caseId);
  orNotFound(() => getCaseOrThrow(user, id));
  return children;
}
