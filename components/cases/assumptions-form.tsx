"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { updateAssumptionsAction } from "@/server/cases/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/form-fields";
import { NumberField } from "@/components/ui/number-field";
import { useDebouncedInvalidate } from "@/lib/hooks/use-case-result";
import { caseAssumptionsSchema, type CaseAssumptions } from "@/lib/validations/case";

type Values = z.input<typeof caseAssumptionsSchema>;

// Where each default comes from, said beside the field (docs/model.md, Defaults and Sources of the check values).
const ESTIMATE = "Estimate: replace with the customer's own figure";

export function AssumptionsForm({
  caseId,
  values,
  currency,
}: {
  caseId: number;
  values: Values;
  currency: string;
}) {
  const refresh = useDebouncedInvalidate(caseId);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, CaseAssumptions>({
    resolver: zodResolver(caseAssumptionsSchema),
    defaultValues: values,
  });
  const { status, apply } = useActionStatus(setError);
  const f = errors.finance;

  async function onSubmit(data: CaseAssumptions) {
    const result = await updateAssumptionsAction(caseId, data);
    if (apply(result, "Assumptions saved; the results are recomputing.")) refresh();
  }

  return (
    <form
      aria-label="Assumptions"
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-5"
    >
      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 font-bold text-flux-900">Finance</legend>
        <TextField
          id="a-tariff"
          label={`Electricity tariff [${currency}/kWh]`}
          hint="From the site; the customer's contract price"
          inputMode="decimal"
          error={f?.tariffPerKWh?.message}
          registration={register("finance.tariffPerKWh")}
        />
        <NumberField
          register={register}
          name="finance.tariffEscalationPct"
          label="Tariff escalation"
          unit="%/year"
          hint={ESTIMATE}
          error={f?.tariffEscalationPct?.message}
        />
        <NumberField
          register={register}
          name="finance.discountRatePct"
          label="Discount rate"
          unit="%"
          hint="8 % by default; use the customer's cost of capital"
          error={f?.discountRatePct?.message}
        />
        <NumberField
          register={register}
          name="finance.horizonYears"
          label="Horizon"
          unit="years"
          step="1"
          hint="1 to 30 years"
          error={f?.horizonYears?.message}
        />
        <TextField
          id="a-labor"
          label={`Labour rate [${currency}/h]`}
          hint={ESTIMATE}
          inputMode="decimal"
          error={f?.laborRatePerHour?.message}
          registration={register("finance.laborRatePerHour")}
        />
        <TextField
          id="a-downtime"
          label={`Downtime cost [${currency}/h]`}
          hint={ESTIMATE}
          inputMode="decimal"
          error={f?.downtimeCostPerHour?.message}
          registration={register("finance.downtimeCostPerHour")}
        />
        <TextField
          id="a-project"
          label={`One-time project cost [${currency}]`}
          hint="Engineering and travel"
          inputMode="decimal"
          error={f?.projectOneTimeCost?.message}
          registration={register("finance.projectOneTimeCost")}
        />
        <TextField
          id="a-service"
          label={`Annual service cost [${currency}/year]`}
          hint="Added yearly cost of the closed-loop fleet"
          inputMode="decimal"
          error={f?.annualServiceCost?.message}
          registration={register("finance.annualServiceCost")}
        />
        <NumberField
          register={register}
          name="finance.coolingCop"
          label="Cabinet cooler COP"
          hint="Empty when the cabinet has no active cooling; about 1–2 (DIN 3168, from memory)"
          error={f?.coolingCop?.message}
        />
        <NumberField
          register={register}
          name="finance.gridKgCo2PerKWh"
          label="Grid CO₂ factor"
          unit="kg/kWh"
          hint="From the site"
          error={f?.gridKgCo2PerKWh?.message}
        />
        <NumberField
          register={register}
          name="finance.inflationPct"
          label="Inflation"
          unit="%/year"
          hint="Raises the avoided step-loss, maintenance, throughput and service figures each year; 0 keeps them flat. Estimate: use the customer's planning rate"
          error={f?.inflationPct?.message}
        />
        <NumberField
          register={register}
          name="finance.taxRatePct"
          label="Tax rate"
          unit="%"
          hint="0 gives pre-tax flows; otherwise the customer's marginal tax rate, below 100 %"
          error={f?.taxRatePct?.message}
        />
        <NumberField
          register={register}
          name="finance.depreciationYears"
          label="Depreciation"
          unit="years"
          step="1"
          hint="Straight line over the whole investment, 1 to 30 years; matters only with a tax rate"
          error={f?.depreciationYears?.message}
        />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 font-bold text-flux-900">Margins, band and sensitivity</legend>
        <NumberField
          register={register}
          name="margins.openLoopRequiredPct"
          label="Open-loop torque margin required"
          unit="%"
          hint="Common practice: 30–50 % of pull-out torque"
          error={errors.margins?.openLoopRequiredPct?.message}
        />
        <NumberField
          register={register}
          name="margins.closedLoopRequiredPct"
          label="Closed-loop torque margin required"
          unit="%"
          hint="Common practice: 10–20 %"
          error={errors.margins?.closedLoopRequiredPct?.message}
        />
        <NumberField
          register={register}
          name="band.lowPct"
          label="Energy-gain band, low"
          unit="%"
          hint="Trade claim: 25–50 %"
          error={errors.band?.lowPct?.message}
        />
        <NumberField
          register={register}
          name="band.highPct"
          label="Energy-gain band, high"
          unit="%"
          hint="Trade claim: 25–50 %"
          error={errors.band?.highPct?.message}
        />
        <NumberField
          register={register}
          name="sensitivity.swingPct"
          label="Sensitivity swing"
          unit="±%"
          error={errors.sensitivity?.swingPct?.message}
        />
        <NumberField
          register={register}
          name="thermal.lifeHalvingK"
          label="Insulation life halves every"
          unit="K"
          hint="Rule of thumb 10 K; IEC 60216 rates each material"
          error={errors.thermal?.lifeHalvingK?.message}
        />
      </fieldset>
      <div className="flex items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Apply assumptions"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
