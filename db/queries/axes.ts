import { and, asc, count, desc, eq, getTableColumns, like, or, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { axes, machines } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import type { AxisApiInput, AxisInput, AxisListParams } from "@/lib/validations/installed-base";
import { getMotorOrThrow } from "./catalogue";
import { getMachineOrThrow } from "./machines";
import { getSiteOrThrow } from "./sites";

export const AXES_PAGE_SIZE = 50;

const sortColumns = {
  label: axes.label,
  machine: machines.name,
  holdingTorqueNm: axes.holdingTorqueNm,
  speedRpm: axes.speedRpm,
  loadTorqueNm: axes.loadTorqueNm,
  currentSettingA: axes.currentSettingA,
  quantity: axes.quantity,
} as const;

function escapeLike(text: string) {
  return `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}

/** What the case's axis picker shows of each axis of a site, in the picker's order (by id). */
export function listAxisPickerOptions(caller: SessionUser, siteId: number, limit: number) {
  getSiteOrThrow(caller, siteId);
  return db
    .select({
      id: axes.id,
      label: axes.label,
      machineName: machines.name,
      quantity: axes.quantity,
    })
    .from(axes)
    .innerJoin(machines, eq(axes.machineId, machines.id))
    .where(eq(axes.siteId, siteId))
    .orderBy(asc(axes.id))
    .limit(limit)
    .all();
}

// One page of a site's axes, filtered and sorted in SQL (the site's scope checked first).
export function listAxes(
  caller: SessionUser,
  siteId: number,
  params: Partial<AxisListParams> = {},
) {
  getSiteOrThrow(caller, siteId);
  const filters: (SQL | undefined)[] = [eq(axes.siteId, siteId)];
  if (params.machineId) filters.push(eq(axes.machineId, params.machineId));
  if (params.q)
    filters.push(
      or(like(axes.label, escapeLike(params.q)), like(machines.name, escapeLike(params.q))),
    );
  const where = and(...filters);
  const [{ total }] = db
    .select({ total: count() })
    .from(axes)
    .innerJoin(machines, eq(axes.machineId, machines.id))
    .where(where)
    .all();
  const pageCount = Math.max(1, Math.ceil(total / AXES_PAGE_SIZE));
  const page = Math.min(Math.max(1, params.page ?? 1), pageCount);
  const column = sortColumns[params.sort ?? "label"];
  const rows = db
    .select({ ...getTableColumns(axes), machineName: machines.name })
    .from(axes)
    .innerJoin(machines, eq(axes.machineId, machines.id))
    .where(where)
    .orderBy(params.dir === "desc" ? desc(column) : asc(column), asc(axes.id))
    .limit(AXES_PAGE_SIZE)
    .offset((page - 1) * AXES_PAGE_SIZE)
    .all();
  return { rows, total, page, pageCount, pageSize: AXES_PAGE_SIZE };
}

export function getAxisOrThrow(caller: SessionUser, id: number) {
  const row = db.select().from(axes).where(eq(axes.id, id)).get();
  if (!row) throw new NotFoundError("No such axis");
  try {
    getSiteOrThrow(caller, row.siteId);
  } catch {
    throw new NotFoundError("No such axis");
  }
  return row;
}

// The form sends no motion, event or resonance (AxisInput): an update from it leaves the stored
// ones as they are. The JSON API states them (AxisApiInput), null removing one.
type AxisWrite = AxisInput | AxisApiInput;

// The form may name the catalogue motor its figures came from; it must exist.
function checkReferenceMotor(caller: SessionUser, input: AxisWrite) {
  const id = "referenceMotorId" in input ? input.referenceMotorId : null;
  if (id != null) getMotorOrThrow(caller, id);
}

export function createAxis(caller: SessionUser, input: AxisWrite) {
  const machine = getMachineOrThrow(caller, input.machineId);
  checkReferenceMotor(caller, input);
  const [row] = db
    .insert(axes)
    .values({ ...input, siteId: machine.siteId })
    .returning()
    .all();
  return row;
}

export function updateAxis(caller: SessionUser, id: number, input: AxisWrite) {
  const axis = getAxisOrThrow(caller, id);
  const machine = getMachineOrThrow(caller, input.machineId);
  if (machine.siteId !== axis.siteId) throw new NotFoundError("No such machine");
  checkReferenceMotor(caller, input);
  db.update(axes).set(input).where(eq(axes.id, id)).run();
}

// Every stored field of a site's axes, for API callers, ordered by id for stable paging.
export function listAxesForExport(
  caller: SessionUser,
  siteId: number,
  offset: number,
  limit: number,
) {
  getSiteOrThrow(caller, siteId);
  const [{ total }] = db.select({ total: count() }).from(axes).where(eq(axes.siteId, siteId)).all();
  const rows = db
    .select({ ...getTableColumns(axes), machineName: machines.name })
    .from(axes)
    .innerJoin(machines, eq(axes.machineId, machines.id))
    .where(eq(axes.siteId, siteId))
    .orderBy(asc(axes.id))
    .limit(limit)
    .offset(offset)
    .all();
  return { siteId, total, offset, limit, axes: rows };
}
