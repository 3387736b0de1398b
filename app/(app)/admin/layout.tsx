import type { ReactNode } from "react";
import { requirePageUser } from "@/server/auth";

// Checked in the layout, outside the page's loading boundary, so that other roles get a real 404.
export default async function AdminLayout({ children }: { children: ReactNode }) {
  await requirePageUser("admin");
  return children;
}
