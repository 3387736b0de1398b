import type { Metadata } from "next";
import Link from "next/link";
import { SiteForm } from "@/components/installed-base/site-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { listSites } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage({ params }: { params: Promise<{ accountId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const accountId = idParam((await params).accountId);
  const account = orNotFound(() => getAccountOrThrow(user, accountId));
  const sites = listSites(user, accountId);
  return (
    <div className="space-y-6">
      <Breadcrumbs items={[{ href: "/accounts", label: "Accounts" }, { label: account.name }]} />
      <PageHeader
        title={account.name}
        lead="The customer's plants. Open a site to see its machines and axes, or import them from a spreadsheet."
      />
      <Panel title="Sites">
        {sites.length === 0 ? (
          <EmptyState title="No sites yet">Add the customer&apos;s first plant below.</EmptyState>
        ) : (
          <Table caption={`Sites of ${account.name}`}>
            <thead>
              <tr>
                <Th>Site</Th>
                <Th>Tariff</Th>
                <Th className="text-right">Hours / year</Th>
                <Th className="text-right">Ambient</Th>
                <Th className="text-right">Machines</Th>
                <Th className="text-right">Axes</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {sites.map((s) => (
                <tr key={s.id}>
                  <Td className="font-bold">
                    <Link
                      href={`/sites/${s.id}`}
                      className="text-flux-700 underline-offset-2 hover:underline"
                    >
                      {s.name}
                    </Link>
                  </Td>
                  <Td className="tabular-nums">
                    {s.tariffPerKWh} {s.currency}/kWh
                  </Td>
                  <Td className="text-right tabular-nums">{s.hoursPerYear.toLocaleString("en")}</Td>
                  <Td className="text-right tabular-nums">{s.ambientC} °C</Td>
                  <Td className="text-right tabular-nums">{s.machineCount}</Td>
                  <Td className="text-right tabular-nums">{s.axisCount}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>
      <Panel title="Add a site">
        <SiteForm accountId={accountId} />
      </Panel>
    </div>
  );
}
