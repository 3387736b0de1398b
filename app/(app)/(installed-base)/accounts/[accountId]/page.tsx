import type { Metadata } from "next";
import Link from "next/link";
import { SharingPanel } from "@/components/accounts/sharing-panel";
import { PendingUndo } from "@/components/installed-base/pending-undo";
import { SiteForm } from "@/components/installed-base/site-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { ListFilterForm } from "@/components/ui/list-filter-form";
import { Pager } from "@/components/ui/pager";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { getAccountDetailOrThrow, listActiveEngineers } from "@/db/queries/accounts";
import { getPendingUndo } from "@/db/queries/installed-base-delete";
import { listSitesPage } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { accountPermissions } from "@/lib/accounts/permissions";
import { flatParams, listHref } from "@/lib/lists/list-params";
import { idParam, orNotFound, type SearchParams } from "@/lib/pages";
import { parseId } from "@/lib/validations/ids";
import { siteListSchema } from "@/lib/validations/installed-base";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage({
  params,
  searchParams,
}: {
  params: Promise<{ accountId: string }>;
  searchParams: SearchParams;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const accountId = idParam((await params).accountId);
  const account = orNotFound(() => getAccountDetailOrThrow(user, accountId));
  const permissions = accountPermissions(user, account.ownerId);
  const engineers = permissions.share || permissions.reassign ? listActiveEngineers(user) : [];
  const { deleted, ...current } = flatParams(await searchParams);
  const listParams = siteListSchema.parse(current);
  const sites = listSitesPage(user, accountId, listParams);
  // A site deleted from its edit page lands here with its undo.
  const deletedId = parseId(deleted);
  const pending = deletedId ? getPendingUndo(user, deletedId) : null;
  const path = `/accounts/${accountId}`;
  const sortProps = {
    sort: listParams.sort,
    dir: listParams.dir,
    href: (column: string, dir: "asc" | "desc") => listHref(path, current, { sort: column, dir }),
  };
  return (
    <div className="space-y-6">
      <Breadcrumbs items={[{ href: "/accounts", label: "Accounts" }, { label: account.name }]} />
      <PendingUndo pending={pending} />
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
      <Panel title={`Sites (${sites.total.toLocaleString("en")})`}>
        <ListFilterForm
          action={path}
          label="Filter sites"
          className="mb-3"
          search={{
            id: "sites-q",
            label: "Site name contains",
            value: listParams.q,
            width: "w-56",
          }}
          keep={{ sort: listParams.sort, dir: listParams.dir }}
          submitLabel="Filter"
        />
        {sites.total === 0 && !listParams.q ? (
          <EmptyState title="No sites yet">Add the customer&apos;s first plant below.</EmptyState>
        ) : (
          <>
            <Table caption={`Sites of ${account.name}`}>
              <thead>
                <tr>
                  <SortHeader label="Site" column="name" {...sortProps} />
                  <Th>Tariff</Th>
                  <Th className="text-right">Hours / year</Th>
                  <Th className="text-right">Ambient</Th>
                  <SortHeader label="Machines" column="machines" {...sortProps} />
                  <SortHeader label="Axes (with quantity)" column="axes" {...sortProps} />
                </tr>
              </thead>
              <tbody className="divide-y divide-steel-100">
                {sites.rows.map((s) => (
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
                    <Td className="text-right tabular-nums">
                      {s.hoursPerYear.toLocaleString("en")}
                    </Td>
                    <Td className="text-right tabular-nums">{s.ambientC} °C</Td>
                    <Td className="text-right tabular-nums">{s.machineCount}</Td>
                    <Td className="text-right tabular-nums">{s.axisCount}</Td>
                  </tr>
                ))}
                {sites.rows.length === 0 ? (
                  <tr>
                    <Td colSpan={6} className="py-6 text-center text-steel-700">
                      No site matches.
                    </Td>
                  </tr>
                ) : null}
              </tbody>
            </Table>
            <Pager
              page={sites.page}
              pageCount={sites.pageCount}
              total={sites.total}
              noun={["site", "sites"]}
              href={(page) => listHref(path, current, { page })}
            />
          </>
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
