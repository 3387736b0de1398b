import type { Role } from "@/db/schema/users";

export type { Role };

// Where each role lands after signing in.
export function homeFor(role: Role): string {
  switch (role) {
    case "reviewer":
      return "/review";
    case "admin":
      return "/admin";
    default:
      return "/accounts";
  }
}

// The role names in words live in the glossary; re-exported for the existing importers.
export { ROLE_LABELS } from "@/lib/glossary";
