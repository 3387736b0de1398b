"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { saveSalesSettingsAction } from "@/server/admin/actions";
import { Field, Input } from "@/components/ui/field";
import { QUOTE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import { salesSettingsSchema, type SalesSettingsInput } from "@/lib/validations/pipeline";
import { SubmitRow, type FormMessage } from "@/components/ui/submit-row";

/** The discount threshold and the chance of closing per stage, which weight the pipeline. */
export function SalesSettingsForm({ values }: { values: SalesSettingsInput }) {
  const [message, setMessage] = useState<FormMessage>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(salesSettingsSchema), defaultValues: values });

  async function onSubmit(data: SalesSettingsInput) {
    const result = await saveSalesSettingsAction(data);
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.fieldErrors))
        setError(field as keyof SalesSettingsInput, { message: text });
      return setMessage({ tone: "error", text: result.message });
    }
    setMessage({ tone: "ok", text: "Saved. The pipeline uses the new figures now." });
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      aria-label="Sales settings"
      className="space-y-6"
    >
      <Field
        id="discountThresholdPct"
        label="Largest kit discount without approval [%]"
        hint="A proposal whose kit discount is above this needs a sales manager's approval before it is sent."
        error={errors.discountThresholdPct?.message}
      >
        <Input
          id="discountThresholdPct"
          type="text"
          inputMode="decimal"
          className="w-40"
          invalid={!!errors.discountThresholdPct}
          {...register("discountThresholdPct")}
        />
      </Field>
      <fieldset>
        <legend className="text-small font-bold text-steel-800">
          Chance of closing per stage [%]
        </legend>
        <p className="mb-3 text-caption text-steel-600">
          The weighted value of a quote is its value times this chance. Start from your own win
          history; the first figures are rough estimates.
        </p>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {QUOTE_STAGES.map((stage) => (
            <Field
              key={stage}
              id={`p-${stage}`}
              label={STAGE_LABELS[stage]}
              error={errors.stageProbabilities?.[stage]?.message}
            >
              <Input
                id={`p-${stage}`}
                type="text"
                inputMode="decimal"
                invalid={!!errors.stageProbabilities?.[stage]}
                {...register(`stageProbabilities.${stage}`)}
              />
            </Field>
          ))}
        </div>
      </fieldset>
      <SubmitRow label="Save sales settings" pending={isSubmitting} message={message} />
    </form>
  );
}
