import { Panel } from "@/components/ui/panel";
import { ValueBySourceTotalsTable } from "@/components/results/value-by-source-totals-table";
import type { CaseResult, ParsedCase } from "@/lib/engine";

const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;

/**
 * The dossier's value by source over the horizon, each scenario plain and discounted at the
 * case's rate (lib/results/source-totals.ts). The discounted total less the up-front cost is the
 * scenario's NPV, shown as the last row so that the reader can tie it to the headline.
 */
export function ValueBySourcePanel({ result, input }: { result: CaseResult; input: ParsedCase }) {
  const rate = input.finance.discountRatePct;
  if (SCENARIOS.some((k) => !result.scenarios[k].bySource)) return null;
  return (
    <Panel title="Value by source over the horizon">
      <p className="mb-3 text-small text-steel-700">
        Each scenario&apos;s yearly value added over its {input.finance.horizonYears} years, as it
        stands and discounted at {rate} % a year. Tax is what the flows owe after depreciation (a
        negative amount is a shield).
      </p>
      <ValueBySourceTotalsTable result={result} discountRatePct={rate} />
    </Panel>
  );
}
