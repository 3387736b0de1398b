import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";

// Managers steer every quote, engineers follow their own; others get a real 404.
export default async function PipelineLayout({ children }: { children: ReactNode }) {
  await requirePageUser("manager", "engineer");
  return children;
}
