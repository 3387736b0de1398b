"use client";

import Link from "next/link";
import type { ReactNode } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { Button, buttonClass } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { TORQUE_UNIT_NAMES } from "@/lib/engine/units";
import { parseTypedNumber } from "@/lib/validations/typed-number";
import { upperFirst } from "@/lib/words";

/**
 * The shared schemas word their messages to follow a field path ("holdingTorqueNm: must be
 * greater than 0"), as the JSON API prints them. Beside a labelled field the path is already
 * said, so the fragment becomes a sentence and the type-level ones say what to type instead.
 */
export function fieldMessage(message: string | undefined): string | undefined {
  if (!message) return undefined;
  if (message.startsWith("required") || message.startsWith("expected a torque"))
    return "Enter a number";
  if (message.startsWith("expected an amount")) return "Enter an amount such as 189.00";
  if (message.endsWith("received NaN"))
    return "Enter a number such as 0.24 (for a thousand and more, write 1234 rather than 1,234)";
  if (message.startsWith("expected a number") || message.startsWith("expected a whole number"))
    return "Enter a number";
  return upperFirst(message);
}

// A number input yields text; an empty box becomes undefined so that the schema's default (or
// "absent" for the optional fields) applies instead of a zero nobody typed.
// A decimal comma is read as a point ("0,24"); text that is not a number, or "1,234" that could be a
// thousand or a decimal (lib/validations/typed-number.ts), becomes NaN so the schema refuses it.
export const asNumber = (v: unknown) => {
  if (typeof v !== "string") return v;
  const parsed = parseTypedNumber(v);
  if (parsed.ok) return parsed.value;
  return parsed.reason === "empty" ? undefined : Number.NaN;
};

const describedBy = (id: string, error?: string, hint?: string) =>
  error ? `${id}-error` : hint ? `${id}-hint` : undefined;

export function NumberField({
  id,
  label,
  hint,
  error,
  registration,
}: {
  id: string;
  label: string;
  hint: string;
  error?: string;
  registration: UseFormRegisterReturn;
  /** Kept for callers; a text box (so that "0,24" can be typed) has no step. */
  step?: string;
}) {
  const message = fieldMessage(error);
  return (
    <Field id={id} label={label} hint={hint} error={message}>
      <Input
        id={id}
        type="text"
        inputMode="decimal"
        invalid={!!message}
        aria-describedby={describedBy(id, message, hint)}
        {...registration}
      />
    </Field>
  );
}

export function TextField({
  id,
  label,
  hint,
  error,
  registration,
  inputMode,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  registration: UseFormRegisterReturn;
  inputMode?: "decimal" | "text";
}) {
  const message = fieldMessage(error);
  return (
    <Field id={id} label={label} hint={hint} error={message}>
      <Input
        id={id}
        inputMode={inputMode}
        autoComplete="off"
        invalid={!!message}
        aria-describedby={describedBy(id, message, hint)}
        {...registration}
      />
    </Field>
  );
}

export function SelectField({
  id,
  label,
  hint,
  error,
  registration,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  registration: UseFormRegisterReturn;
  children: ReactNode;
}) {
  const message = fieldMessage(error);
  return (
    <Field id={id} label={label} hint={hint} error={message}>
      <Select
        id={id}
        invalid={!!message}
        aria-describedby={describedBy(id, message, hint)}
        {...registration}
      >
        {children}
      </Select>
    </Field>
  );
}

// A torque as the datasheet gives it: the number and its unit side by side, sent as
// { value, unit } for the shared schema to convert to N·m (NIST SP 811 factors in units.ts).
export function TorqueField({
  id,
  label,
  hint,
  error,
  value,
  unit,
}: {
  id: string;
  label: string;
  hint: string;
  error?: string;
  value: UseFormRegisterReturn;
  unit: UseFormRegisterReturn;
}) {
  const message = fieldMessage(error);
  return (
    <Field id={id} label={label} hint={hint} error={message}>
      <div className="flex gap-2">
        <Input
          id={id}
          type="text"
          inputMode="decimal"
          invalid={!!message}
          aria-describedby={describedBy(id, message, hint)}
          className="w-full min-w-0 flex-1"
          {...value}
        />
        <label htmlFor={`${id}-unit`} className="sr-only">
          Unit of {label.toLowerCase()}
        </label>
        <Select id={`${id}-unit`} className="w-28 shrink-0" {...unit}>
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

export function FormSection({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-panel border border-steel-200 bg-white p-5 shadow-panel">
      <legend className="px-1 text-lead font-bold text-steel-950">{legend}</legend>
      <div className="grid gap-4 md:grid-cols-2">{children}</div>
    </fieldset>
  );
}

export function FormFooter({
  submitting,
  label,
  status,
}: {
  submitting: boolean;
  label: string;
  status: string | null;
}) {
  return (
    <div className="flex flex-wrap items-center gap-4">
      <Button type="submit" disabled={submitting}>
        {submitting ? "Saving…" : label}
      </Button>
      <Link href="/catalogue" className={buttonClass("ghost")}>
        Cancel
      </Link>
      <p aria-live="polite" role="status" className="text-small font-bold text-danger-700">
        {status}
      </p>
    </div>
  );
}
