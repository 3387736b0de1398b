import type { Metadata } from "next";
import Link from "next/link";
import { EvidencePanel } from "@/components/evidence/evidence-panel";
import { DeleteDialog } from "@/components/installed-base/delete-dialog";
import { DuplicateMachineForm } from "@/components/installed-base/duplicate-machine-form";
import { MachineAxesTable } from "@/components/installed-base/machine-axes-table";
import { MachineForm } from "@/components/installed-base/machine-form";
import { PendingUndo } from "@/components/installed-base/pending-undo";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listSubjectEvidence } from "@/db/queries/evidence";
import { getPendingUndo } from "@/db/queries/installed-base-delete";
import { describeImpact, machineDeletionImpact } from "@/db/queries/installed-base-impact";
import { listMachineAxes } from "@/db/queries/machine-series";
import { getMachineOrThrow, listMachines } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { flatParams } from "@/lib/lists/list-params";
import { machineEvidenceFigures } from "@/lib/evidence/figures";
import { idParam, orNotFound, type SearchParams } from "@/lib/pages";
import { machineAxisListSchema } from "@/lib/validations/installed-base";
import { parseId } from "@/lib/validations/ids";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Machine" };

// One machine: its figures, its axes (paged), and what can be done with it — edit, duplicate
// for the next machine of a series, delete.
export default async function MachinePage({
  params,
  searchParams,
}: {
  params: Promise<{ machineId: string }>;
  searchParams: SearchParams;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).machineId);
  const machine = orNotFound(() => getMachineOrThrow(user, id));
  const site = getSiteOrThrow(user, machine.siteId);
  const current = flatParams(await searchParams);
  const listParams = machineAxisListSchema.parse(current);
  const axes = listMachineAxes(user, id, listParams);
  const counts = listMachines(user, site.id).find((m) => m.id === id)!;
  const impact = machineDeletionImpact(user, id);
  // An axis deleted from its page lands here with its undo.
  const deletedId = parseId(current.deleted);
  const pending = deletedId ? getPendingUndo(user, deletedId) : null;

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
      <PendingUndo pending={pending} />
      <PageHeader
        title={machine.name}
        lead={`${site.name}${machine.line ? ` · ${machine.line}` : ""}`}
        actions={
          <div className="flex flex-wrap gap-2">
            <Link href={`/sites/${site.id}/axes/new`} className={buttonClass("secondary")}>
              Add axis
            </Link>
            <DeleteDialog
              kind="machine"
              id={id}
              name={machine.name}
              impact={describeImpact(impact)}
              afterHref={`/sites/${site.id}`}
            />
          </div>
        }
      />
      <Panel title="Figures">
        <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-small sm:grid-cols-[auto_1fr_auto_1fr]">
          <dt className="font-bold text-steel-800">Axis rows</dt>
          <dd className="tabular-nums">{counts.axisRows}</dd>
          <dt className="font-bold text-steel-800">Axes (with quantity)</dt>
          <dd className="tabular-nums">{counts.axisUnits}</dd>
          <dt className="font-bold text-steel-800">Retrofit downtime</dt>
          <dd className="tabular-nums">{machine.downtimeHours} h</dd>
          <dt className="font-bold text-steel-800">Throughput gain</dt>
          <dd className="tabular-nums">{machine.throughputGainPct} %</dd>
          <dt className="font-bold text-steel-800">Margin per output hour</dt>
          <dd className="tabular-nums">
            {machine.marginPerOutputHour} {site.currency}
          </dd>
          <dt className="font-bold text-steel-800">Open cases using its axes</dt>
          <dd className="tabular-nums">{impact.openCaseCount}</dd>
        </dl>
      </Panel>
      <Panel title="Sources of the added output">
        <EvidencePanel
          subjectType="machine"
          subjectId={id}
          figures={machineEvidenceFigures(machine, site.currency)}
          entries={listSubjectEvidence(user, "machine", id)}
        />
      </Panel>
      <Panel title={`Axes (${axes.total.toLocaleString("en")})`}>
        <MachineAxesTable machineId={id} result={axes} params={listParams} current={current} />
      </Panel>
      <Panel title="Duplicate this machine">
        <DuplicateMachineForm machineId={id} name={machine.name} />
      </Panel>
      <Panel title="Edit machine">
        <MachineForm siteId={site.id} machine={machine} />
      </Panel>
    </div>
  );
}
