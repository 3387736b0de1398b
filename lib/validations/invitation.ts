import { z } from "zod";

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
