"use client";

import { useId, useMemo, useState } from "react";
import { Field, Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { valueByMachine, type CaseResult, type ParsedCase } from "@/lib/engine";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { formatMoney } from "@/lib/results/format";
import {
  VALUE_MEASURES,
  VALUE_MEASURE_LABELS,
  machineValueTable,
  type ScenarioKey,
  type ValueMeasure,
} from "@/lib/results/machine-value";

const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;

/**
 * Each machine's share of the value by source, with the case-wide part and the total the engine
 * gives for the case, so finance can see which machine earns what (lib/results/machine-value.ts).
 */
export function ValueByMachineTable({
  result,
  input,
}: {
  result: CaseResult;
  input: ParsedCase | null;
}) {
  const id = useId();
  const [scenario, setScenario] = useState<ScenarioKey>("physics");
  const [measure, setMeasure] = useState<ValueMeasure>("horizon");
  // One split covers every scenario; it is redone only when a new result arrives.
  const split = useMemo(() => {
    if (!input || !result.scenarios.physics.bySource) return null;
    try {
      return valueByMachine(result, input);
    } catch {
      // A result and input that do not belong together (mid-update): nothing to split yet.
      return null;
    }
  }, [result, input]);
  if (!input || !split) return null;
  const table = machineValueTable(result, input, scenario, split);
  const money = (amount: { toFixed(): string }) => formatMoney(amount.toFixed(), result.currency);
  const rate = input.finance.discountRatePct;
  const caption = `Value of the ${SCENARIO_LABELS[scenario].toLowerCase()} by machine and source, ${VALUE_MEASURE_LABELS[measure].toLowerCase()}${measure === "discounted" ? ` at ${rate} %` : ""}`;

  return (
    <Panel title="Value by machine">
      <p className="mb-3 text-small text-steel-700">
        Where each machine&apos;s value comes from. The case-wide row holds what belongs to no
        single machine: the service cost, and the tax on it less the depreciation of the one-time
        project cost. Each machine is taxed on its own value less the depreciation of its own
        installed cost. The last row is the case&apos;s figure; each amount is rounded to the cent
        on its own, so the rows can differ from it by a cent.
      </p>
      <div className="mb-3 flex flex-wrap gap-4">
        <div className="w-full sm:w-64">
          <Field id={`${id}-scenario`} label="Scenario">
            <Select
              id={`${id}-scenario`}
              value={scenario}
              onChange={(e) => setScenario(e.target.value as ScenarioKey)}
            >
              {SCENARIOS.map((k) => (
                <option key={k} value={k}>
                  {SCENARIO_LABELS[k]}
                </option>
              ))}
            </Select>
          </Field>
        </div>
        <div className="w-full sm:w-72">
          <Field id={`${id}-measure`} label="Amounts">
            <Select
              id={`${id}-measure`}
              value={measure}
              onChange={(e) => setMeasure(e.target.value as ValueMeasure)}
            >
              {VALUE_MEASURES.map((m) => (
                <option key={m} value={m}>
                  {m === "discounted"
                    ? `${VALUE_MEASURE_LABELS[m]} at ${rate} %`
                    : VALUE_MEASURE_LABELS[m]}
                </option>
              ))}
            </Select>
          </Field>
        </div>
      </div>
      <Table caption={caption}>
        <thead>
          <tr>
            <Th>Machine</Th>
            {table.sources.map((s) => (
              <Th key={s} className="text-right">
                {VALUE_SOURCE_LABELS[s]}
              </Th>
            ))}
            <Th className="text-right">All sources</Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {table.rows.map((row) => {
            const strong = row.kind === "total";
            return (
              <tr key={row.key} className={strong ? "border-t-2 border-steel-300" : undefined}>
                <Th
                  scope="row"
                  className={`bg-white whitespace-nowrap ${strong ? "" : "font-normal"}`}
                >
                  {row.name}
                </Th>
                {table.sources.map((s) => (
                  <Td
                    key={s}
                    className={`text-right tabular-nums whitespace-nowrap ${strong ? "font-bold" : ""}`}
                  >
                    {money(row.values[measure][s])}
                  </Td>
                ))}
                <Td className="text-right font-bold tabular-nums whitespace-nowrap">
                  {money(row.all[measure])}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
    </Panel>
  );
}
