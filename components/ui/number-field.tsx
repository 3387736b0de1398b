"use client";

import type { FieldValues, Path, UseFormRegister } from "react-hook-form";
import { asNumber, NumberField as NumberInput, TorqueField as TorqueInput } from "./form-fields";

// react-hook-form bindings for the shared number and torque inputs: the field's name gives its
// id, and an empty box reads as "not given" so zod applies the default or says it is required.
type Props<T extends FieldValues> = {
  register: UseFormRegister<T>;
  name: Path<T>;
  label: string;
  unit?: string;
  hint?: string;
  error?: string;
  step?: string;
};

const idFor = (name: string) => `f-${name.replace(/\./g, "-")}`;

export function NumberField<T extends FieldValues>({
  register,
  name,
  label,
  unit,
  hint,
  error,
  step,
}: Props<T>) {
  return (
    <NumberInput
      id={idFor(name)}
      label={unit ? `${label} [${unit}]` : label}
      hint={hint ?? ""}
      error={error}
      step={step}
      registration={register(name, { setValueAs: asNumber })}
    />
  );
}

// A torque typed in any supported unit; the server converts it to N·m by the NIST SP 811 factors.
export function TorqueField<T extends FieldValues>({
  register,
  name,
  label,
  hint,
  error,
}: Omit<Props<T>, "unit" | "step">) {
  return (
    <TorqueInput
      id={`${idFor(name)}-value`}
      label={label}
      hint={hint ?? ""}
      error={error}
      value={register(`${name}.value` as Path<T>, { setValueAs: asNumber })}
      unit={register(`${name}.unit` as Path<T>)}
    />
  );
}
