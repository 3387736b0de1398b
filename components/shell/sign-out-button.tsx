"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/sign-in" })}
      className="w-full rounded-md border border-flux-600 px-3 py-1.5 text-small font-bold text-flux-50 hover:bg-flux-800"
    >
      Sign out
    </button>
  );
}
