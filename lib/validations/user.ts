import { displayName } from "./display-name";
import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { ROLES } from "@/lib/auth/roles";
import { listParamsSchema } from "@/lib/lists/list-params";

const roleField = z.enum(ROLES, { error: "Choose one of: engineer, manager, reviewer, admin" });

// A reviewer belongs to exactly one customer account; vendor staff belong to none.
const accountField = z.preprocess(
  (v) => (v === "" || v == null ? null : Number(v)),
  z
    .number({ error: "Choose an account" })
    .int("Choose an account")
    .positive("Choose an account")
    .nullable(),
);

function requireAccountForReviewer(
  value: { role: string; accountId: number | null },
  ctx: z.RefinementCtx,
) {
  if (value.role === "reviewer" && value.accountId == null) {
    ctx.addIssue({
      code: "custom",
      path: ["accountId"],
      message: "A reviewer must belong to a customer account",
    });
  }
}

export const createUserSchema = z
  .object({
    email: z.string().trim().toLowerCase().email("Enter a valid e-mail address"),
    name: displayName("Enter a name"),
    role: roleField,
    accountId: accountField,
    password: z
      .string()
      .min(10, "Use at least 10 characters")
      .max(200, "Use at most 200 characters"),
  })
  .superRefine(requireAccountForReviewer);

export const changeRoleSchema = z
  .object({
    userId: idSchema(),
    role: roleField,
    accountId: accountField,
  })
  .superRefine(requireAccountForReviewer);

export const setActiveSchema = z.object({
  userId: idSchema(),
  // Only a yes or a no: anything else used to read as "deactivate", a write nobody asked for.
  active: z.preprocess(
    (v) => (v === "true" ? true : v === "false" ? false : v),
    z.boolean({ error: "must be true or false" }),
  ),
});

export const USER_SORTS = ["name", "email", "role", "createdAt"] as const;

// Invited: came in by invitation and has not chosen a password yet (see awaitsFirstPassword in
// db/queries/invitations.ts); active: may sign in; inactive: deactivated by an administrator.
export const USER_STATUSES = ["invited", "active", "inactive"] as const;
export type UserStatus = (typeof USER_STATUSES)[number];

export const userListParamsSchema = listParamsSchema(USER_SORTS, { sort: "name" }).extend({
  role: roleField.optional().catch(undefined),
  status: z.enum(USER_STATUSES).optional().catch(undefined),
});

export type CreateUserInput = z.infer<typeof createUserSchema>;
export type CreateUserFormValues = z.input<typeof createUserSchema>;
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;
export type UserListParams = z.infer<typeof userListParamsSchema>;
// What a caller passes: every part may be left out and takes the list's default.
export type UserListQuery = Partial<UserListParams>;
