import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import type { CaseResult } from "@/lib/engine";
import { valueBySource } from "@/lib/results/engine-v2";
import { formatMoney } from "@/lib/results/format";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { relianceSentence, valueReliance } from "@/lib/results/value-reliance";

/**
 * Each year's flow of the physics scenario split by where the money comes from, so that finance
 * can reconcile it line by line; the last row is the cash flow the rows add up to.
 */
export function ValueBySourceTable({ result }: { result: CaseResult }) {
  const table = valueBySource(result.scenarios.physics, result.currency);
  if (!table) return null;
  const years = table.flows?.years.length ?? 0;
  const money = (amount: string) => formatMoney(amount, result.currency);
  const reliance = valueReliance(result.scenarios.physics);
  return (
    <Panel title="Value by source, year by year">
      <p className="mb-3 text-small text-steel-700">
        {SCENARIO_LABELS.physics}. Energy and cooling follow the tariff and its escalation; the
        other sources follow inflation. Tax is what the flows owe after depreciation (a negative
        amount is a shield); sources that are zero in every year are left out.
      </p>
      {reliance ? (
        <p className="mb-3 text-small text-steel-900">{relianceSentence(reliance)}</p>
      ) : null}
      <Table
        caption={`Value of the ${SCENARIO_LABELS.physics.toLowerCase()} by source and year, with the yearly cash flow they add up to`}
      >
        <thead>
          <tr>
            <Th>Source</Th>
            {Array.from({ length: years }, (_, i) => (
              <Th key={i} className="text-right whitespace-nowrap">
                Year {i + 1}
              </Th>
            ))}
            <Th className="text-right">Total</Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {table.rows.map((row) => (
            <tr key={row.source}>
              <Th scope="row" className="bg-white font-normal whitespace-nowrap">
                {row.label}
              </Th>
              {row.years.map((y, i) => (
                <Td key={i} className="text-right tabular-nums whitespace-nowrap">
                  {money(y)}
                </Td>
              ))}
              <Td className="text-right font-bold tabular-nums whitespace-nowrap">
                {money(row.total)}
              </Td>
            </tr>
          ))}
          {table.flows ? (
            <tr className="border-t-2 border-steel-300">
              <Th scope="row" className="bg-white whitespace-nowrap">
                {table.flows.label}
              </Th>
              {table.flows.years.map((y, i) => (
                <Td key={i} className="text-right font-bold tabular-nums whitespace-nowrap">
                  {money(y)}
                </Td>
              ))}
              <Td className="text-right font-bold tabular-nums whitespace-nowrap">
                {money(table.flows.total)}
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
    </Panel>
  );
}
