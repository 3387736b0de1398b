import type { Role } from "@/lib/auth/roles";
import type { NavItem } from "./nav-links";

// Each role sees only the sections it may use; later sections join these lists as they ship.
export function navItemsFor(role: Role): NavItem[] {
  switch (role) {
    case "admin":
      return [
        { href: "/admin", label: "Users and audit" },
        { href: "/admin/sales", label: "Sales settings" },
        { href: "/admin/outbox", label: "Outbox" },
        { href: "/accounts", label: "Accounts" },
        { href: "/catalogue", label: "Catalogue" },
        { href: "/admin/payments", label: "Dossier price and payments" },
      ];
    case "reviewer":
      return [{ href: "/review", label: "Proposals for review" }];
    default:
      return [
        { href: "/accounts", label: "Accounts" },
        { href: "/cases", label: "Cases" },
        { href: "/pipeline", label: "Pipeline" },
        { href: "/catalogue", label: "Catalogue" },
      ];
  }
}
