import type { ReactNode } from "react";
import { getCaseOrThrow } from "@/db/queries/cases";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";

// A case outside the caller's accounts answers a real 404, the same as a missing one.
export default async function CaseLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ caseId: string }>;
}) {
  const user = await requirePageUser("engineer", "manager", "admin");
  const id = idParam((await params).caseId);
  orNotFound(() => getCaseOrThrow(user, id));
  return children;
}
