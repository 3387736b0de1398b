"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { acceptInvitationAction } from "@/server/invitations/actions";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { setPasswordSchema, type SetPasswordInput } from "@/lib/validations/invitation";

/** The invited reviewer chooses a password once, and is signed in with it straight away. */
export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SetPasswordInput>({
    resolver: zodResolver(setPasswordSchema),
    defaultValues: { password: "", confirm: "" },
  });

  async function onSubmit(values: SetPasswordInput) {
    setMessage(null);
    const result = await acceptInvitationAction(token, values);
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.fieldErrors))
        if (field === "password" || field === "confirm") setError(field, { message: text });
      return setMessage(result.message);
    }
    const signedIn = await signIn("credentials", {
      email: result.data.email,
      password: values.password,
      redirect: false,
    });
    if (!signedIn || signedIn.error) {
      setMessage("Your password is set. Sign in with it to open the proposal.");
      return router.push("/sign-in");
    }
    window.location.assign(
      result.data.proposalId ? `/review/proposals/${result.data.proposalId}` : "/review",
    );
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      aria-label="Choose a password"
      className="space-y-4 rounded-panel border border-steel-200 bg-white p-6 shadow-panel"
    >
      <Field id="invite-email" label="E-mail">
        <Input id="invite-email" type="email" value={email} readOnly autoComplete="username" />
      </Field>
      <Field
        id="new-password"
        label="New password"
        hint="At least 10 characters."
        error={errors.password?.message}
      >
        <Input
          id="new-password"
          type="password"
          autoComplete="new-password"
          invalid={!!errors.password}
          {...register("password")}
        />
      </Field>
      <Field id="confirm-password" label="Repeat the password" error={errors.confirm?.message}>
        <Input
          id="confirm-password"
          type="password"
          autoComplete="new-password"
          invalid={!!errors.confirm}
          {...register("confirm")}
        />
      </Field>
      <p aria-live="polite" role="status" className="min-h-5 text-small font-bold text-danger-700">
        {message}
      </p>
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Set password and open the proposal"}
      </Button>
    </form>
  );
}
