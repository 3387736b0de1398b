"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { createCaseAction } from "@/server/cases/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { createCaseSchema, type CreateCaseInput } from "@/lib/validations/case";

export function NewCaseForm({
  sites,
}: {
  sites: { id: number; name: string; accountName: string }[];
}) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof createCaseSchema>, unknown, CreateCaseInput>({
    resolver: zodResolver(createCaseSchema),
    defaultValues: { name: "", siteId: sites[0]?.id },
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(values: CreateCaseInput) {
    const result = await createCaseAction(values);
    if (apply(result, "Case created.") && result.ok) router.push(`/cases/${result.data.id}`);
  }

  return (
    <form
      aria-label="New case"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="grid gap-4 md:grid-cols-3"
    >
      <Field id="case-name" label="Case name" error={errors.name?.message}>
        <Input id="case-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field
        id="case-site"
        label="Site"
        hint="The axes are picked from this site"
        error={errors.siteId?.message}
      >
        <Select id="case-site" {...register("siteId")}>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.accountName} — {s.name}
            </option>
          ))}
        </Select>
      </Field>
      <div className="flex items-end gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create case"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
