import type { Metadata } from "next";
import { DossierPriceForm } from "@/components/admin/dossier-price-form";
import { Badge } from "@/components/ui/badge";
import { PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { readDossierPrice } from "@/db/queries/dossiers";
import { listCheckouts } from "@/db/queries/payments";
import { requirePageUser } from "@/server/auth";
import { CHECKOUT_STATUS_LABELS } from "@/lib/glossary";
import { formatMoney } from "@/lib/results/format";

export const metadata: Metadata = { title: "Dossier price and payments" };

const STATUS_TONE = { open: "caution", complete: "success", expired: "neutral" } as const;

export default async function PaymentsPage() {
  const admin = await requirePageUser("admin");
  const price = readDossierPrice();
  const checkouts = listCheckouts(admin);
  return (
    <div className="space-y-8">
      <PageHeader
        title="Dossier price and payments"
        lead="What a dossier costs, and every checkout started for one."
      />
      <Panel title="Price">
        {price.isDefault ? (
          <p className="mb-3 text-small text-caution-700">
            No price set yet: checkouts use the invented list price shown below until you save one.
          </p>
        ) : null}
        <DossierPriceForm values={{ amount: price.amount, currency: price.currency }} />
      </Panel>
      <Panel title={`Checkouts (${checkouts.length})`}>
        {checkouts.length === 0 ? (
          <p className="text-small text-steel-700">No checkout started yet.</p>
        ) : (
          <Table caption="Checkouts, newest first">
            <thead>
              <tr>
                <Th>Started (UTC)</Th>
                <Th>Proposal</Th>
                <Th>Account</Th>
                <Th>Buyer</Th>
                <Th className="text-right">Amount</Th>
                <Th>Status</Th>
                <Th>Unlocked (UTC)</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {checkouts.map((c) => (
                <tr key={c.id}>
                  <Td className="whitespace-nowrap tabular-nums">
                    {c.createdAt.replace("T", " ").slice(0, 16)}
                  </Td>
                  <Td>
                    {c.caseName} v{c.version}
                  </Td>
                  <Td>{c.accountName}</Td>
                  <Td className="break-all">{c.buyerEmail}</Td>
                  <Td className="text-right tabular-nums">{formatMoney(c.amount, c.currency)}</Td>
                  <Td>
                    <Badge tone={STATUS_TONE[c.status]} term="checkout-status">
                      {CHECKOUT_STATUS_LABELS[c.status]}
                    </Badge>
                  </Td>
                  <Td className="whitespace-nowrap tabular-nums">
                    {c.grantedAt ? c.grantedAt.replace("T", " ").slice(0, 16) : "—"}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>
    </div>
  );
}
