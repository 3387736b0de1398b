import type { CaseResult, ParsedCase, Scenario } from "@/lib/engine";
import type { EvidenceIndex } from "@/lib/evidence/subjects";
import {
  evidencedReliance,
  relianceSentence,
  unevidencedSentence,
  valueReliance,
} from "@/lib/results/value-reliance";

/** The recorded sources of a case's typed figures (db/queries/evidence.ts), where the screen has them. */
export interface CaseEvidence {
  caseId: number;
  index: EvidenceIndex;
  /** Who reads the warning: the vendor records sources, the customer's reviewer asks for them. */
  audience?: "vendor" | "reviewer";
}

const CAUTION_NOTE =
  "mt-2 rounded-md border border-caution-600 bg-caution-50 p-2 text-small text-steel-900";

/**
 * Under the NPV: a warning when more than half of the value rests on typed figures with no
 * recorded source, naming them (worded for the vendor or for the customer's reviewer); where the
 * screen has no evidence to weigh (the dossier), the plainer warning that the value is mostly typed.
 */
export function RelianceNote({
  scenario,
  result,
  input,
  evidence,
  fallback,
}: {
  scenario: Scenario;
  result: CaseResult;
  input: ParsedCase | null;
  evidence?: CaseEvidence;
  fallback: ReturnType<typeof valueReliance>;
}) {
  const split =
    evidence && input
      ? evidencedReliance(scenario, result, input, evidence.index, evidence.caseId)
      : null;
  if (split) {
    if (split.mostlyUnevidenced)
      return (
        <p role="note" data-testid="unevidenced-warning" className={CAUTION_NOTE}>
          <strong>Mostly typed figures without a source.</strong>{" "}
          {unevidencedSentence(split, 4, evidence?.audience)}
        </p>
      );
    if (!split.mostlyTyped) return null;
    return (
      <p role="note" className="mt-2 rounded-md bg-steel-50 p-2 text-small text-steel-900">
        {relianceSentence(split)} {split.evidencedPct} % rests on figures whose source is recorded.
      </p>
    );
  }
  return fallback?.mostlyTyped ? (
    <p role="note" className={CAUTION_NOTE}>
      <strong>Mostly typed figures.</strong> {relianceSentence(fallback)}
    </p>
  ) : null;
}
