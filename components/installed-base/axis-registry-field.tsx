"use client";

import type { FieldErrors, FieldValues, Path, UseFormRegister } from "react-hook-form";
import { Field, Input, Select } from "@/components/ui/field";
import { NumberField, TorqueField } from "@/components/ui/number-field";
import { fieldMessage } from "@/components/ui/form-fields";
import {
  AXIS_FIELDS,
  type AxisFieldGroup,
  type AxisFieldKey,
  type AxisFieldSpec,
} from "@/lib/fields";

/** The registry's axis fields of one group, in registry order (lib/fields/axis.ts). */
export function axisFieldsOf(group: AxisFieldGroup): AxisFieldKey[] {
  return (Object.keys(AXIS_FIELDS) as AxisFieldKey[]).filter(
    (key) => (AXIS_FIELDS[key] as AxisFieldSpec).group === group,
  );
}

// A torque field's error may sit on the field or on its number ({ value, unit }).
function messageOf(errors: FieldErrors, key: string): string | undefined {
  const e = errors[key] as
    { message?: string; value?: { message?: string }; unit?: { message?: string } } | undefined;
  return e?.message ?? e?.value?.message ?? e?.unit?.message;
}

/**
 * One axis field as its registry entry describes it: the label, unit and help are the registry's,
 * and the control follows its kind (a list for a choice, number and unit for a torque).
 */
export function AxisRegistryField<T extends FieldValues>({
  name,
  register,
  errors,
  origin,
}: {
  name: AxisFieldKey;
  register: UseFormRegister<T>;
  errors: FieldErrors<T>;
  /** Where the value came from, said before the help (a catalogue motor). */
  origin?: string;
}) {
  const registry: AxisFieldSpec = AXIS_FIELDS[name];
  const spec = origin ? { ...registry, help: `${origin} ${registry.help}` } : registry;
  const error = messageOf(errors, name);
  const path = name as Path<T>;
  const id = `f-${name}`;
  if (spec.kind === "enum")
    return (
      <Field id={id} label={spec.label} hint={spec.help} error={error}>
        <Select id={id} {...register(path)}>
          {spec.choices?.map((choice) => (
            <option key={choice} value={choice}>
              {spec.choiceLabels?.[choice] ?? choice}
            </option>
          ))}
        </Select>
      </Field>
    );
  if (spec.kind === "text" || spec.kind === "money")
    return (
      <Field id={id} label={spec.label} hint={spec.help} error={fieldMessage(error)}>
        <Input
          id={id}
          inputMode={spec.kind === "money" ? "decimal" : "text"}
          maxLength={spec.maxLength}
          invalid={!!error}
          {...register(path)}
        />
      </Field>
    );
  if (spec.accepts === "torque")
    return (
      <TorqueField
        register={register}
        name={path}
        label={spec.label}
        hint={spec.help}
        error={error}
      />
    );
  return (
    <NumberField
      register={register}
      name={path}
      label={spec.label}
      unit={spec.unit ?? undefined}
      step={spec.kind === "int" ? "1" : undefined}
      hint={spec.help}
      error={error}
    />
  );
}
