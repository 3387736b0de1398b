import type { Metadata } from "next";
import { AxisForm } from "@/components/installed-base/axis-form";
import { EvidencePanel } from "@/components/evidence/evidence-panel";
import { DeleteDialog } from "@/components/installed-base/delete-dialog";
import { axisToFormValues } from "@/components/installed-base/axis-form-values";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getAxisOrThrow } from "@/db/queries/axes";
import { listSubjectEvidence } from "@/db/queries/evidence";
import { listAxisEventPricing } from "@/db/queries/axis-event-pricing";
import { listMotors } from "@/db/queries/catalogue";
import { axisDeletionImpact, describeImpact } from "@/db/queries/installed-base-impact";
import { listMachines } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { axisEvidenceFigures } from "@/lib/evidence/figures";

export const metadata: Metadata = { title: "Edit axis" };

export default async function EditAxisPage({ params }: { params: Promise<{ axisId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).axisId);
  const axis = orNotFound(() => getAxisOrThrow(user, id));
  const site = getSiteOrThrow(user, axis.siteId);
  const machines = listMachines(user, site.id);
  // A retired motor stays a choice for the axis that already names it.
  const motors = listMotors(user, { includeRetired: true }).filter(
    (m) => m.active || m.id === axis.referenceMotorId,
  );
  const impact = axisDeletionImpact(user, id);
  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/accounts", label: "Accounts" },
          { href: `/accounts/${site.accountId}`, label: site.accountName },
          { href: `/sites/${site.id}`, label: site.name },
          { label: axis.label },
        ]}
      />
      <PageHeader
        title={`Edit ${axis.label}`}
        lead="Values in SI units as stored; pick another unit beside a torque to enter it in that unit."
        actions={
          <DeleteDialog
            kind="axis"
            id={axis.id}
            name={axis.label}
            impact={describeImpact(impact)}
            afterHref={`/machines/${axis.machineId}`}
          />
        }
      />
      <Panel>
        <AxisForm
          siteId={site.id}
          machines={machines}
          axis={{ id: axis.id, values: axisToFormValues(axis) }}
          defaults={site}
          motors={motors}
          eventPricing={listAxisEventPricing(user, axis.id)}
        />
      </Panel>
      <Panel title="Sources of the step-loss figures">
        <EvidencePanel
          subjectType="axis"
          subjectId={axis.id}
          figures={axisEvidenceFigures(axis, site.currency)}
          entries={listSubjectEvidence(user, "axis", axis.id)}
        />
      </Panel>
    </div>
  );
}
