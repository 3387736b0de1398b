import { Table, Td, Th } from "@/components/ui/table";
import { VALUE_SOURCES, type CaseResult } from "@/lib/engine";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { formatMoney } from "@/lib/results/format";
import { sourceTotals, type SourceTotal } from "@/lib/results/source-totals";

const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;
const CELL = "text-right tabular-nums whitespace-nowrap";

/**
 * Each scenario's value by source over the horizon (lib/results/source-totals.ts), with an "All
 * sources" row. Given the case's discount rate, each scenario also discounted at it, and a last
 * row with the NPV, so that a reader can tie the discounted total less the up-front cost to the
 * headline (docs/business-case.md). Null for a result frozen without value by source.
 */
export function ValueBySourceTotalsTable({
  result,
  discountRatePct,
}: {
  result: CaseResult;
  /** The case's rate; null when the input is not at hand, and only plain sums are shown. */
  discountRatePct: number | null;
}) {
  if (SCENARIOS.some((k) => !result.scenarios[k].bySource)) return null;
  const rate = discountRatePct;
  const totals = SCENARIOS.map((key) => ({
    key,
    parts: sourceTotals(result.scenarios[key], rate ?? 0),
  }));
  const money = (amount: { toFixed(): string }) => formatMoney(amount.toFixed(), result.currency);
  const all = (parts: SourceTotal[], pick: (p: SourceTotal) => SourceTotal["sum"]) =>
    money(parts.reduce((acc, p) => acc.plus(pick(p)), parts[0].sum.mul(0)));
  const discounted = rate !== null;
  return (
    <Table
      caption={
        discounted
          ? `Value by source over the horizon for each scenario, plain and discounted at ${rate} %`
          : "Value by source over the horizon for each scenario"
      }
    >
      <thead>
        <tr>
          <Th>Source</Th>
          {SCENARIOS.map((k) => (
            <Th key={k} className="text-right">
              {SCENARIO_LABELS[k]}
            </Th>
          ))}
          {discounted
            ? SCENARIOS.map((k) => (
                <Th key={`${k}-discounted`} className="text-right">
                  {SCENARIO_LABELS[k]}, discounted
                </Th>
              ))
            : null}
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {VALUE_SOURCES.map((source, i) => (
          <tr key={source}>
            <Th scope="row" className="bg-white font-normal whitespace-nowrap">
              {VALUE_SOURCE_LABELS[source]}
            </Th>
            {totals.map(({ key, parts }) => (
              <Td key={key} className={CELL}>
                {money(parts[i].sum)}
              </Td>
            ))}
            {discounted
              ? totals.map(({ key, parts }) => (
                  <Td key={`${key}-discounted`} className={CELL}>
                    {money(parts[i].discounted)}
                  </Td>
                ))
              : null}
          </tr>
        ))}
        <tr className="border-t-2 border-steel-300">
          <Th scope="row" className="bg-white whitespace-nowrap">
            All sources
          </Th>
          {totals.map(({ key, parts }) => (
            <Td key={key} className={`${CELL} font-bold`}>
              {all(parts, (p) => p.sum)}
            </Td>
          ))}
          {discounted
            ? totals.map(({ key, parts }) => (
                <Td key={`${key}-discounted`} className={`${CELL} font-bold`}>
                  {all(parts, (p) => p.discounted)}
                </Td>
              ))
            : null}
        </tr>
        {discounted ? (
          <tr>
            <Th scope="row" className="bg-white font-normal whitespace-nowrap">
              Net present value (discounted, less the up-front cost)
            </Th>
            {SCENARIOS.map((k) => (
              <Td key={k} />
            ))}
            {SCENARIOS.map((k) => (
              <Td key={`${k}-npv`} className={CELL}>
                {formatMoney(result.scenarios[k].npv, result.currency)}
              </Td>
            ))}
          </tr>
        ) : null}
      </tbody>
    </Table>
  );
}
