import type { ReactNode } from "react";
import type { TermKind } from "@/lib/glossary";

type Tone = "neutral" | "flux" | "coil" | "success" | "caution" | "danger";

const tones: Record<Tone, string> = {
  neutral: "bg-steel-100 text-steel-800",
  flux: "bg-flux-100 text-flux-800",
  coil: "bg-coil-100 text-coil-800",
  success: "bg-success-50 text-success-700",
  caution: "bg-caution-50 text-caution-700",
  danger: "bg-danger-50 text-danger-700",
};

/** A coloured label; `term` marks a glossary word (its kind) for the glossary's page test. */
export function Badge({
  tone = "neutral",
  term,
  children,
}: {
  tone?: Tone;
  term?: TermKind;
  children: ReactNode;
}) {
  return (
    <span
      data-term={term}
      className={`inline-flex items-center rounded-full px-2 py-0.5 text-caption font-bold ${tones[tone]}`}
    >
      {children}
    </span>
  );
}
