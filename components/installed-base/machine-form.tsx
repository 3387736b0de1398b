"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { createMachineAction, updateMachineAction } from "@/server/installed-base/actions";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { NumberField } from "@/components/ui/number-field";
import { machineInputSchema, type MachineInput } from "@/lib/validations/installed-base";
import { StatusLine, useActionStatus } from "./use-action-form";

type Values = z.input<typeof machineInputSchema>;

export function MachineForm({
  siteId,
  machine,
}: {
  siteId: number;
  machine?: MachineInput & { id: number };
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, MachineInput>({
    resolver: zodResolver(machineInputSchema),
    defaultValues: machine
      ? { ...machine, line: machine.line ?? "" }
      : { name: "", line: "", downtimeHours: 0, throughputGainPct: 0, marginPerOutputHour: "0" },
  });
  const { status, apply, onInvalid } = useActionStatus(setError);

  async function onSubmit(values: MachineInput) {
    const result = machine
      ? await updateMachineAction(machine.id, values)
      : await createMachineAction(siteId, values);
    if (apply(result, machine ? "Machine saved." : `Added ${values.name}.`)) {
      if (!machine) reset();
    }
  }

  return (
    <form
      aria-label={machine ? "Edit machine" : "Add a machine"}
      onSubmit={handleSubmit(onSubmit, onInvalid)}
      noValidate
      className="grid gap-4 md:grid-cols-3"
    >
      <Field id="machine-name" label="Machine name" error={errors.name?.message}>
        <Input id="machine-name" invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field
        id="machine-line"
        label="Line"
        hint="Optional: the production line it stands in"
        error={errors.line?.message}
      >
        <Input id="machine-line" {...register("line")} />
      </Field>
      <NumberField
        register={register}
        name="downtimeHours"
        label="Downtime for the retrofit"
        unit="h"
        hint="Hours the machine stands still while converted"
        error={errors.downtimeHours?.message}
      />
      <NumberField
        register={register}
        name="throughputGainPct"
        label="Throughput gain the customer will use"
        unit="%"
        hint="0 if the freed speed will not be used"
        error={errors.throughputGainPct?.message}
      />
      <Field
        id="machine-margin"
        label="Margin per output hour"
        hint="Contribution margin of one hour of the machine's output"
        error={errors.marginPerOutputHour?.message}
      >
        <Input
          id="machine-margin"
          inputMode="decimal"
          invalid={!!errors.marginPerOutputHour}
          {...register("marginPerOutputHour")}
        />
      </Field>
      <div className="flex items-end gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : machine ? "Save machine" : "Add machine"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
