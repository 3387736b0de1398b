import type { ReactNode } from "react";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { requirePageUser } from "@/server/auth";
import { idParam } from "@/lib/pages";
import { readCase } from "./case-reads";

// A case outside the caller's accounts answers a real 404, the same as a missing one.
export default async function CaseLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ caseId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  readCase(user, idParam((await params).caseId));
  return children;
}
