/** The four roles by what each person does (keys as ROLES of db/schema/users). */
export type RoleKey = "engineer" | "manager" | "reviewer" | "admin";

export const ROLE_LABELS: Record<RoleKey, string> = {
  engineer: "Application engineer",
  manager: "Sales manager",
  reviewer: "Finance reviewer",
  admin: "Administrator",
};
