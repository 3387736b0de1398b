import Link from "next/link";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import type { ProposalSummary } from "@/db/queries/proposal-versions";
import { Table, Td, Th } from "@/components/ui/table";
import { formatMoney, formatPayback } from "@/lib/results/format";
import { FINANCE_TERMS, SCENARIO_LABELS } from "@/lib/glossary";

// Frozen versions, newest first, each with its stage with the customer and what changed since the
// one before; the version opens the proposal's page (sending, conversation, quote).
export function ProposalsList({ proposals }: { proposals: ProposalSummary[] }) {
  if (!proposals.length)
    return (
      <p className="text-small text-steel-700">
        No proposal yet. Freeze the case when its figures are ready to send.
      </p>
    );
  return (
    <Table caption="Proposal versions">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Stage</Th>
          <Th>Frozen (UTC)</Th>
          <Th>By</Th>
          <Th className="text-right">{FINANCE_TERMS.upFrontCost}</Th>
          <Th className="text-right">NPV ({SCENARIO_LABELS.physics.toLowerCase()})</Th>
          <Th className="text-right">Payback</Th>
          <Th>What changed</Th>
          <Th>Workbook</Th>
          <Th>Dossier</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {[...proposals].reverse().map((p) => (
          <tr key={p.id}>
            <Td className="font-bold">
              <Link href={`/proposals/${p.id}`} className="text-flux-700 hover:underline">
                v{p.version}
              </Link>
            </Td>
            <Td>
              <QuoteStageBadge stage={p.stage} />
            </Td>
            <Td className="whitespace-nowrap tabular-nums">
              {p.createdAt.replace("T", " ").slice(0, 16)}
            </Td>
            <Td>{p.createdByName}</Td>
            <Td className="text-right tabular-nums">{formatMoney(p.capex, p.currency)}</Td>
            <Td className="text-right tabular-nums">{formatMoney(p.npv, p.currency)}</Td>
            <Td className="text-right tabular-nums">{formatPayback(p.paybackYears)}</Td>
            <Td>
              <ul className="list-disc pl-4 text-small">
                {p.changes.slice(0, 6).map((c, i) => (
                  <li key={i}>{c}</li>
                ))}
              </ul>
            </Td>
            <Td>
              <a
                href={`/api/v1/proposals/${p.id}/workbook`}
                className="font-bold text-flux-700 hover:underline"
              >
                .xlsx
              </a>
            </Td>
            <Td>
              <a href={`/dossiers/${p.id}`} className="font-bold text-flux-700 hover:underline">
                Dossier
              </a>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
