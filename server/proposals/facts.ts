import "server-only";
import type { CaseInput, CaseResult } from "@/lib/engine";
import type { ProposalFacts, ProposalValue } from "@/lib/mail/messages";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { sourceTotals } from "@/lib/results/source-totals";
import { valueReliance } from "@/lib/results/value-reliance";
import { Money } from "@/lib/engine/money";
import type { QuoteRow } from "@/db/queries/proposals";

/** The figures a message quotes about a proposal. */
export function proposalFacts(quote: QuoteRow, input: CaseInput): ProposalFacts {
  return {
    accountName: quote.accountName,
    caseName: quote.caseName,
    version: quote.version,
    capex: quote.value,
    currency: quote.currency,
    paybackYears: quote.paybackYears,
    horizonYears: input.finance.horizonYears ?? 5,
  };
}

/**
 * Where the engineering estimate's value comes from, for the message that sends the proposal:
 * the sources over the horizon that are not nil, largest first (lib/results/source-totals.ts, as
 * the screens add them). Null for a result that predates value by source (engine 1.0.0).
 */
export function proposalValue(result: CaseResult): ProposalValue | null {
  const physics = result.scenarios.physics;
  if (!physics.bySource) return null;
  // Only the plain sums are quoted, so the discount rate does not matter here.
  const totals = sourceTotals(physics, 0).filter((t) => !t.sum.isZero());
  totals.sort((a, b) => b.sum.abs().comparedTo(a.sum.abs()));
  const reliance = valueReliance(physics);
  return {
    sources: totals.map((t) => ({ label: VALUE_SOURCE_LABELS[t.source], amount: t.sum.toFixed() })),
    total: totals.reduce((acc, t) => acc.plus(t.sum), new Money(0)).toFixed(),
    npv: physics.npv,
    mostlyTypedPct: reliance?.mostlyTyped ? reliance.typedPct : null,
  };
}
