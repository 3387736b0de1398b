import type { Metadata } from "next";
import { MachineForm } from "@/components/installed-base/machine-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getMachineOrThrow } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Edit machine" };

export default async function EditMachinePage({
  params,
}: {
  params: Promise<{ machineId: string }>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).machineId);
  const machine = orNotFound(() => getMachineOrThrow(user, id));
  const site = getSiteOrThrow(user, machine.siteId);
  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/accounts", label: "Accounts" },
          { href: `/accounts/${site.accountId}`, label: site.accountName },
          { href: `/sites/${site.id}`, label: site.name },
          { label: machine.name },
        ]}
      />
      <PageHeader title={`Edit ${machine.name}`} />
      <Panel>
        <MachineForm siteId={site.id} machine={machine} />
      </Panel>
    </div>
  );
}
