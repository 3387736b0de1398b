"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { sameOriginPath } from "@/lib/auth/callback-url";
import { signInSchema, type SignInInput } from "@/lib/validations/sign-in";

type DemoUser = { email: string; label: string; password: string };

export function SignInForm({
  callbackUrl,
  demoUsers,
}: {
  callbackUrl?: string;
  demoUsers: DemoUser[];
}) {
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: "", password: "" },
  });

  async function onSubmit(values: SignInInput) {
    setMessage(null);
    const result = await signIn("credentials", { ...values, redirect: false });
    if (!result || result.error) {
      setMessage(
        result?.error && result.error !== "CredentialsSignin"
          ? result.error
          : "Sign-in failed. Try again.",
      );
      return;
    }
    // The root page sends each role to its own home. The page checked the callback already; it is
    // checked again against the origin the browser is on, as the last step before navigating.
    window.location.assign(sameOriginPath(callbackUrl, window.location.origin) ?? "/");
  }

  return (
    <div className="space-y-8">
      <form
        onSubmit={handleSubmit(onSubmit)}
        noValidate
        className="space-y-4 rounded-panel border border-steel-200 bg-white p-6 shadow-panel"
      >
        <Field id="email" label="E-mail" error={errors.email?.message}>
          <Input
            id="email"
            type="email"
            autoComplete="username"
            invalid={!!errors.email}
            {...register("email")}
          />
        </Field>
        <Field id="password" label="Password" error={errors.password?.message}>
          <Input
            id="password"
            type="password"
            autoComplete="current-password"
            invalid={!!errors.password}
            {...register("password")}
          />
        </Field>
        <p
          aria-live="polite"
          role="status"
          className="min-h-5 text-small font-bold text-danger-700"
        >
          {message}
        </p>
        <Button type="submit" className="w-full" disabled={isSubmitting}>
          {isSubmitting ? "Signing in…" : "Sign in"}
        </Button>
      </form>

      {demoUsers.length ? (
        <section
          aria-labelledby="demo-users"
          className="rounded-panel border border-flux-200 bg-flux-50 p-4"
        >
          <h2 id="demo-users" className="text-body font-bold text-flux-900">
            Demo users
          </h2>
          <p className="text-small text-flux-800">
            Password for all: <code className="font-mono">{demoUsers[0].password}</code>. Choose one
            to fill the form.
          </p>
          <ul className="mt-3 grid gap-2 sm:grid-cols-2">
            {demoUsers.map((u) => (
              <li key={u.email}>
                <button
                  type="button"
                  onClick={() => {
                    setValue("email", u.email, { shouldValidate: true });
                    setValue("password", u.password, { shouldValidate: true });
                  }}
                  className="w-full rounded-md border border-flux-200 bg-white px-3 py-2 text-left hover:border-flux-500"
                >
                  <span className="block text-small font-bold text-steel-900">{u.label}</span>
                  <span className="block break-all text-caption text-steel-700">{u.email}</span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
