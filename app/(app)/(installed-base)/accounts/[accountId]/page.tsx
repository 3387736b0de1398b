import type { Metadata } from "next";
import Link from "next/link";
import { SharingPanel } from "@/components/accounts/sharing-panel";
import { SiteForm } from "@/components/installed-base/site-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { getAccountDetailOrThrow, listActiveEngineers } from "@/db/queries/accounts";
import { listSites } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { accountPermissions } from "@/lib/accounts/permissions";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage({ params }: { params: Promise<{ accountId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const accountId = idParam((await params).accountId);
  const account = orNotFound(() => getAccountDetailOrThrow(user, accountId));
  const sites = listSites(user, accountId);
  const permissions = accountPermissions(user, account.ownerId);
  const engineers = permissions.share || permissions.reassign ? listActiveEngineers(user) : [];
  return (
    <div className="space-y-6">
      <Breadcrumbs items={[{ href: "/accounts", label: "Accounts" }, { label: account.name }]} />
      <PageHeader
        title={account.name}
        lead="The customer's plants. Open a site to see its machines and axes, or import them from a spreadsheet."
      />
      {account.archivedAt ? (
        <section
          aria-label="Archived account"
          className="rounded-panel border border-caution-600 bg-caution-50 px-5 py-4 text-caution-700"
        >
          <p className="text-lead font-bold">Archived</p>
          <p className="mt-1">
            This account was archived on {account.archivedAt.slice(0, 10)}. It is off the accounts
            list and the site choice for new cases; its sites, cases, proposals and pipeline history
            stay readable. Restore it to add sites or cases.
          </p>
        </section>
      ) : null}
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
      {account.archivedAt ? null : (
        <Panel title="Add a site">
          <SiteForm accountId={accountId} />
        </Panel>
      )}
      <SharingPanel account={account} permissions={permissions} engineers={engineers} />
    </div>
  );
}
