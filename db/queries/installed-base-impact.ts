import { and, asc, count, countDistinct, eq, notInArray, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { axes, caseAxes, cases, machines, proposals } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import type { CaseStage } from "@/lib/cases/stages";
import { getAxisOrThrow } from "./axes";
import { getMachineOrThrow } from "./machines";
import { getSiteOrThrow } from "./sites";

// What goes with a site, a machine or an axis when it is deleted, counted in SQL so that the
// confirmation states it before anything is touched (docs/installed-base-deletes.md).

export type DeletionKind = "site" | "machine" | "axis";

export type DeletionImpact = {
  kind: DeletionKind;
  name: string;
  machineName?: string;
  machineCount: number;
  axisRows: number;
  openCaseCount: number;
  openCaseAxisRows: number;
  // Site only: cases on the site go with it (the case row cascades from the site).
  caseNames: string[];
  // Site only: cases whose issued proposals would be lost; while any exists the delete is refused.
  blockingCaseNames: string[];
};

// A case is open until it is decided; won and lost cases keep their proposals and need no notice.
export const CLOSED_CASE_STAGES = ["won", "lost"] as const satisfies readonly CaseStage[];
const openStage = notInArray(cases.stage, [...CLOSED_CASE_STAGES]);

// Open cases that use any axis matched by `which`, and how many of those axes they use.
function openCaseUse(which: SQL) {
  const [row] = db
    .select({ caseCount: countDistinct(caseAxes.caseId), axisRows: countDistinct(caseAxes.axisId) })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .innerJoin(cases, eq(cases.id, caseAxes.caseId))
    .where(and(which, openStage))
    .all();
  return { openCaseCount: row.caseCount, openCaseAxisRows: row.axisRows };
}

function axisRowCount(which: SQL) {
  return db.select({ n: count() }).from(axes).where(which).get()!.n;
}

export function siteDeletionImpact(caller: SessionUser, siteId: number): DeletionImpact {
  // Reviewers never delete: refused before the scope answers "not found".
  assertRole(caller, ...VENDOR_ROLES);
  const site = getSiteOrThrow(caller, siteId);
  const caseRows = casesOfSite(siteId);
  return {
    kind: "site",
    name: site.name,
    machineCount: db.select({ n: count() }).from(machines).where(eq(machines.siteId, siteId)).get()!
      .n,
    axisRows: axisRowCount(eq(axes.siteId, siteId)),
    ...openCaseUse(eq(axes.siteId, siteId)),
    caseNames: caseRows.map((c) => c.name),
    blockingCaseNames: caseRows.filter((c) => c.proposalCount > 0).map((c) => c.name),
  };
}

// A site's cases with their proposal count. The join to cases is direct (a join keeps drizzle
// naming the outer table in the correlated subquery; see listMachines).
export function casesOfSite(siteId: number) {
  const counts = db
    .select({ caseId: proposals.caseId, n: count().as("n") })
    .from(proposals)
    .groupBy(proposals.caseId)
    .as("proposal_counts");
  return db
    .select({
      id: cases.id,
      name: cases.name,
      proposalCount: sql<number>`coalesce(${counts.n}, 0)`,
    })
    .from(cases)
    .leftJoin(counts, eq(counts.caseId, cases.id))
    .where(eq(cases.siteId, siteId))
    .orderBy(asc(cases.name))
    .all();
}

export function machineDeletionImpact(caller: SessionUser, machineId: number): DeletionImpact {
  // Reviewers never delete: refused before the scope answers "not found".
  assertRole(caller, ...VENDOR_ROLES);
  const machine = getMachineOrThrow(caller, machineId);
  return {
    kind: "machine",
    name: machine.name,
    machineCount: 1,
    axisRows: axisRowCount(eq(axes.machineId, machineId)),
    ...openCaseUse(eq(axes.machineId, machineId)),
    caseNames: [],
    blockingCaseNames: [],
  };
}

export function axisDeletionImpact(caller: SessionUser, axisId: number): DeletionImpact {
  // Reviewers never delete: refused before the scope answers "not found".
  assertRole(caller, ...VENDOR_ROLES);
  const axis = getAxisOrThrow(caller, axisId);
  const machine = db.select().from(machines).where(eq(machines.id, axis.machineId)).get()!;
  return {
    kind: "axis",
    name: axis.label,
    machineName: machine.name,
    machineCount: 0,
    axisRows: 1,
    ...openCaseUse(eq(axes.id, axisId)),
    caseNames: [],
    blockingCaseNames: [],
  };
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

const FROZEN = "Issued proposals keep their frozen figures.";

// The confirmation's sentences, in words (no ids).
export function describeImpact(impact: DeletionImpact): string {
  const cases =
    impact.openCaseCount === 0
      ? "No open case uses them."
      : `${plural(impact.openCaseCount, "open case uses", "open cases use")} ${plural(impact.openCaseAxisRows, "of them", "of them")} and will list ${impact.openCaseAxisRows === 1 ? "it" : "them"} as removed.`;
  switch (impact.kind) {
    case "axis": {
      const used =
        impact.openCaseCount === 0
          ? "No open case uses it."
          : `${plural(impact.openCaseCount, "open case uses", "open cases use")} it and will list it as removed.`;
      return `Deleting axis ${impact.name} on machine ${impact.machineName} removes it from the installed base. ${used} ${FROZEN}`;
    }
    case "machine":
      return `Deleting machine ${impact.name} removes its ${plural(impact.axisRows, "axis", "axes")}. ${impact.axisRows === 0 ? "" : `${cases} `}${FROZEN}`;
    case "site": {
      const base = `Deleting site ${impact.name} removes its ${plural(impact.machineCount, "machine", "machines")} and ${plural(impact.axisRows, "axis", "axes")}`;
      if (impact.blockingCaseNames.length > 0) return `${base}. ${siteBlockedMessage(impact)}`;
      const goes =
        impact.caseNames.length === 0
          ? "No case is built on it."
          : `Its ${plural(impact.caseNames.length, "case", "cases")} without proposals ${impact.caseNames.length === 1 ? "goes" : "go"} with it: ${impact.caseNames.join(", ")}.`;
      return `${base}, and its import history. ${goes}`;
    }
  }
}

export function siteBlockedMessage(impact: Pick<DeletionImpact, "name" | "blockingCaseNames">) {
  const names = impact.blockingCaseNames.join(", ");
  return `Site ${impact.name} cannot be deleted: ${impact.blockingCaseNames.length === 1 ? "its case" : "its cases"} ${names} ${impact.blockingCaseNames.length === 1 ? "holds" : "hold"} issued proposals, which would be lost with the site. Archive the account instead to take it out of the working lists.`;
}

/** The (open case, axis) pairs among the axes matched by `which`, for the removal notices. */
export function openCaseAxisRows(which: SQL) {
  return db
    .select({ caseId: caseAxes.caseId, axisLabel: axes.label, machineName: machines.name })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .innerJoin(machines, eq(machines.id, axes.machineId))
    .innerJoin(cases, eq(cases.id, caseAxes.caseId))
    .where(and(which, openStage))
    .orderBy(asc(caseAxes.caseId), asc(axes.id))
    .all();
}
