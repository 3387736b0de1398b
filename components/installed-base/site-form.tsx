"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { createSiteAction, updateSiteAction } from "@/server/installed-base/actions";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { NumberField } from "@/components/ui/number-field";
import { siteInputSchema, type SiteInput } from "@/lib/validations/installed-base";
import { StatusLine, useActionStatus } from "./use-action-form";

type Values = z.input<typeof siteInputSchema>;

export function SiteForm({
  accountId,
  site,
}: {
  accountId: number;
  site?: SiteInput & { id: number };
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, SiteInput>({
    resolver: zodResolver(siteInputSchema),
    defaultValues: site ?? {
      name: "",
      currency: "EUR",
      tariffPerKWh: "",
      gridKgCo2PerKWh: 0,
      ambientC: 35,
      hoursPerYear: 4000,
    },
  });
  const { status, apply, onInvalid } = useActionStatus(setError);

  async function onSubmit(values: SiteInput) {
    const result = site
      ? await updateSiteAction(site.id, values)
      : await createSiteAction(accountId, values);
    if (apply(result, site ? "Site saved." : `Added ${values.name}.`)) {
      if (!site) reset();
    }
  }

  return (
    <form
      aria-label={site ? "Edit site" : "Add a site"}
      onSubmit={handleSubmit(onSubmit, onInvalid)}
      noValidate
      className="grid gap-4 md:grid-cols-3"
    >
      <Field id="site-name" label="Site name" error={errors.name?.message}>
        <Input id="site-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field
        id="site-currency"
        label="Currency"
        hint="ISO 4217 code, e.g. EUR"
        error={errors.currency?.message}
      >
        <Input
          id="site-currency"
          maxLength={3}
          invalid={!!errors.currency}
          {...register("currency")}
        />
      </Field>
      <Field
        id="site-tariff"
        label="Electricity tariff [per kWh]"
        hint="What the plant pays per kWh, e.g. 0.21"
        error={errors.tariffPerKWh?.message}
      >
        <Input
          id="site-tariff"
          inputMode="decimal"
          invalid={!!errors.tariffPerKWh}
          {...register("tariffPerKWh")}
        />
      </Field>
      <NumberField
        register={register}
        name="gridKgCo2PerKWh"
        label="Grid CO₂ factor"
        unit="kg/kWh"
        hint="Emissions of the supply"
        error={errors.gridKgCo2PerKWh?.message}
      />
      <NumberField
        register={register}
        name="ambientC"
        label="Cabinet and machine ambient"
        unit="°C"
        error={errors.ambientC?.message}
      />
      <NumberField
        register={register}
        name="hoursPerYear"
        label="Running hours per year"
        unit="h"
        hint="The default for new axes"
        error={errors.hoursPerYear?.message}
      />
      <div className="flex items-center gap-4 md:col-span-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : site ? "Save site" : "Add site"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
