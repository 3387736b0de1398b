"use client";

import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import type { CaseResult } from "@/lib/engine";
import { useWhatIf, WhatIfError } from "@/lib/hooks/use-what-if";
import { formatIrr, formatMoney, formatMoneyChange, formatPayback } from "@/lib/results/format";
import { SCENARIO_KEYS, scenarioLabel } from "@/lib/results/scenarios";
import Decimal from "decimal.js";
import { Term } from "@/components/ui/term";
import { ValueBySourceTable } from "@/components/results/value-by-source-table";
import { CashFlowChart } from "@/components/results/cash-flow-chart";
import { ValueBySourceChart } from "@/components/results/value-by-source-chart";
import { breakEvenLines } from "@/lib/results/engine-v2";
import { BreakEvenRow } from "@/components/results/break-even-row";
import type { WhatIfRequest } from "@/lib/validations/what-if";
import { readTypedDecimal } from "@/lib/validations/typed-number";

/** Where the sandbox's value comes from and where it breaks even, for the reviewer's figures. */
function SandboxDetail({
  result,
  tariffPerKWh,
  discountRatePct,
  band,
}: {
  result: CaseResult;
  tariffPerKWh: string;
  discountRatePct: number;
  band: { lowPct: number; highPct: number };
}) {
  const lines = breakEvenLines(result, tariffPerKWh);
  return (
    <div className="mt-5 grid grid-cols-[minmax(0,1fr)] gap-5" data-testid="what-if-detail">
      <h3 className="text-lead font-bold text-steel-900">With your figures</h3>
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-2">
        <CashFlowChart result={result} input={{ band }} />
        <ValueBySourceChart result={result} input={{ finance: { discountRatePct } }} />
      </div>
      <ValueBySourceTable result={result} />
      {lines ? (
        <dl aria-label="Break-even with your figures" className="divide-y divide-steel-100">
          {lines.map((line) => (
            <BreakEvenRow
              key={line.term}
              term={`${line.term} with your figures`}
              value={line.value}
              note={line.note}
            />
          ))}
        </dl>
      ) : null}
    </div>
  );
}

export type SandboxFinance = {
  tariffPerKWh: string;
  tariffEscalationPct: number;
  discountRatePct: number;
  horizonYears: number;
  taxRatePct: number;
};

/** Factors on what the proposal entered on every axis and machine; 1 is the proposal's own. */
type SandboxFactors = {
  runningHoursFactor: string;
  stepLossEventsFactor: string;
  costPerEventFactor: string;
  extraOutputFactor: string;
};
type SandboxKey = keyof SandboxFinance | keyof SandboxFactors;

const FIELDS: {
  key: SandboxKey;
  label: string;
  unit: (c: string) => string;
  step: string;
}[] = [
  { key: "tariffPerKWh", label: "Electricity tariff", unit: (c) => `${c}/kWh`, step: "0.001" },
  { key: "tariffEscalationPct", label: "Tariff escalation", unit: () => "% per year", step: "0.1" },
  { key: "discountRatePct", label: "Discount rate", unit: () => "% per year", step: "0.1" },
  { key: "horizonYears", label: "Horizon", unit: () => "years", step: "1" },
  { key: "taxRatePct", label: "Tax rate", unit: () => "%", step: "1" },
  { key: "runningHoursFactor", label: "Running hours", unit: () => "× entered", step: "0.1" },
  {
    key: "stepLossEventsFactor",
    label: "Step-loss events",
    unit: () => "× entered",
    step: "0.1",
  },
  { key: "costPerEventFactor", label: "Cost per event", unit: () => "× entered", step: "0.1" },
  { key: "extraOutputFactor", label: "Extra output", unit: () => "× entered", step: "0.1" },
];

const FACTORS: SandboxFactors = {
  runningHoursFactor: "1",
  stepLossEventsFactor: "1",
  costPerEventFactor: "1",
  extraOutputFactor: "1",
};

// Sent as typed: the route reads "0,24" as 0.24 and words a refusal with the field's name
// (lib/validations/in-words.ts); a blank box is the proposal's own figure.
function toRequest(values: Record<SandboxKey, string>): WhatIfRequest {
  const typed = (v: string) => (v.trim() === "" ? undefined : v.trim());
  return Object.fromEntries(
    (Object.keys(values) as SandboxKey[]).map((key) => [key, typed(values[key])]),
  ) as WhatIfRequest;
}

/**
 * A figure the reviewer computed with, as decimal text (the tariff for the break-even lines, the
 * discount rate for the discounted value by source): as typed when readable, else the proposal's.
 */
function sentFigure(text: string, proposal: string): string {
  const read = readTypedDecimal(text);
  return read.ok ? read.text : proposal;
}

/**
 * The sandbox: the reviewer's own finance figures and factors on what the proposal entered run through the
 * engine on the frozen proposal, shown beside the proposal's figures. Nothing is saved.
 */
