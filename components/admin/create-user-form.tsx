"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { createUserAction } from "@/server/admin/actions";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { ROLE_LABELS } from "@/lib/auth/roles";
import {
  createUserSchema,
  type CreateUserFormValues,
  type CreateUserInput,
} from "@/lib/validations/user";
import { ROLES } from "@/lib/auth/roles";

type Option = { id: number; name: string };

export function CreateUserForm({ accounts }: { accounts: Option[] }) {
  const [status, setStatus] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting },
  } = useForm<CreateUserFormValues, unknown, CreateUserInput>({
    resolver: zodResolver(createUserSchema),
    defaultValues: { email: "", name: "", role: "engineer", accountId: "", password: "" },
  });
  const role = useWatch({ control, name: "role" });

  async function onSubmit(values: CreateUserInput) {
    setStatus(null);
    const result = await createUserAction(values);
    if (result.ok) {
      setStatus({ tone: "ok", text: `Created ${values.email}.` });
      reset();
      return;
    }
    for (const [field, message] of Object.entries(result.fieldErrors)) {
      setError(field as keyof CreateUserFormValues, { message });
    }
    setStatus({ tone: "error", text: result.message });
  }

  return (
    <form
      aria-label="Add a user"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="grid gap-4 md:grid-cols-2"
    >
      <Field id="new-name" label="Name" error={errors.name?.message}>
        <Input id="new-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field id="new-email" label="E-mail" error={errors.email?.message}>
        <Input id="new-email" type="email" invalid={!!errors.email} {...register("email")} />
      </Field>
      <Field id="new-role" label="Role" error={errors.role?.message}>
        <Select id="new-role" invalid={!!errors.role} {...register("role")}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </Select>
      </Field>
      <Field
        id="new-account"
        label="Customer account (reviewers only)"
        error={errors.accountId?.message}
      >
        <Select
          id="new-account"
          disabled={role !== "reviewer"}
          invalid={!!errors.accountId}
          {...register("accountId")}
        >
          <option value="">—</option>
          {accounts.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field
        id="new-password"
        label="Initial password"
        hint="At least 10 characters; share it privately."
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
      <div className="flex items-end gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create user"}
        </Button>
        <p
          aria-live="polite"
          role="status"
          className={`text-small font-bold ${status?.tone === "ok" ? "text-success-700" : "text-danger-700"}`}
        >
          {status?.text}
        </p>
      </div>
    </form>
  );
}
