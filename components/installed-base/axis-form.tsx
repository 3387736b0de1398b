"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import type { ReactNode } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { saveAxisAction } from "@/server/installed-base/actions";
import { Button } from "@/components/ui/button";
import { Field, Select } from "@/components/ui/field";
import type { AxisFieldGroup } from "@/lib/fields";
import { axisInputSchema, type AxisInput } from "@/lib/validations/installed-base";
import { axisFieldsOf, AxisRegistryField } from "./axis-registry-field";
import { newAxisFormValues } from "./axis-form-values";
import { StatusLine, useActionStatus } from "./use-action-form";

type Values = z.input<typeof axisInputSchema>;

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-panel border border-steel-200 p-4">
      <legend className="px-1 text-body font-bold text-flux-900">{title}</legend>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

// Every group's fields come from the registry (lib/fields/axis.ts), in its order.
const GROUPS: [Exclude<AxisFieldGroup, "axis">, string][] = [
  ["motor", "Motor (from its datasheet)"],
  ["drive", "Drive (as set today)"],
  ["duty", "Duty"],
  ["reliability", "Reliability"],
];

export function AxisForm({
  siteId,
  machines,
  axis,
  defaults,
}: {
  siteId: number;
  machines: { id: number; name: string }[];
  axis?: { id: number; values: Values };
  defaults: { hoursPerYear: number; ambientC: number };
}) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, AxisInput>({
    resolver: zodResolver(axisInputSchema),
    defaultValues: axis?.values ?? newAxisFormValues(machines[0]?.id, defaults),
  });
  const { status, apply } = useActionStatus(setError);
  const err = (k: keyof Values) => (errors[k] as { message?: string } | undefined)?.message;

  async function onSubmit(values: AxisInput) {
    const result = await saveAxisAction(axis?.id ?? null, values);
    if (apply(result, "Axis saved.")) router.push(`/sites/${siteId}`);
  }

  return (
    <form
      aria-label={axis ? "Edit axis" : "Add an axis"}
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-5"
    >
      <Group title="Axis">
        <AxisRegistryField name="label" register={register} errors={errors} />
        <Field id="f-machineId" label="Machine" error={err("machineId")}>
          <Select id="f-machineId" {...register("machineId")}>
            {machines.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </Select>
        </Field>
        {axisFieldsOf("axis")
          .filter((key) => key !== "label")
          .map((key) => (
            <AxisRegistryField key={key} name={key} register={register} errors={errors} />
          ))}
      </Group>
      {GROUPS.map(([group, title]) => (
        <Group key={group} title={title}>
          {axisFieldsOf(group).map((key) => (
            <AxisRegistryField key={key} name={key} register={register} errors={errors} />
          ))}
        </Group>
      ))}

      <div className="flex items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save axis"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
