import type { CaseResult, ParsedCase } from "@/lib/engine";
import { headlineReliance, type HeadlineEvidence } from "@/lib/results/headline-reliance";

/** The recorded sources of a case's typed figures (db/queries/evidence.ts), where the screen has them. */
export type CaseEvidence = HeadlineEvidence;

const CAUTION_NOTE =
  "rounded-md border border-caution-600 bg-caution-50 p-3 text-small text-steel-900";
const PLAIN_NOTE = "rounded-md bg-steel-50 p-3 text-small text-steel-900";

/**
 * Above the scenario cards, once: what the value rests on (lib/results/headline-reliance.ts) —
 * a warning when most of it rests on typed figures without a recorded source, naming them and
 * worded for the vendor or for the customer's reviewer.
 */
export function RelianceNote({
  result,
  input,
  evidence,
  className = "",
}: {
  result: CaseResult;
  input: ParsedCase | null;
  evidence?: CaseEvidence;
  className?: string;
}) {
  const note = headlineReliance(result, input, evidence);
  if (!note) return null;
  return (
    <p
      role="note"
      data-testid={note.unevidenced ? "unevidenced-warning" : undefined}
      className={`${note.tone === "caution" ? CAUTION_NOTE : PLAIN_NOTE} ${className}`}
    >
      {note.title ? <strong>{note.title}</strong> : null} {note.text}
    </p>
  );
}
