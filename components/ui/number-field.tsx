"use client";

import type { FieldValues, Path, UseFormRegister } from "react-hook-form";
import { TORQUE_UNIT_NAMES } from "@/lib/engine/units";
import { Field, Input, Select } from "./field";

// An empty box means "not given" (undefined) so that zod applies the default or says the field
// is required, instead of reading NaN.
export const asNumber = (v: unknown) =>
  v === "" || v === null || v === undefined ? undefined : Number(v);

type Props<T extends FieldValues> = {
  register: UseFormRegister<T>;
  name: Path<T>;
  label: string;
  unit?: string;
  hint?: string;
  error?: string;
  step?: string;
};

export function NumberField<T extends FieldValues>({
  register,
  name,
  label,
  unit,
  hint,
  error,
  step = "any",
}: Props<T>) {
  const id = `f-${name.replace(/\./g, "-")}`;
  return (
    <Field id={id} label={unit ? `${label} [${unit}]` : label} hint={hint} error={error}>
      <Input
        id={id}
        type="number"
        inputMode="decimal"
        step={step}
        invalid={!!error}
        {...register(name, { setValueAs: asNumber })}
      />
    </Field>
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
  const id = `f-${name.replace(/\./g, "-")}`;
  return (
    <Field id={`${id}-value`} label={label} hint={hint} error={error}>
      <div className="flex gap-2">
        <Input
          id={`${id}-value`}
          type="number"
          inputMode="decimal"
          step="any"
          invalid={!!error}
          className="min-w-0 flex-1"
          {...register(`${name}.value` as Path<T>, { setValueAs: asNumber })}
        />
        <label htmlFor={`${id}-unit`} className="sr-only">
          Unit of {label.toLowerCase()}
        </label>
        <Select id={`${id}-unit`} className="w-28" {...register(`${name}.unit` as Path<T>)}>
          {TORQUE_UNIT_NAMES.map((u) => (
            <option key={u} value={u}>
              {u}
            </option>
          ))}
        </Select>
      </div>
    </Field>
  );
}
