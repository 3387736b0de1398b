import type { Metadata } from "next";
import { AxisForm } from "@/components/installed-base/axis-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { listMotors } from "@/db/queries/catalogue";
import { listMachines } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Add axis" };

export default async function NewAxisPage({ params }: { params: Promise<{ siteId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).siteId);
  const site = orNotFound(() => getSiteOrThrow(user, id));
  const machines = listMachines(user, site.id);
  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/accounts", label: "Accounts" },
          { href: `/accounts/${site.accountId}`, label: site.accountName },
          { href: `/sites/${site.id}`, label: site.name },
          { label: "Add axis" },
        ]}
      />
      <PageHeader
        title="Add an axis"
        lead="Datasheet values of the motor, the drive as it is set today, and how the axis runs."
      />
      {machines.length === 0 ? (
        <EmptyState title="Add a machine first">
          Every axis belongs to a machine of this site.
        </EmptyState>
      ) : (
        <Panel>
          <AxisForm
            siteId={site.id}
            machines={machines}
            defaults={site}
            motors={listMotors(user)}
          />
        </Panel>
      )}
    </div>
  );
}
