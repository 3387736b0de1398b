import { Panel } from "@/components/ui/panel";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { formatMoney, formatNumber } from "@/lib/results/format";
import { machineFigures } from "@/lib/results/machine-figures";
import { FINANCE_TERMS } from "@/lib/glossary";

/** What each machine's retrofit costs and saves, all units of its axes counted. */
export function MachineFiguresTable({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const rows = machineFigures(result, input);
  const currency = result.currency;
  return (
    <Panel title="Figures by machine">
      <Table caption={`Retrofit cost and yearly savings by machine, amounts in ${currency}`}>
        <thead>
          <tr>
            <Th>Machine</Th>
            <Th className="text-right">Axes</Th>
            <Th className="text-right">
              {FINANCE_TERMS.upFrontCost} [{currency}]
            </Th>
            <Th className="text-right">Energy today [kWh/yr]</Th>
            <Th className="text-right">Energy closed loop [kWh/yr]</Th>
            <Th className="text-right">Saved [kWh/yr]</Th>
            <Th className="text-right">Extra output margin [{currency}/yr]</Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {rows.map((r) => (
            <tr key={r.machineId}>
              <Td className="font-bold">{r.name}</Td>
              <Td className="text-right tabular-nums">{r.axisCount}</Td>
              <NumberTd>{formatMoney(r.capex, currency)}</NumberTd>
              <Td className="text-right tabular-nums">{formatNumber(r.beforeKWhPerYear, 0)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(r.afterKWhPerYear, 0)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(r.savedKWhPerYear, 0)}</Td>
              <NumberTd>{formatMoney(r.throughputPerYear, currency)}</NumberTd>
            </tr>
          ))}
        </tbody>
      </Table>
    </Panel>
  );
}
