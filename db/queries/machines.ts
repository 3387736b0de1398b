import { and, asc, eq, getTableColumns, sql } from "drizzle-orm";
import { db } from "@/db";
import { axes, machines } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { MachineInput } from "@/lib/validations/installed-base";
import { getSiteOrThrow } from "./sites";

export function listMachines(caller: SessionUser, siteId: number) {
  getSiteOrThrow(caller, siteId);
  return db
    .select({
      ...getTableColumns(machines),
      axisCount: sql<number>`(select coalesce(sum(${axes.quantity}), 0) from ${axes} where ${axes.machineId} = ${machines.id})`,
    })
    .from(machines)
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

function assertNameFree(siteId: number, name: string, exceptId?: number) {
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
  assertNameFree(siteId, input.name);
  const [row] = db
    .insert(machines)
    .values({ ...input, siteId })
    .returning()
    .all();
  return row;
}

export function updateMachine(caller: SessionUser, id: number, input: MachineInput) {
  const machine = getMachineOrThrow(caller, id);
  assertNameFree(machine.siteId, input.name, id);
  db.update(machines).set(input).where(eq(machines.id, id)).run();
}
