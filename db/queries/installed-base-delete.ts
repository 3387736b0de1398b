import { and, eq, inArray, lt, or, type SQL } from "drizzle-orm";
import { db } from "@/db";
import {
  axes,
  caseAxes,
  caseRemovedAxes,
  cases,
  deletionUndo,
  imports,
  machines,
  sites,
} from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { getAccountOrThrow } from "./accounts";
import { recordAudit } from "./audit";
import {
  axisDeletionImpact,
  machineDeletionImpact,
  openCaseAxisRows,
  siteBlockedMessage,
  siteDeletionImpact,
  type DeletionImpact,
  type DeletionKind,
} from "./installed-base-impact";
import { getMachineOrThrow } from "./machines";
import { getSiteOrThrow } from "./sites";

// Deleting a site, a machine or an axis, and putting it back for a short while (undo).
// Rules (docs/installed-base-deletes.md):
// - whoever may edit the installed base may delete it; reviewers never (the scope checks refuse);
// - issued proposals hold their frozen input, so they need nothing from the rows deleted; a site
//   whose cases hold proposals is refused, because its case rows (and their proposals) cascade
//   from the site;
// - an open case that loses axes gets a case_removed_axes line per axis, in the same transaction;
// - the rows taken away are kept in deletion_undo for UNDO_SECONDS so the same user can restore
//   them with the same ids.

export const UNDO_SECONDS = 30;

// The tables a delete takes rows from, in the order they are put back (parents first).
const RESTORE_ORDER = [
  ["sites", sites],
  ["machines", machines],
  ["axes", axes],
  ["imports", imports],
  ["cases", cases],
  ["case_axes", caseAxes],
  ["case_removed_axes", caseRemovedAxes],
] as const;

type TableName = (typeof RESTORE_ORDER)[number][0];
type Payload = Partial<Record<TableName, unknown[]>> & { written_removed_axes?: number[] };

export type DeletionDone = { undoId: number; label: string; expiresAt: string };

const nowIso = () => new Date().toISOString();

function purgeExpired() {
  db.delete(deletionUndo).where(lt(deletionUndo.expiresAt, nowIso())).run();
}

// The (open case, axis) notices, written before the rows go; their ids are kept for undo.
function writeRemovalNotices(caller: SessionUser, which: SQL, removedWith: DeletionKind): number[] {
  const rows = openCaseAxisRows(which);
  if (rows.length === 0) return [];
  const written = db
    .insert(caseRemovedAxes)
    .values(rows.map((r) => ({ ...r, removedWith, removedById: caller.id })))
    .returning({ id: caseRemovedAxes.id })
    .all();
  return written.map((r) => r.id);
}

function keepForUndo(caller: SessionUser, kind: DeletionKind, label: string, payload: Payload) {
  const expiresAt = new Date(Date.now() + UNDO_SECONDS * 1000).toISOString();
  const [row] = db
    .insert(deletionUndo)
    .values({
      userId: caller.id,
      kind,
      label,
      payload: payload as Record<string, unknown[]>,
      expiresAt,
    })
    .returning({ id: deletionUndo.id })
    .all();
  return { undoId: row.id, label, expiresAt };
}

function auditDelete(caller: SessionUser, impact: DeletionImpact, where: string, id: number) {
  const parts = [`${impact.kind} "${impact.name}"${where}`];
  if (impact.kind !== "axis") parts.push(`${impact.axisRows} axis rows`);
  if (impact.kind === "site") parts.push(`${impact.caseNames.length} cases without proposals`);
  else parts.push(`${impact.openCaseCount} open cases list ${impact.openCaseAxisRows} as removed`);
  recordAudit({
    actor: caller,
    action: `${impact.kind}.delete`,
    targetType: impact.kind,
    targetId: id,
    detail: parts.join("; "),
  });
}

export function deleteAxis(caller: SessionUser, axisId: number): DeletionDone {
  const impact = axisDeletionImpact(caller, axisId);
  const which = eq(axes.id, axisId);
  return db.transaction(() => {
    purgeExpired();
    const payload: Payload = {
      axes: db.select().from(axes).where(which).all(),
      case_axes: db.select().from(caseAxes).where(eq(caseAxes.axisId, axisId)).all(),
    };
    payload.written_removed_axes = writeRemovalNotices(caller, which, "axis");
    db.delete(axes).where(which).run();
    auditDelete(caller, impact, ` on machine "${impact.machineName}"`, axisId);
    return keepForUndo(caller, "axis", `axis ${impact.name} on ${impact.machineName}`, payload);
  });
}

export function deleteMachine(caller: SessionUser, machineId: number): DeletionDone {
  const impact = machineDeletionImpact(caller, machineId);
  const machine = getMachineOrThrow(caller, machineId);
  const site = getSiteOrThrow(caller, machine.siteId);
  const which = eq(axes.machineId, machineId);
  return db.transaction(() => {
    purgeExpired();
    const payload: Payload = {
      machines: [machine],
      axes: db.select().from(axes).where(which).all(),
      case_axes: db
        .select()
        .from(caseAxes)
        .where(inArray(caseAxes.axisId, db.select({ id: axes.id }).from(axes).where(which)))
        .all(),
    };
    payload.written_removed_axes = writeRemovalNotices(caller, which, "machine");
    db.delete(machines).where(eq(machines.id, machineId)).run();
    auditDelete(caller, impact, ` of site "${site.name}"`, machineId);
    return keepForUndo(caller, "machine", `machine ${impact.name}`, payload);
  });
}

