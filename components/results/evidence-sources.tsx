import Link from "next/link";
import { Panel } from "@/components/ui/panel";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import type { EvidenceIndex } from "@/lib/evidence/subjects";
import { formatMoney } from "@/lib/results/format";
import { typedValueFigures, valueReliance } from "@/lib/results/value-reliance";
import { upperFirst } from "@/lib/words";

/** Where a figure's source is recorded: its axis's, machine's or case's page. */
function recordHref(key: string): string {
  const [subject, id] = key.split(":");
  return subject === "axis"
    ? `/axes/${id}`
    : subject === "machine"
      ? `/machines/${id}`
      : `/cases/${id}`;
}

/** How many figures the panel lists before "and N more": a fleet has thousands of axes. */
const SHOWN = 12;

/**
 * The typed figures the value rests on, each beside its recorded source (a note, who gave it and
 * when) or "no source recorded", most value first. Sources are recorded on the axis, machine
 * and case pages (components/evidence/evidence-panel.tsx).
 */
export function EvidenceSources({
  result,
  input,
  caseId,
  index,
  readOnly = false,
}: {
  result: CaseResult;
  input: ParsedCase;
  caseId: number;
  index: EvidenceIndex;
  /** The customer's reviewer reads the sources; only the vendor's people record them. */
  readOnly?: boolean;
}) {
  // A result without value by source (frozen by engine 1.0.0) has nothing to weigh.
  if (!valueReliance(result.scenarios.physics)) return null;
  const figures = typedValueFigures(result, input, caseId);
  if (figures.length === 0) return null;
  const shown = figures.slice(0, SHOWN);
  const missing = figures.filter((f) => index[f.key] === undefined).length;
  return (
    <Panel title="Typed figures and their sources">
      <p className="mb-3 text-small text-steel-700">
        {missing === 0
          ? "Every typed figure the value rests on has a recorded source."
          : `${missing} of ${figures.length} typed figures the value rests on have no recorded source.`}{" "}
        Beside each: the value a year that rests on it, together with the figures it is multiplied
        by.
      </p>
      <ul className="divide-y divide-steel-100 text-small" data-testid="evidence-sources">
        {shown.map((f) => {
          const entry = index[f.key];
          return (
            <li key={f.key} className="py-2">
              <p className="flex flex-wrap justify-between gap-x-4">
                <span className="font-bold text-steel-900">{upperFirst(f.words)}</span>
                <span className="tabular-nums text-steel-700">
                  {formatMoney(f.valuePerYear, result.currency)} a year
                </span>
              </p>
              {entry ? (
                <p className="break-words text-steel-800">
                  Source: {entry.note} — {entry.givenBy}, {entry.givenOn}
                </p>
              ) : (
                <p className="text-caution-700">
                  No source recorded.{" "}
                  {readOnly ? null : (
                    <Link
                      href={recordHref(f.key)}
                      className="underline"
                      aria-label={`Record it: the source of ${f.words}`}
                    >
                      Record it
                    </Link>
                  )}
                </p>
              )}
            </li>
          );
        })}
      </ul>
      {figures.length > shown.length ? (
        <p className="mt-2 text-small text-steel-700">
          And {figures.length - shown.length} more figures with less value resting on them.
        </p>
      ) : null}
    </Panel>
  );
}
