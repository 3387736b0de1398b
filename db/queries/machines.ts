import { and, asc, count, eq, getTableColumns, sql } from "drizzle-orm";
import { db } from "@/db";
import { axes, machines } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { MachineInput } from "@/lib/validations/installed-base";
import { getSiteOrThrow } from "./sites";

// Per machine: its axis rows, and its axes counted with their quantity (a row may stand for
// several identical axes). A grouped subquery joined on the machine: a correlated subquery in a
// one-table select would come out of drizzle with unqualified columns ("machine_id" = "id"),
// which SQLite resolves inside the subquery to the axes table itself.
function axisCountsByMachine() {
  return db
    .select({
      machineId: axes.machineId,
      axisRows: count().as("axis_rows"),
      axisUnits: sql<number>`sum(${axes.quantity})`.as("axis_units"),
    })
    .from(axes)
    .groupBy(axes.machineId)
    .as("axis_counts");
}

export function listMachines(caller: SessionUser, siteId: number) {
  getSiteOrThrow(caller, siteId);
  const counts = axisCountsByMachine();
  return db
    .select({
      ...getTableColumns(machines),
      axisRows: sql<number>`coalesce(${counts.axisRows}, 0)`,
      axisUnits: sql<number>`coalesce(${counts.axisUnits}, 0)`,
    })
    .from(machines)
    .leftJoin(counts, eq(counts.machineId, machines.id))
    .where(eq(machines.siteId, siteId))
    .orderBy(asc(machines.name))
    .all();
}

export function getMachineOrThrow(caller: SessionUser, id: number) {
  const row = db.select().from(machines).where(eq(machines.id, id)).get();
  if (!row) throw new NotFoundError("No such machine");
  try {
    getSiteOrThrow(caller, row.siteId);
  } catch {
    throw new NotFoundError("No such machine");
  }
  return row;
}

export function assertMachineNameFree(siteId: number, name: string, exceptId?: number) {
  const clash = db
    .select({ id: machines.id })
    .from(machines)
    .where(and(eq(machines.siteId, siteId), sql`lower(${machines.name}) = lower(${name})`))
    .get();
  if (clash && clash.id !== exceptId)
    throw new ConflictError(`This site already has a machine named "${name}"`);
}

export function createMachine(caller: SessionUser, siteId: number, input: MachineInput) {
  getSiteOrThrow(caller, siteId);
  assertMachineNameFree(siteId, input.name);
  const [row] = db
    .insert(machines)
    .values({ ...input, siteId })
    .returning()
    .all();
  return row;
}

export function updateMachine(caller: SessionUser, id: number, input: MachineInput) {
  const machine = getMachineOrThrow(caller, id);
  assertMachineNameFree(machine.siteId, input.name, id);
  db.update(machines).set(input).where(eq(machines.id, id)).run();
}
