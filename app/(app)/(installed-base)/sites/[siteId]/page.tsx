import type { Metadata } from "next";
import Link from "next/link";
import { AxesTable } from "@/components/installed-base/axes-table";
import { MachineForm } from "@/components/installed-base/machine-form";
import { MachinesTable } from "@/components/installed-base/machines-table";
import { ImportPanel } from "@/components/installed-base/import-panel";
import { PendingUndo } from "@/components/installed-base/pending-undo";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listAxes } from "@/db/queries/axes";
import { listImports } from "@/db/queries/imports";
import { getPendingUndo } from "@/db/queries/installed-base-delete";
import { listMachines } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { IMPORT_FIELDS } from "@/lib/import/fields";
import { firstParam, idParam, orNotFound, type SearchParams } from "@/lib/pages";
import { axisListParamsSchema } from "@/lib/validations/installed-base";
import { parseId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Site" };

export default async function SitePage({
  params,
  searchParams,
}: {
  params: Promise<{ siteId: string }>;
  searchParams: SearchParams;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const siteId = idParam((await params).siteId);
  const site = orNotFound(() => getSiteOrThrow(user, siteId));
  const raw = await searchParams;
  const listParams = axisListParamsSchema.parse({
    page: firstParam(raw.page),
    q: firstParam(raw.q),
    machineId: firstParam(raw.machine),
    sort: firstParam(raw.sort),
    dir: firstParam(raw.dir),
  });
  const columns = ([] as string[]).concat(raw.col ?? []);
  const machines = listMachines(user, siteId);
  const axes = listAxes(user, siteId, listParams);
  const history = listImports(user, siteId);
  // A machine or an axis deleted from its page lands here with its undo.
  const deletedId = parseId(firstParam(raw.deleted));
  const pending = deletedId ? getPendingUndo(user, deletedId) : null;

  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/accounts", label: "Accounts" },
          { href: `/accounts/${site.accountId}`, label: site.accountName },
          { label: site.name },
        ]}
      />
      <PendingUndo pending={pending} />
      <PageHeader
        title={site.name}
        lead={`Tariff ${site.tariffPerKWh} ${site.currency}/kWh · ${site.hoursPerYear.toLocaleString("en")} h/year · ambient ${site.ambientC} °C · grid ${site.gridKgCo2PerKWh} kg CO₂/kWh`}
        actions={
          <div className="flex gap-2">
            <Link href={`/sites/${siteId}/edit`} className={buttonClass("secondary")}>
              Edit site
            </Link>
            <Link href={`/sites/${siteId}/axes/new`} className={buttonClass("primary")}>
              Add axis
            </Link>
          </div>
        }
      />
      <Panel title="Import axes from a spreadsheet">
        <ImportPanel
          siteId={siteId}
          history={history}
          fields={IMPORT_FIELDS.map((f) => ({ key: f.key, label: f.label }))}
        />
      </Panel>
      <Panel title={`Axes (${axes.total.toLocaleString("en")})`}>
        <AxesTable
          siteId={siteId}
          machines={machines}
          result={axes}
          params={listParams}
          columns={columns}
        />
      </Panel>
      <Panel title={`Machines (${machines.length})`}>
        <MachinesTable machines={machines} siteId={siteId} currency={site.currency} />
        <details className="mt-4">
          <summary className="cursor-pointer font-bold text-flux-700">Add a machine</summary>
          <div className="mt-4">
            <MachineForm siteId={siteId} />
          </div>
        </details>
      </Panel>
    </div>
  );
}
