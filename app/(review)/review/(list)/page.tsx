import type { Metadata } from "next";
import Link from "next/link";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { listVisibleQuotes, reviewerView } from "@/db/queries/proposals";
import { requirePageUser } from "@/server/auth";
import { formatMoney, formatPayback } from "@/lib/results/format";
import { FINANCE_TERMS } from "@/lib/glossary";

export const metadata: Metadata = { title: "Proposals for review" };

export default async function ReviewHome() {
  const user = await requirePageUser("reviewer");
  const account = user.accountId ? getAccountOrThrow(user, user.accountId) : null;
  const proposals = listVisibleQuotes(user).map(reviewerView);
  const waiting = proposals.filter((p) => p.stage === "sent").length;
  return (
    <div className="space-y-6">
      <PageHeader
        title="Proposals for review"
        lead={`Retrofit proposals sent to ${account?.name ?? "your company"}. Check the payback, try your own tariff or discount rate, and decide.`}
      />
      {proposals.length === 0 ? (
        <EmptyState title="No proposals have been sent to you yet">
          When your supplier sends a proposal, it appears here and you receive an e-mail with a
          link.
        </EmptyState>
      ) : (
        <Panel
          title={
            waiting
              ? `${waiting} proposal${waiting === 1 ? "" : "s"} waiting for your decision`
              : "Proposals"
          }
        >
          <Table caption="Proposals sent to you">
            <thead>
              <tr>
                <Th>Proposal</Th>
                <Th>Site</Th>
                <Th>Status</Th>
                <Th className="text-right">{FINANCE_TERMS.upFrontCost}</Th>
                <Th className="text-right">{FINANCE_TERMS.estimatedPayback}</Th>
                <Th>Sent (UTC)</Th>
                <Th>From</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {proposals.map((p) => (
                <tr key={p.id}>
                  <Td className="font-bold">
                    <Link
                      href={`/review/proposals/${p.id}`}
                      className="text-flux-700 hover:underline"
                    >
                      {p.caseName}, version {p.version}
                    </Link>
                  </Td>
                  <Td>{p.siteName}</Td>
                  <Td>
                    <QuoteStageBadge stage={p.stage} />
                  </Td>
                  <NumberTd>{formatMoney(p.value, p.currency)}</NumberTd>
                  <NumberTd>{formatPayback(p.paybackYears)}</NumberTd>
                  <Td className="whitespace-nowrap tabular-nums">{p.sentAt?.slice(0, 10)}</Td>
                  <Td>{p.ownerName}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Panel>
      )}
    </div>
  );
}
