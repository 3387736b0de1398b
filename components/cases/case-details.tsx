"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { duplicateCaseAction, updateCaseDetailsAction } from "@/server/cases/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import {
  CASE_NOTES_MAX,
  caseDetailsSchema,
  duplicateCaseSchema,
  type CaseDetailsInput,
  type DuplicateCaseInput,
} from "@/lib/validations/case";

// The case's notes, the form that edits its name and notes, and the one that copies it.
export function CaseDetails({
  caseId,
  name,
  notes,
}: {
  caseId: number;
  name: string;
  notes: string | null;
}) {
  return (
    <div className="space-y-4">
      {notes ? (
        <p className="whitespace-pre-wrap text-body text-steel-900">{notes}</p>
      ) : (
        <p className="text-small text-steel-700">No notes yet.</p>
      )}
      <details>
        <summary className="cursor-pointer font-bold text-flux-700">Edit name and notes</summary>
        <DetailsForm caseId={caseId} name={name} notes={notes} />
      </details>
      <details>
        <summary className="cursor-pointer font-bold text-flux-700">Duplicate this case</summary>
        {/* Remounted on a rename, so that the copy's suggested name follows it. */}
        <DuplicateForm key={name} caseId={caseId} name={name} />
      </details>
    </div>
  );
}

function DetailsForm({
  caseId,
  name,
  notes,
}: {
  caseId: number;
  name: string;
  notes: string | null;
}) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof caseDetailsSchema>, unknown, CaseDetailsInput>({
    resolver: zodResolver(caseDetailsSchema),
    defaultValues: { name, notes: notes ?? "" },
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(values: CaseDetailsInput) {
    const result = await updateCaseDetailsAction(caseId, values);
    if (apply(result, "Name and notes saved.")) router.refresh();
  }

  return (
    <form
      aria-label="Name and notes"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="mt-3 space-y-3"
    >
      <Field id="case-edit-name" label="Case name" error={errors.name?.message}>
        <Input id="case-edit-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field
        id="case-edit-notes"
        label="Notes"
        hint={`Up to ${CASE_NOTES_MAX.toLocaleString("en")} characters`}
        error={errors.notes?.message}
      >
        <textarea
          id="case-edit-notes"
          rows={4}
          aria-invalid={!!errors.notes || undefined}
          aria-describedby={errors.notes ? "case-edit-notes-error" : "case-edit-notes-hint"}
          className="block w-full rounded-md border border-steel-300 bg-white px-3 py-2 text-body aria-[invalid=true]:border-danger-600"
          {...register("notes")}
        />
      </Field>
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save name and notes"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}

function DuplicateForm({ caseId, name }: { caseId: number; name: string }) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof duplicateCaseSchema>, unknown, DuplicateCaseInput>({
    resolver: zodResolver(duplicateCaseSchema),
    defaultValues: { name: `${name} (copy)`.slice(0, 120) },
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(values: DuplicateCaseInput) {
    const result = await duplicateCaseAction(caseId, values);
    if (apply(result, "Case duplicated.") && result.ok) router.push(`/cases/${result.data.id}`);
  }

  return (
    <form
      aria-label="Duplicate case"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="mt-3 space-y-3"
    >
      <p className="text-small text-steel-700">
        The copy gets this case&rsquo;s site, assumptions, notes, axes and their kits and terms. It
        starts as a draft owned by you, without proposals or quotes.
      </p>
      <Field id="case-copy-name" label="Name of the copy" error={errors.name?.message}>
        <Input id="case-copy-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Duplicating…" : "Duplicate case"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
