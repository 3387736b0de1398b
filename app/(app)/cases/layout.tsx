import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";

// Cases are the vendor's: reviewers get a real 404 (checked outside the pages' loading boundary).
export default async function CasesLayout({ children }: { children: ReactNode }) {
  await requirePageUser("engineer", "manager", "admin");
  return children;
}
