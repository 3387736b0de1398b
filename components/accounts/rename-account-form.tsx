"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { renameAccountAction } from "@/server/accounts/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { renameAccountSchema, type RenameAccountInput } from "@/lib/validations/account";

export function RenameAccountForm({ accountId, name }: { accountId: number; name: string }) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof renameAccountSchema>, unknown, RenameAccountInput>({
    resolver: zodResolver(renameAccountSchema),
    defaultValues: { accountId, name },
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(values: RenameAccountInput) {
    apply(await renameAccountAction(values), "Name saved.");
  }

  return (
    <form
      aria-label="Rename account"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="flex flex-wrap items-end gap-3"
    >
      <div className="w-full max-w-sm">
        <Field id="account-name" label="Account name" error={errors.name?.message}>
          <Input id="account-name" invalid={!!errors.name} {...register("name")} />
        </Field>
      </div>
      <Button type="submit" variant="secondary" disabled={isSubmitting}>
        Save name
      </Button>
      <StatusLine status={status} />
    </form>
  );
}
