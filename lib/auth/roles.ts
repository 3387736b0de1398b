export const ROLES = ["engineer", "manager", "reviewer", "admin"] as const;
export type Role = (typeof ROLES)[number];

// The vendor's own staff: everyone but the customer's finance reviewer. One list, used wherever
// a rule admits "the vendor side" (pipeline, proposals, checkout, the sales pages).
export const VENDOR_ROLES = ["engineer", "manager", "admin"] as const satisfies readonly Role[];
export type VendorRole = (typeof VENDOR_ROLES)[number];

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
