import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";

// The reviewer's first password, chosen on the invitation page (same rule as createUserSchema).
export const setPasswordSchema = z
  .object({
    password: z
      .string()
      .min(10, "Use at least 10 characters")
      .max(200, "Use at most 200 characters"),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, {
    path: ["confirm"],
    message: "The two passwords differ",
  });

export type SetPasswordInput = z.infer<typeof setPasswordSchema>;

// An administrator's resend or revoke names the invited user; nothing else is sent.
export const invitationUserSchema = z.object({
  userId: idSchema("Choose the invited user"),
});
