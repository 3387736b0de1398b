import { redirect } from "next/navigation";
import { getSessionUser } from "@/server/auth";
import { homeFor } from "@/lib/auth/roles";

// The root sends each role to its home.
export default async function Home() {
  const user = await getSessionUser();
  redirect(user ? homeFor(user.role) : "/sign-in");
}
