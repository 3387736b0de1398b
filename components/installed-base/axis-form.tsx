"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import type { ReactNode } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { saveAxisAction } from "@/server/installed-base/actions";
import { Button } from "@/components/ui/button";
import { Field, Select } from "@/components/ui/field";
import type { Motor } from "@/db/schema";
import {
  CATALOGUE_MOTOR_FIELDS,
  fieldsFromCatalogue,
  motorToAxisFormValues,
} from "@/lib/catalogue/motor-form-values";
import { AXIS_FIELDS, type AxisFieldGroup } from "@/lib/fields";
import { axisInputSchema, type AxisInput } from "@/lib/validations/installed-base";
import { axisFieldsOf, AxisRegistryField } from "./axis-registry-field";
import type { AxisFieldKey } from "@/lib/fields";
import { newAxisFormValues } from "./axis-form-values";
import { StatusLine, useActionStatus } from "./use-action-form";
import { StepLossCostFields } from "./step-loss-cost-fields";
import type { EventPricing } from "@/lib/results/event-cost-view";

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
  motors = [],
  eventPricing = [],
}: {
  siteId: number;
  machines: { id: number; name: string }[];
  axis?: { id: number; values: Values };
  defaults: { hoursPerYear: number; ambientC: number };
  /** The catalogue's motors the form can fill the motor figures from. */
  motors?: Motor[];
  /** The rates of the cases this axis is in, which price a step-loss event built up. */
  eventPricing?: EventPricing[];
}) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, AxisInput>({
    resolver: zodResolver(axisInputSchema),
    defaultValues: axis?.values ?? newAxisFormValues(machines[0]?.id, defaults),
  });
  const { status, apply, onInvalid } = useActionStatus(setError);
  const err = (k: keyof Values) => (errors[k] as { message?: string } | undefined)?.message;

  // The chosen catalogue motor, and which of the motor fields still hold its figures: those are
  // marked "from the catalogue"; a field the user changed is theirs again.
  const referenceMotorId = useWatch({ control, name: "referenceMotorId" });
  const motor = motors.find((m) => String(m.id) === String(referenceMotorId ?? ""));
  const current = useWatch({ control, name: CATALOGUE_MOTOR_FIELDS });
  const fromCatalogue = motor
    ? fieldsFromCatalogue(
        motor,
        Object.fromEntries(CATALOGUE_MOTOR_FIELDS.map((key, i) => [key, current[i]])),
      )
    : [];
  const changed = motor ? CATALOGUE_MOTOR_FIELDS.filter((k) => !fromCatalogue.includes(k)) : [];
  const labels = (keys: readonly AxisFieldKey[]) =>
    keys.map((k) => AXIS_FIELDS[k].label.toLowerCase()).join(", ");
  const origin = (key: AxisFieldKey) =>
    motor && (fromCatalogue as AxisFieldKey[]).includes(key)
      ? `From the catalogue (${motor.code}).`
      : undefined;

  function fillFromMotor(id: string) {
    const chosen = motors.find((m) => String(m.id) === id);
    if (!chosen) return;
    for (const [key, value] of Object.entries(motorToAxisFormValues(chosen)))
      setValue(key as keyof Values, value as never, { shouldDirty: true });
  }

  async function onSubmit(values: AxisInput) {
    const result = await saveAxisAction(axis?.id ?? null, values);
    if (apply(result, "Axis saved.")) router.push(`/sites/${siteId}`);
  }

  return (
    <form
      aria-label={axis ? "Edit axis" : "Add an axis"}
      onSubmit={handleSubmit(onSubmit, onInvalid)}
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
          {group === "motor" ? (
            <div className="space-y-2 sm:col-span-2 lg:col-span-3">
              <Field
                id="f-referenceMotorId"
                label="Catalogue motor"
                hint="Choose the motor from the catalogue to fill its datasheet figures below; you can still change each one."
                error={err("referenceMotorId")}
              >
                <Select
                  id="f-referenceMotorId"
                  {...register("referenceMotorId", {
                    onChange: (e) => fillFromMotor(e.target.value),
                  })}
                >
                  <option value="">None: figures typed from a datasheet</option>
                  {motors.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.code}: {m.name}
                      {m.active ? "" : " (retired)"}
                    </option>
                  ))}
                </Select>
              </Field>
              {motor ? (
                <p
                  role="status"
                  data-testid="catalogue-motor-note"
                  className="rounded-md bg-flux-50 p-3 text-small text-flux-900"
                >
                  {fromCatalogue.length
                    ? `From the catalogue motor ${motor.code} (${motor.name}): ${labels(fromCatalogue)}.`
                    : `No figure below is the catalogue motor ${motor.code}'s any more.`}
                  {changed.length ? ` Changed here: ${labels(changed)}.` : ""} The catalogue holds
                  no pull-out curve.
                </p>
              ) : null}
            </div>
          ) : null}
          {axisFieldsOf(group)
            .filter((key) => key !== "costPerEvent")
            .map((key) => (
              <AxisRegistryField
                key={key}
                name={key}
                register={register}
                errors={errors}
                origin={origin(key)}
              />
            ))}
          {group === "reliability" ? (
            <StepLossCostFields
              register={register}
              control={control}
              errors={errors}
              pricing={eventPricing}
            />
          ) : null}
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
