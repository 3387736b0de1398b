import { and, asc, count, desc, eq, getTableColumns, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { axes, machines } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { pageWindow } from "@/lib/lists/list-params";
import type { MachineAxisListParams } from "@/lib/validations/installed-base";
import { recordAudit } from "./audit";
import { assertMachineNameFree, getMachineOrThrow } from "./machines";
import { getSiteOrThrow } from "./sites";

// A machine's own axes (the machine page) and copying a machine of a series with its axes.

export const MACHINE_AXES_PAGE_SIZE = 25;

const sortColumns = {
  label: axes.label,
  quantity: axes.quantity,
  holdingTorqueNm: axes.holdingTorqueNm,
  speedRpm: axes.speedRpm,
  currentSettingA: axes.currentSettingA,
} as const;

function escapeLike(text: string) {
  return `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}

export function listMachineAxes(
  caller: SessionUser,
  machineId: number,
  params: Partial<MachineAxisListParams> = {},
) {
  getMachineOrThrow(caller, machineId);
  const filters: (SQL | undefined)[] = [eq(axes.machineId, machineId)];
  // LIKE has no escape character unless one is named: the backslash is named here.
  if (params.q) filters.push(sql`${axes.label} like ${escapeLike(params.q)} escape '\\'`);
  const where = and(...filters);
  const { total } = db.select({ total: count() }).from(axes).where(where).get()!;
  const window = pageWindow(total, params.page ?? 1, MACHINE_AXES_PAGE_SIZE);
  const column = sortColumns[params.sort ?? "label"];
  const rows = db
    .select({
      id: axes.id,
      label: axes.label,
      quantity: axes.quantity,
      assetTag: axes.assetTag,
      holdingTorqueNm: axes.holdingTorqueNm,
      speedRpm: axes.speedRpm,
      currentSettingA: axes.currentSettingA,
    })
    .from(axes)
    .where(where)
    .orderBy(params.dir === "desc" ? desc(column) : asc(column), asc(axes.id))
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize: window.pageSize };
}

/**
 * Copies a machine and every column of its axes (JSON columns included) under a new name, in one
 * transaction. Asset tags are cleared: they name physical units, which the copy is not.
 */
export function duplicateMachine(caller: SessionUser, machineId: number, name: string) {
  assertRole(caller, ...VENDOR_ROLES);
  const source = getMachineOrThrow(caller, machineId);
  const site = getSiteOrThrow(caller, source.siteId);
  return db.transaction(() => {
    assertMachineNameFree(source.siteId, name);
    const { id: _id, createdAt: _created, ...machineValues } = source;
    const [copy] = db
      .insert(machines)
      .values({ ...machineValues, name })
      .returning()
      .all();
    const { id: _axisId, createdAt: _axisCreated, ...axisColumns } = getTableColumns(axes);
    const sourceAxes = db
      .select(axisColumns)
      .from(axes)
      .where(eq(axes.machineId, machineId))
      .orderBy(asc(axes.id))
      .all();
    for (let i = 0; i < sourceAxes.length; i += 200)
      db.insert(axes)
        .values(
          sourceAxes.slice(i, i + 200).map((a) => ({ ...a, machineId: copy.id, assetTag: null })),
        )
        .run();
    recordAudit({
      actor: caller,
      action: "machine.duplicate",
      targetType: "machine",
      targetId: copy.id,
      detail: `"${name}" copied from "${source.name}" on site "${site.name}" with ${sourceAxes.length} axis rows`,
    });
    return { ...copy, axisRows: sourceAxes.length };
  });
}