export function deleteSite(caller: SessionUser, siteId: number): DeletionDone {
  const impact = siteDeletionImpact(caller, siteId);
  if (impact.blockingCaseNames.length > 0) throw new ConflictError(siteBlockedMessage(impact));
  const site = getSiteOrThrow(caller, siteId);
  const siteCaseIds = db.select({ id: cases.id }).from(cases).where(eq(cases.siteId, siteId));
  const siteAxisIds = db.select({ id: axes.id }).from(axes).where(eq(axes.siteId, siteId));
  return db.transaction(() => {
    purgeExpired();
    // A proposal frozen between the confirmation and now still stops the delete.
    const again = siteDeletionImpact(caller, siteId);
    if (again.blockingCaseNames.length > 0) throw new ConflictError(siteBlockedMessage(again));
    const { accountName: _accountName, ...siteRow } = site;
    const payload: Payload = {
      sites: [siteRow],
      machines: db.select().from(machines).where(eq(machines.siteId, siteId)).all(),
      axes: db.select().from(axes).where(eq(axes.siteId, siteId)).all(),
      imports: db.select().from(imports).where(eq(imports.siteId, siteId)).all(),
      cases: db.select().from(cases).where(eq(cases.siteId, siteId)).all(),
      case_axes: db
        .select()
        .from(caseAxes)
        .where(or(inArray(caseAxes.caseId, siteCaseIds), inArray(caseAxes.axisId, siteAxisIds)))
        .all(),
      case_removed_axes: db
        .select()
        .from(caseRemovedAxes)
        .where(inArray(caseRemovedAxes.caseId, siteCaseIds))
        .all(),
    };
    // The site's cases go with it, so no notice is written for them (nor could be kept).
    db.delete(sites).where(eq(sites.id, siteId)).run();
    auditDelete(caller, impact, ` of account "${site.accountName}"`, siteId);
    return keepForUndo(caller, "site", `site ${impact.name}`, payload);
  });
}

// The pending undo of this user, while it lasts: what the "Deleted X. Undo" line shows.
export function getPendingUndo(caller: SessionUser, undoId: number) {
  const row = db
    .select({ id: deletionUndo.id, label: deletionUndo.label, expiresAt: deletionUndo.expiresAt })
    .from(deletionUndo)
    .where(and(eq(deletionUndo.id, undoId), eq(deletionUndo.userId, caller.id)))
    .get();
  return row && row.expiresAt > nowIso() ? row : null;
}

const CHUNK = 200;

// Puts rows back as they were (same ids); drizzle turns the JSON columns back into text.
function restoreRows(name: TableName, rows: unknown[]) {
  const table = RESTORE_ORDER.find(([n]) => n === name)![1];
  for (let i = 0; i < rows.length; i += CHUNK)
    db.insert(table)
      .values(rows.slice(i, i + CHUNK) as never[])
      .run();
}

// The parent a restored row hangs on must still be there and in the caller's reach.
function checkParent(caller: SessionUser, kind: DeletionKind, payload: Payload) {
  try {
    if (kind === "site")
      getAccountOrThrow(caller, (payload.sites![0] as { accountId: number }).accountId);
    if (kind === "machine")
      getSiteOrThrow(caller, (payload.machines![0] as { siteId: number }).siteId);
    if (kind === "axis")
      getMachineOrThrow(caller, (payload.axes![0] as { machineId: number }).machineId);
  } catch (error) {
    if (error instanceof NotFoundError)
      throw new ConflictError(
        `Cannot undo: the ${kind === "axis" ? "machine" : kind === "machine" ? "site" : "account"} it belonged to is gone.`,
      );
    throw error;
  }
}

function isConstraintError(error: unknown) {
  return (
    error instanceof Error &&
    "code" in error &&
    typeof error.code === "string" &&
    error.code.startsWith("SQLITE_CONSTRAINT")
  );
}

export function undoDeletion(caller: SessionUser, undoId: number) {
  assertRole(caller, ...VENDOR_ROLES);
  const entry = db.select().from(deletionUndo).where(eq(deletionUndo.id, undoId)).get();
  // An undo belongs to the person who deleted: to anyone else it does not exist, so its label
  // (a name from an account they may not see) never reaches them.
  if (!entry || entry.userId !== caller.id)
    throw new NotFoundError("Nothing to undo: the deletion has expired or was undone");
  if (entry.expiresAt <= nowIso())
    throw new ConflictError(
      `Too late to undo the deletion of ${entry.label}: undo lasts ${UNDO_SECONDS} seconds`,
    );
  const payload = entry.payload as Payload;
  checkParent(caller, entry.kind, payload);
  try {
    db.transaction(() => {
      const written = payload.written_removed_axes ?? [];
      if (written.length > 0)
        db.delete(caseRemovedAxes).where(inArray(caseRemovedAxes.id, written)).run();
      for (const [name] of RESTORE_ORDER) {
        let rows = payload[name] ?? [];
        // A case removed since the delete takes its axis rows with it.
        if (name === "case_axes" && rows.length > 0) {
          const alive = new Set(
            db
              .select({ id: cases.id })
              .from(cases)
              .where(
                inArray(cases.id, [...new Set(rows.map((r) => (r as { caseId: number }).caseId))]),
              )
              .all()
              .map((r) => r.id),
          );
          rows = rows.filter((r) => alive.has((r as { caseId: number }).caseId));
        }
        if (rows.length > 0) restoreRows(name, rows);
      }
      db.delete(deletionUndo).where(eq(deletionUndo.id, undoId)).run();
      recordAudit({
        actor: caller,
        action: `${entry.kind}.undo-delete`,
        targetType: entry.kind,
        detail: `restored ${entry.label}`,
      });
    });
  } catch (error) {
    if (isConstraintError(error))
      throw new ConflictError(
        `Cannot undo the deletion of ${entry.label}: something with the same name was added since`,
      );
    throw error;
  }
  return { kind: entry.kind, label: entry.label };
}
