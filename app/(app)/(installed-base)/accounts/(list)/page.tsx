import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { listAccounts } from "@/db/queries/accounts";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Accounts" };

export default async function AccountsPage() {
  const user = await requirePageUser(...VENDOR_ROLES);
  const accounts = listAccounts(user);
  return (
    <>
      <PageHeader
        title="Accounts"
        lead={
          user.role !== "engineer"
            ? "Every customer account, with its owning engineer."
            : "The customer accounts you own or that are shared with you."
        }
      />
      {accounts.length === 0 ? (
        <EmptyState title="No accounts yet">
          Accounts you own or that are shared with you appear here.
        </EmptyState>
      ) : (
        <Table caption="Customer accounts">
          <thead>
            <tr>
              <Th>Account</Th>
              <Th>Owner</Th>
              <Th className="text-right">Shared with</Th>
              <Th>Since</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {accounts.map((a) => (
              <tr key={a.id}>
                <Td className="font-bold">
                  <Link
                    href={`/accounts/${a.id}`}
                    className="text-flux-700 underline-offset-2 hover:underline"
                  >
                    {a.name}
                  </Link>
                </Td>
                <Td>{a.ownerId === user.id ? "You" : a.ownerName}</Td>
                <Td className="text-right tabular-nums">
                  {a.shareCount === 0
                    ? "—"
                    : `${a.shareCount} engineer${a.shareCount > 1 ? "s" : ""}`}
                </Td>
                <Td>{a.createdAt.slice(0, 10)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </>
  );
}
