import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { listParamsSchema } from "@/lib/lists/list-params";

// An account's name ends up in page titles, mail and the audit log: line breaks and other
// control characters become single spaces, like a person's name (./display-name.ts).
export const accountNameField = z
  .string({ error: "Enter the account name" })
  .transform((value) =>
    value
      .replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ")
      .replace(/ {2,}/g, " ")
      .trim(),
  )
  .pipe(
    z
      .string()
      .min(1, "Enter the account name")
      .max(120, "Keep the account name under 120 characters"),
  );

// An empty choice in a <select> arrives as "": no choice, not a bad id.
const optionalId = (message: string) =>
  z.preprocess((v) => (v === "" || v == null ? undefined : v), idSchema(message).optional());

// Engineers always own what they create; managers and administrators name the owner, which the
// query checks (it knows the caller's role).
export const OWNER_REQUIRED = "Owner: choose the engineer who owns the account.";

export const createAccountSchema = z.object({
  name: accountNameField,
  ownerId: optionalId(OWNER_REQUIRED),
});

// The form's version: a manager's or an administrator's form asks for the owner before sending.
export function createAccountSchemaFor(needsOwner: boolean) {
  return createAccountSchema.superRefine((value, ctx) => {
    if (needsOwner && value.ownerId === undefined)
      ctx.addIssue({ code: "custom", path: ["ownerId"], message: OWNER_REQUIRED });
  });
}

export const renameAccountSchema = z.object({
  accountId: idSchema(),
  name: accountNameField,
});

export const shareAccountSchema = z.object({
  accountId: idSchema(),
  userId: idSchema("Choose an engineer to share with"),
});

export const reassignOwnerSchema = z.object({
  accountId: idSchema(),
  ownerId: idSchema("Choose the new owner"),
  keepPreviousOwner: z.preprocess(
    (v) => (v === "true" || v === "on" ? true : v === "false" || v == null ? false : v),
    z.boolean({ error: "must be yes or no" }),
  ),
});

export const accountIdSchema = z.object({ accountId: idSchema() });

export const ACCOUNT_SORTS = ["name", "owner", "created"] as const;
export type AccountSort = (typeof ACCOUNT_SORTS)[number];

// The accounts list's URL state: the shared list kit plus "show archived".
export const accountListParamsSchema = listParamsSchema(ACCOUNT_SORTS, { sort: "name" }).extend({
  archived: z.enum(["show"]).optional().catch(undefined),
});

export type CreateAccountInput = z.infer<typeof createAccountSchema>;
export type CreateAccountFormValues = z.input<typeof createAccountSchema>;
export type RenameAccountInput = z.infer<typeof renameAccountSchema>;
export type ReassignOwnerInput = z.infer<typeof reassignOwnerSchema>;
export type AccountListParams = z.infer<typeof accountListParamsSchema>;
