"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { duplicateMachineAction } from "@/server/installed-base/delete-actions";
import {
  duplicateMachineSchema,
  type DuplicateMachineInput,
} from "@/lib/validations/installed-base";
import { StatusLine, useActionStatus } from "./use-action-form";

// Machines come in series: a copy with all its axes under a new name. Asset tags are not copied,
// because they identify the physical units of the original.
export function DuplicateMachineForm({ machineId, name }: { machineId: number; name: string }) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<DuplicateMachineInput>({
    resolver: zodResolver(duplicateMachineSchema),
    defaultValues: { name: "" },
  });
  const { status, apply, onInvalid } = useActionStatus(setError);

  async function onSubmit(values: DuplicateMachineInput) {
    const result = await duplicateMachineAction(machineId, values);
    // A name the site has already is about the name field: show it there too.
    if (!result.ok && Object.keys(result.fieldErrors).length === 0)
      setError("name", { message: result.message });
    if (apply(result, `Copied ${name} as ${values.name}.`) && result.ok)
      router.push(`/machines/${result.data.id}`);
  }

  return (
    <form
      aria-label={`Duplicate ${name}`}
      onSubmit={handleSubmit(onSubmit, onInvalid)}
      noValidate
      className="grid gap-4 md:grid-cols-[minmax(0,20rem)_auto] md:items-end"
    >
      <Field
        id="duplicate-name"
        label="New machine name"
        hint="Copies the machine's figures and all its axes. Asset tags are left empty: they identify physical units."
        error={errors.name?.message}
      >
        <Input id="duplicate-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <div className="flex items-end gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Copying…" : "Duplicate machine"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
