"use client";

import {
  useWatch,
  type Control,
  type FieldErrors,
  type FieldValues,
  type Path,
  type UseFormRegister,
} from "react-hook-form";
import { Field, Input } from "@/components/ui/field";
import { NumberField } from "@/components/ui/number-field";
import { fieldMessage } from "@/components/ui/form-fields";
import { EVENT_FIELDS, type EventFieldKey } from "@/lib/fields";
import { eventCostSentence, type EventPricing } from "@/lib/results/event-cost-view";
import { AxisRegistryField } from "./axis-registry-field";
import { EVENT_DEFAULTS } from "./axis-form-values";

const EVENT_KEYS = Object.keys(EVENT_FIELDS) as EventFieldKey[];

/**
 * The cost of one step-loss event, either typed as one figure or built up from what an event
 * causes (docs/model.md (The business case)): downtime priced at a case's downtime cost per
 * hour, scrap, and restart labour at its labour rate. The built-up cost is shown as it is typed,
 * priced with the rates of the cases this axis is in, since the axis itself holds no rates.
 */
export function StepLossCostFields<T extends FieldValues>({
  register,
  control,
  errors,
  pricing,
}: {
  register: UseFormRegister<T>;
  control: Control<T>;
  errors: FieldErrors<T>;
  pricing: EventPricing[];
}) {
  const mode = useWatch({ control, name: "costMode" as Path<T> }) as "typed" | "built";
  const event = useWatch({ control, name: "event" as Path<T> }) as Record<EventFieldKey, unknown>;
  const eventErrors = (errors as Record<string, unknown>).event as
    Record<string, { message?: string }> | undefined;
  return (
    <div className="space-y-3 sm:col-span-2 lg:col-span-3">
      <fieldset>
        <legend className="text-small font-bold text-steel-800">Cost of one step-loss event</legend>
        <div className="mt-1 flex flex-wrap gap-x-6 gap-y-1 text-small">
          <label className="flex items-center gap-2">
            <input type="radio" value="typed" {...register("costMode" as Path<T>)} />
            Typed as one figure
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="built" {...register("costMode" as Path<T>)} />
            Built up from downtime, scrap and restart labour
          </label>
        </div>
      </fieldset>
      {mode === "built" ? (
        <>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {EVENT_KEYS.map((key) => {
              const spec = EVENT_FIELDS[key];
              const name = `event.${key}` as Path<T>;
              const error = eventErrors?.[key]?.message;
              if (spec.kind === "money")
                return (
                  <Field
                    key={key}
                    id={`f-event-${key}`}
                    label={spec.label}
                    hint={spec.help}
                    error={fieldMessage(error)}
                  >
                    <Input
                      id={`f-event-${key}`}
                      inputMode="decimal"
                      invalid={!!error}
                      {...register(name)}
                    />
                  </Field>
                );
              return (
                <NumberField
                  key={key}
                  register={register}
                  name={name}
                  label={spec.label}
                  unit={spec.unit ?? undefined}
                  hint={spec.help}
                  error={error}
                />
              );
            })}
          </div>
          <BuiltUpCost event={event} pricing={pricing} />
        </>
      ) : (
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <AxisRegistryField name="costPerEvent" register={register} errors={errors} />
        </div>
      )}
    </div>
  );
}

function BuiltUpCost({
  event,
  pricing,
}: {
  event: Record<EventFieldKey, unknown> | undefined;
  pricing: EventPricing[];
}) {
  const parts = event ?? EVENT_DEFAULTS;
  if (pricing.length === 0)
    return (
      <p role="status" className="rounded-md bg-flux-50 p-3 text-small text-flux-900">
        This axis is in no case yet. Each case prices the event with its own downtime cost per hour
        and labour rate (its assumptions); the scrap is priced here.
      </p>
    );
  return (
    <div
      role="status"
      aria-live="polite"
      className="rounded-md bg-flux-50 p-3 text-small text-flux-900"
    >
      <p className="font-bold">Cost per event, priced with each case&apos;s rates</p>
      <ul className="mt-1 space-y-1" data-testid="built-up-event-cost">
        {pricing.map((p, i) => {
          const sentence = eventCostSentence(parts, p);
          return (
            <li key={`${p.caseName}-${i}`} className="break-words">
              {p.caseName}: {sentence ?? "enter numbers in each box to see the cost"}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
