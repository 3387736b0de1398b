"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { saveDossierSettingsAction } from "@/server/dossiers/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { NumberField } from "@/components/ui/number-field";
import {
  MAX_SEED,
  uncertaintySettingsSchema,
  type UncertaintySettings,
  type UncertaintySettingsInput,
} from "@/lib/validations/dossier";

const DRIVERS = [
  ["tariff", "Electricity tariff", "Contract renewals, market prices"],
  ["hoursPerYear", "Running hours per year", "Shifts added or dropped"],
  ["loadTorque", "Load torque, all axes", "Product and tooling changes"],
  ["stepLossEvents", "Step-loss events", "How often an axis loses step today"],
] as const;

/** The ranges the draws take and the seed that makes them repeatable. */
export function UncertaintyForm({
  proposalId,
  values,
}: {
  proposalId: number;
  values: UncertaintySettings;
}) {
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<UncertaintySettingsInput, unknown, UncertaintySettings>({
    resolver: zodResolver(uncertaintySettingsSchema),
    defaultValues: values,
  });
  const { status, apply } = useActionStatus(setError);

  async function onSubmit(data: UncertaintySettings) {
    const result = await saveDossierSettingsAction(proposalId, data);
    // The action revalidates the dossier page, which then renders with the new ranges.
    apply(result, "Saved. The dossier is rebuilt with these ranges and this seed.");
  }

  return (
    <form
      aria-label="Uncertainty ranges"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-4"
    >
      <p className="text-small text-steel-700">
        Each of the 1,000 draws changes these four drivers together, each uniformly within its
        range, in % of the case&apos;s own value. The default ranges are estimates: replace them
        with what you know of the customer&apos;s site.
      </p>
      <div className="grid gap-4 md:grid-cols-2">
        {DRIVERS.map(([key, label, hint]) => (
          <fieldset
            key={key}
            className="grid grid-cols-2 gap-3 rounded-md border border-steel-200 p-3"
          >
            <legend className="px-1 font-bold text-flux-900">{label}</legend>
            <NumberField
              register={register}
              name={`${key}.lowPct`}
              label="Low"
              unit="%"
              hint={hint}
              error={errors[key]?.lowPct?.message ?? errors[key]?.message}
            />
            <NumberField
              register={register}
              name={`${key}.highPct`}
              label="High"
              unit="%"
              error={errors[key]?.highPct?.message}
            />
          </fieldset>
        ))}
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <div className="w-56">
          <NumberField
            register={register}
            name="seed"
            label="Seed"
            step="1"
            hint="Recorded in the dossier; the same seed rebuilds the same draws"
            error={errors.seed?.message}
          />
        </div>
        <Button
          variant="secondary"
          onClick={() =>
            setValue("seed", Math.floor(Math.random() * MAX_SEED), { shouldDirty: true })
          }
        >
          New seed
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save and rebuild"}
        </Button>
      </div>
      <StatusLine status={status} />
    </form>
  );
}
