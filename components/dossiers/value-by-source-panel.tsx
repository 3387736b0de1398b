import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { VALUE_SOURCES, type CaseResult, type ParsedCase } from "@/lib/engine";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { formatMoney } from "@/lib/results/format";
import { sourceTotals } from "@/lib/results/source-totals";

const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;

/**
 * The dossier's value by source over the horizon, each scenario plain and discounted at the
 * case's rate (lib/results/source-totals.ts). The discounted total less the up-front cost is the
 * scenario's NPV, shown as the last row so that the reader can tie it to the headline.
 */
export function ValueBySourcePanel({ result, input }: { result: CaseResult; input: ParsedCase }) {
  const currency = result.currency;
  const rate = input.finance.discountRatePct;
  if (SCENARIOS.some((k) => !result.scenarios[k].bySource)) return null;
  const totals = SCENARIOS.map((k) => ({ key: k, parts: sourceTotals(result.scenarios[k], rate) }));
  const money = (amount: { toFixed(): string }) => formatMoney(amount.toFixed(), currency);
  const cell = "text-right tabular-nums whitespace-nowrap";
  return (
    <Panel title="Value by source over the horizon">
      <p className="mb-3 text-small text-steel-700">
        Each scenario&apos;s yearly value added over its {input.finance.horizonYears} years, as it
        stands and discounted at {rate} % a year. Tax is what the flows owe after depreciation (a
        negative amount is a shield).
      </p>
      <Table
        caption={`Value by source over the horizon for each scenario, plain and discounted at ${rate} %`}
      >
        <thead>
          <tr>
            <Th>Source</Th>
            {SCENARIOS.map((k) => (
              <Th key={k} className="text-right">
                {SCENARIO_LABELS[k]}
              </Th>
            ))}
            {SCENARIOS.map((k) => (
              <Th key={`${k}-discounted`} className="text-right">
                {SCENARIO_LABELS[k]}, discounted
              </Th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {VALUE_SOURCES.map((source, i) => (
            <tr key={source}>
              <Th scope="row" className="bg-white font-normal whitespace-nowrap">
                {VALUE_SOURCE_LABELS[source]}
              </Th>
              {totals.map(({ key, parts }) => (
                <Td key={key} className={cell}>
                  {money(parts[i].sum)}
                </Td>
              ))}
              {totals.map(({ key, parts }) => (
                <Td key={`${key}-discounted`} className={cell}>
                  {money(parts[i].discounted)}
                </Td>
              ))}
            </tr>
          ))}
          <tr className="border-t-2 border-steel-300">
            <Th scope="row" className="bg-white whitespace-nowrap">
              All sources
            </Th>
            {totals.map(({ key, parts }) => (
              <Td key={key} className={`${cell} font-bold`}>
                {money(parts.reduce((acc, p) => acc.plus(p.sum), parts[0].sum.mul(0)))}
              </Td>
            ))}
            {totals.map(({ key, parts }) => (
              <Td key={`${key}-discounted`} className={`${cell} font-bold`}>
                {money(parts.reduce((acc, p) => acc.plus(p.discounted), parts[0].sum.mul(0)))}
              </Td>
            ))}
          </tr>
          <tr>
            <Th scope="row" className="bg-white font-normal whitespace-nowrap">
              Net present value (discounted, less the up-front cost)
            </Th>
            {SCENARIOS.map((k) => (
              <Td key={k} />
            ))}
            {SCENARIOS.map((k) => (
              <Td key={`${k}-npv`} className={cell}>
                {formatMoney(result.scenarios[k].npv, currency)}
              </Td>
            ))}
          </tr>
        </tbody>
      </Table>
    </Panel>
  );
}
