"use client";

import { useState } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { ActionResult } from "@/server/actions/result";

// Maps a server action's result onto a react-hook-form: field errors beside their fields, the
// message in the form's aria-live status line.
export function useActionStatus<T extends FieldValues>(setError: UseFormSetError<T>) {
  const [status, setStatus] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  function apply(result: ActionResult<unknown>, okText: string): boolean {
    if (result.ok) {
      setStatus({ tone: "ok", text: okText });
      return true;
    }
    for (const [field, message] of Object.entries(result.fieldErrors)) {
      // Torque fields are { value, unit }: their error shows under the number.
      setError(field as Path<T>, { message });
    }
    setStatus({ tone: "error", text: result.message });
    return false;
  }
  // A submit the form's own checks stop never reaches the server: clear the last "Saved" so it
  // does not sit beside the new errors (pass as handleSubmit's second argument).
  const onInvalid = () => setStatus(null);
  return { status, setStatus, apply, onInvalid };
}

export function StatusLine({ status }: { status: { tone: "ok" | "error"; text: string } | null }) {
  return (
    <p
      aria-live="polite"
      role="status"
      className={`text-small font-bold ${status?.tone === "ok" ? "text-success-700" : "text-danger-700"}`}
    >
      {status?.text}
    </p>
  );
}
