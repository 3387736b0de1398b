"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useId, useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { createAccountAction } from "@/server/accounts/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import {
  createAccountSchemaFor,
  type CreateAccountFormValues,
  type CreateAccountInput,
} from "@/lib/validations/account";

// "New account" opens the form in place. An engineer becomes the owner of what they create;
// managers and administrators (who get `owners`) choose the owning engineer.
export function NewAccountForm({ owners }: { owners: { id: number; name: string }[] | null }) {
  const router = useRouter();
  const formId = useId();
  const [open, setOpen] = useState(false);
  const schema = useMemo(() => createAccountSchemaFor(owners !== null), [owners]);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<CreateAccountFormValues, unknown, CreateAccountInput>({
    resolver: zodResolver(schema),
    defaultValues: { name: "", ownerId: "" },
  });
  const { status, setStatus, apply } = useActionStatus(setError);

  async function onSubmit(values: CreateAccountInput) {
    const result = await createAccountAction(values);
    if (apply(result, `Created ${values.name}.`) && result.ok)
      router.push(`/accounts/${result.data.id}`);
  }

  if (!open)
    return (
      <div>
        <Button aria-expanded={false} aria-controls={formId} onClick={() => setOpen(true)}>
          New account
        </Button>
      </div>
    );

  return (
    <form
      id={formId}
      aria-label="New account"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="grid gap-4 rounded-panel border border-steel-200 bg-white p-5 shadow-panel md:grid-cols-3"
    >
      <Field id="new-account-name" label="Account name" error={errors.name?.message}>
        <Input id="new-account-name" autoFocus invalid={!!errors.name} {...register("name")} />
      </Field>
      {owners ? (
        <Field
          id="new-account-owner"
          label="Owner"
          hint="The engineer who will own the account"
          error={errors.ownerId?.message}
        >
          <Select id="new-account-owner" invalid={!!errors.ownerId} {...register("ownerId")}>
            <option value="">Choose an engineer</option>
            {owners.map((o) => (
              <option key={o.id} value={o.id}>
                {o.name}
              </option>
            ))}
          </Select>
        </Field>
      ) : null}
      <div className="flex flex-wrap items-end gap-3 md:col-span-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create account"}
        </Button>
        <Button
          variant="secondary"
          onClick={() => {
            reset();
            setStatus(null);
            setOpen(false);
          }}
        >
          Cancel
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
