import type { Role } from "../../lib/auth/roles";

export const DEMO_PASSWORD = "loopshift-demo";

// Invented demo users of the demo scenario (docs/product.md): one per role, plus a second engineer.
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: "admin@example.com", name: "Demo Administrator", role: "admin" },
  { email: "engineer@example.com", name: "Demo Engineer", role: "engineer" },
  { email: "engineer2@example.com", name: "Second Demo Engineer", role: "engineer" },
  { email: "manager@example.com", name: "Demo Sales Manager", role: "manager" },
  { email: "reviewer@example.com", name: "Demo Finance Reviewer", role: "reviewer" },
];
