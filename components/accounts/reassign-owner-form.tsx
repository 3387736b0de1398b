"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { reassignOwnerAction } from "@/server/accounts/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Select } from "@/components/ui/field";
import { reassignOwnerSchema, type ReassignOwnerInput } from "@/lib/validations/account";

// Managers and administrators hand the account to another engineer. The previous owner loses
// access unless they are kept on the share list.
export function ReassignOwnerForm({
  accountId,
  ownerName,
  candidates,
}: {
  accountId: number;
  ownerName: string;
  candidates: { id: number; name: string }[];
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof reassignOwnerSchema>, unknown, ReassignOwnerInput>({
    resolver: zodResolver(reassignOwnerSchema),
    defaultValues: { accountId, ownerId: "", keepPreviousOwner: false },
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(values: ReassignOwnerInput) {
    const name = candidates.find((c) => c.id === values.ownerId)?.name ?? "the engineer";
    if (apply(await reassignOwnerAction(values), `${name} now owns the account.`))
      reset({ accountId, ownerId: "", keepPreviousOwner: false });
  }

  return (
    <form
      aria-label="Reassign owner"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-3"
    >
      <div className="flex flex-wrap items-end gap-3">
        <div className="w-full max-w-xs">
          <Field id="reassign-owner" label="New owner" error={errors.ownerId?.message}>
            <Select id="reassign-owner" invalid={!!errors.ownerId} {...register("ownerId")}>
              <option value="">Choose an engineer</option>
              {candidates.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
            </Select>
          </Field>
        </div>
        <Button type="submit" variant="secondary" disabled={isSubmitting}>
          Reassign owner
        </Button>
      </div>
      <label className="flex items-center gap-2 text-small">
        <input type="checkbox" {...register("keepPreviousOwner")} />
        Keep {ownerName} on the share list
      </label>
      <StatusLine status={status} />
    </form>
  );
}
