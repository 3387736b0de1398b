import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import type { ParsedCase } from "@/lib/engine";
import { assumptionRows } from "@/lib/results/assumption-rows";

/** The assumptions the proposal was computed with, and where each comes from. */
export function AssumptionsList({ input }: { input: ParsedCase }) {
  return (
    <Panel title="Assumptions">
      <p className="mb-3 text-small text-steel-700">
        Savings and payback are estimates from these assumptions; the workbook lists every one of
        them beside the formulas that use them.
      </p>
      <Table caption="Assumptions of the proposal">
        <thead>
          <tr>
            <Th>Group</Th>
            <Th>Assumption</Th>
            <Th className="text-right">Value</Th>
            <Th>Where it comes from</Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {assumptionRows(input).map((r) => (
            <tr key={r.label}>
              <Td className="text-steel-700">{r.group}</Td>
              <Td>{r.label}</Td>
              <Td className="whitespace-nowrap text-right font-bold tabular-nums">{r.value}</Td>
              <Td className="text-small text-steel-700">{r.note}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Panel>
  );
}