export function WhatIfPanel({
  proposalId,
  proposal,
  finance,
  band,
}: {
  proposalId: number;
  proposal: CaseResult;
  finance: SandboxFinance;
  band: { lowPct: number; highPct: number };
}) {
  const inProposal: Record<SandboxKey, string> = {
    ...FACTORS,
    tariffPerKWh: finance.tariffPerKWh,
    tariffEscalationPct: String(finance.tariffEscalationPct),
    discountRatePct: String(finance.discountRatePct),
    horizonYears: String(finance.horizonYears),
    taxRatePct: String(finance.taxRatePct),
  };
  const initial = inProposal;
  const [values, setValues] = useState(initial);
  const [computedTariff, setComputedTariff] = useState(finance.tariffPerKWh);
  const [computedRate, setComputedRate] = useState(finance.discountRatePct);
  const whatIf = useWhatIf(proposalId);
  const error = whatIf.error instanceof WhatIfError ? whatIf.error : null;
  const currency = proposal.currency;
  const mine = whatIf.data;

  return (
    <Panel title="Try your own figures">
      <p className="mb-4 text-small text-steel-700">
        Change the finance figures, or scale what the proposal entered (0.5 halves the step-loss
        events on every axis), and see the payback move. This is a sandbox: the proposal itself and
        its workbook stay exactly as sent.
      </p>
      <form
        aria-label="What-if figures"
        onSubmit={(e) => {
          e.preventDefault();
          setComputedTariff(sentFigure(values.tariffPerKWh, finance.tariffPerKWh));
          setComputedRate(
            Number(sentFigure(values.discountRatePct, String(finance.discountRatePct))),
          );
          whatIf.mutate(toRequest(values));
        }}
        className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4"
        noValidate
      >
        {FIELDS.map((f) => (
          <Field
            key={f.key}
            id={`what-if-${f.key}`}
            label={`${f.label} [${f.unit(currency)}]`}
            hint={`In the proposal: ${inProposal[f.key]}`}
            error={error?.fields[f.key]}
          >
            <Input
              id={`what-if-${f.key}`}
              type="text"
              inputMode="decimal"
              value={values[f.key]}
              invalid={!!error?.fields[f.key]}
              onChange={(e) => setValues((v) => ({ ...v, [f.key]: e.target.value }))}
            />
          </Field>
        ))}
        <div className="flex flex-wrap items-center gap-3 sm:col-span-2 lg:col-span-4">
          <Button type="submit" disabled={whatIf.isPending}>
            {whatIf.isPending ? "Computing…" : "Compute with these figures"}
          </Button>
          <Button
            variant="ghost"
            onClick={() => {
              setValues(initial);
              whatIf.reset();
            }}
          >
            Back to the proposal&apos;s figures
          </Button>
          <p aria-live="polite" role="status" className="text-small font-bold text-danger-700">
            {whatIf.isError
              ? error && Object.keys(error.fields).length > 0
                ? "Check the figures marked above; nothing was computed."
                : (error?.message ?? "The sandbox could not be reached. Try again.")
              : null}
          </p>
        </div>
      </form>

      <div className="mt-5">
        <Table caption="The proposal's figures beside your what-if">
          <thead>
            <tr>
              <Th>Scenario</Th>
              <Th>Figure</Th>
              <Th className="text-right">Proposal</Th>
              <Th className="text-right">Your figures</Th>
              <Th className="text-right">Difference</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {SCENARIO_KEYS.flatMap((key) => {
              const a = proposal.scenarios[key];
              const b = mine?.scenarios[key];
              const horizonA = a.cashFlows.length - 1;
              const horizonB = b ? b.cashFlows.length - 1 : horizonA;
              const rows: [string, string, string, string][] = [
                [
                  "NPV",
                  formatMoney(a.npv, currency),
                  b ? formatMoney(b.npv, currency) : "—",
                  b ? formatMoneyChange(new Decimal(b.npv).minus(a.npv).toFixed(), currency) : "",
                ],
                [
                  "Payback",
                  formatPayback(a.paybackYears, horizonA),
                  b ? formatPayback(b.paybackYears, horizonB) : "—",
                  "",
                ],
                [
                  "Discounted payback",
                  formatPayback(a.discountedPaybackYears, horizonA),
                  b ? formatPayback(b.discountedPaybackYears, horizonB) : "—",
                  "",
                ],
                ["IRR", formatIrr(a), b ? formatIrr(b) : "—", ""],
              ];
              return rows.map(([figure, before, after, change], i) => (
                <tr
                  key={`${key}-${figure}`}
                  className={i === 0 ? "border-t-2 border-steel-200" : ""}
                >
                  {i === 0 ? (
                    <Td rowSpan={rows.length} className="align-top font-bold">
                      <Term kind="scenario">{scenarioLabel(key, band)}</Term>
                      {key === "physics" ? (
                        <span className="mt-1 block">
                          <Badge tone="flux">Basis of the proposal</Badge>
                        </span>
                      ) : null}
                    </Td>
                  ) : null}
                  <Td>{figure}</Td>
                  <NumberTd>{before}</NumberTd>
                  <Td
                    className={`whitespace-nowrap text-right font-bold tabular-nums ${b ? "text-flux-800" : "text-steel-500"}`}
                    data-testid={`what-if-${key}-${figure.toLowerCase().replace(/ /g, "-")}`}
                  >
                    {after}
                  </Td>
                  <Td className="whitespace-nowrap text-right tabular-nums text-steel-700">
                    {change}
                  </Td>
                </tr>
              ));
            })}
          </tbody>
        </Table>
        {!mine ? (
          <p className="mt-2 text-small text-steel-600">
            Your figures appear here after you compute them.
          </p>
        ) : null}
      </div>
      {mine ? (
        <SandboxDetail
          result={mine}
          tariffPerKWh={computedTariff}
          discountRatePct={computedRate}
          band={band}
        />
      ) : null}
    </Panel>
  );
}
