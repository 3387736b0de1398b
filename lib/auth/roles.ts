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

export const ROLE_LABELS: Record<Role, string> = {
  engineer: "Application engineer",
  manager: "Sales manager",
  reviewer: "Finance reviewer",
  admin: "Administrator",
};
