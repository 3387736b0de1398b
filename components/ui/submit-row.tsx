import type { ReactNode } from "react";
import { Button } from "./button";

/** What a form says after a submit: saved, saved with a caveat, or refused. */
export type FormMessage = { tone: "ok" | "caution" | "error"; text: string } | null;

const TONE_CLASS = {
  ok: "text-success-700",
  caution: "text-caution-700",
  error: "text-danger-700",
} as const;

/**
 * A form's submit button and the message that answers it, announced to screen readers. While
 * `pending`, the button is disabled and shows `pendingLabel`.
 */
export function SubmitRow({
  label,
  pending,
  pendingLabel = "Saving…",
  message,
  variant = "primary",
  disabled = false,
}: {
  label: string;
  pending: boolean;
  pendingLabel?: string;
  message: FormMessage;
  variant?: "primary" | "secondary";
  disabled?: boolean;
}): ReactNode {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button type="submit" variant={variant} disabled={pending || disabled}>
        {pending ? pendingLabel : label}
      </Button>
      <p
        aria-live="polite"
        role="status"
        className={`text-small font-bold ${message ? TONE_CLASS[message.tone] : ""}`}
      >
        {message?.text}
      </p>
    </div>
  );
}
