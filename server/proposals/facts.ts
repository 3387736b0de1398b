import "server-only";
import type { CaseInput } from "@/lib/engine";
import type { ProposalFacts } from "@/lib/mail/messages";
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
