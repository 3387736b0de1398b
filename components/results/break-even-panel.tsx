import { Panel } from "@/components/ui/panel";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { breakEvenLines, paybackSentence } from "@/lib/results/engine-v2";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { BreakEvenRow } from "./break-even-row";

/**
 * When the retrofit pays back and how far the two most uncertain inputs may fall before it
 * stops doing so (docs/model.md (The business case)). A result from engine 1.0.0 has no break-even values: the
 * panel is left out rather than shown empty.
 */
export function BreakEvenPanel({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const lines = breakEvenLines(result, input?.finance.tariffPerKWh ?? null);
  if (!lines) return null;
  const physics = result.scenarios.physics;
  const horizonYears = physics.cashFlows.length - 1;
  return (
    <Panel title="Payback and break-even">
      <p className="text-small text-steel-700">
        {SCENARIO_LABELS.physics}, the basis of the proposal.
      </p>
      <dl className="mt-3 divide-y divide-steel-100">
        <div className="grid gap-1 py-3 sm:grid-cols-[12rem_1fr]">
          <dt className="font-bold text-steel-800">Payback</dt>
          <dd className="text-steel-900">{paybackSentence(physics, horizonYears)}</dd>
        </div>
        {lines.map((line) => (
          <BreakEvenRow key={line.term} term={line.term} value={line.value} note={line.note} />
        ))}
      </dl>
    </Panel>
  );
}
