import { displayName } from "./display-name";
import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { ROLES } from "@/lib/auth/roles";

const roleField = z.enum(ROLES, { error: "Choose one of: engineer, manager, reviewer, admin" });

// A reviewer belongs to exactly one customer account; vendor staff belong to none.
const accountField = z.preprocess(
  (v) => (v === "" || v == null ? null : Number(v)),
  z.number({ error: "Choose an account" }).int().positive().nullable(),
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

export const userListParamsSchema = z.object({
  q: z.string().trim().max(100).optional().catch(undefined),
  role: roleField.optional().catch(undefined),
  sort: z.enum(USER_SORTS).optional().catch(undefined),
  dir: z.enum(["asc", "desc"]).optional().catch(undefined),
});

export type CreateUserInput = z.infer<typeof createUserSchema>;
export type CreateUserFormValues = z.input<typeof createUserSchema>;
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;
export type UserListParams = z.infer<typeof userListParamsSchema>;
