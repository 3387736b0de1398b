import Decimal from "decimal.js";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { kits, motors } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { KitCatalogueInput, MotorCatalogueInput } from "@/lib/validations/catalogue";
import { recordAudit } from "./audit";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Everyone at the vendor reads the catalogue; only administrators change it.
const READERS = VENDOR_ROLES;

export function listMotors(caller: SessionUser, { includeRetired = false } = {}) {
  assertRole(caller, ...READERS);
  return db
    .select()
    .from(motors)
    .where(includeRetired ? undefined : eq(motors.active, true))
    .orderBy(asc(motors.frameSize), asc(motors.holdingTorqueNm))
    .all();
}

// Cheapest first. Prices are decimal text, compared as Decimals: as text "74.00" would sort
// after "329.00", and money does not pass through floats (docs/model.md).
export function listKits(caller: SessionUser, { includeRetired = false } = {}) {
  assertRole(caller, ...READERS);
  return db
    .select()
    .from(kits)
    .where(includeRetired ? undefined : eq(kits.active, true))
    .all()
    .sort((a, b) => new Decimal(a.price).comparedTo(b.price) || a.code.localeCompare(b.code));
}

/** A catalogue motor an axis may name as its reference (retired ones included: axes keep them). */
export function getMotorOrThrow(caller: SessionUser, id: number) {
  assertRole(caller, ...READERS);
  const row = db.select().from(motors).where(eq(motors.id, id)).get();
  if (!row) throw new NotFoundError("No such catalogue motor");
  return row;
}

function uniqueCode(table: typeof kits | typeof motors, value: string, exceptId?: number) {
  const clash = db.select({ id: table.id }).from(table).where(eq(table.code, value)).get();
  if (clash && clash.id !== exceptId)
    throw new ConflictError(`The code "${value}" is already used`);
}

function motorExists(id: number | null) {
  if (id != null && !db.select({ id: motors.id }).from(motors).where(eq(motors.id, id)).get()) {
    throw new NotFoundError("No such motor");
  }
}

export function saveMotor(caller: SessionUser, input: MotorCatalogueInput, id?: number) {
  assertRole(caller, "admin");
  uniqueCode(motors, input.code, id);
  if (id === undefined) {
    const [row] = db.insert(motors).values(input).returning().all();
    recordAudit({
      actor: caller,
      action: "catalogue.motor.create",
      targetType: "motor",
      targetId: row.id,
      detail: input.code,
    });
    return row;
  }
  const found = db.update(motors).set(input).where(eq(motors.id, id)).returning().all();
  if (!found.length) throw new NotFoundError("No such motor");
  recordAudit({
    actor: caller,
    action: "catalogue.motor.update",
    targetType: "motor",
    targetId: id,
    detail: input.code,
  });
  return found[0];
}

export function saveKit(caller: SessionUser, input: KitCatalogueInput, id?: number) {
  assertRole(caller, "admin");
  uniqueCode(kits, input.code, id);
  motorExists(input.motorId);
  if (id === undefined) {
    const [row] = db.insert(kits).values(input).returning().all();
    recordAudit({
      actor: caller,
      action: "catalogue.kit.create",
      targetType: "kit",
      targetId: row.id,
      detail: input.code,
    });
    return row;
  }
  const found = db.update(kits).set(input).where(eq(kits.id, id)).returning().all();
  if (!found.length) throw new NotFoundError("No such kit");
  recordAudit({
    actor: caller,
    action: "catalogue.kit.update",
    targetType: "kit",
    targetId: id,
    detail: input.code,
  });
  return found[0];
}

// Retiring keeps the row (cases and proposals may name it) but takes it out of new choices.
export function setCatalogueActive(
  caller: SessionUser,
  kind: "kit" | "motor",
  id: number,
  active: boolean,
) {
  assertRole(caller, "admin");
  const table = kind === "kit" ? kits : motors;
  const found = db
    .update(table)
    .set({ active })
    .where(eq(table.id, id))
    .returning({ code: table.code })
    .all();
  if (!found.length) throw new NotFoundError(`No such ${kind}`);
  recordAudit({
    actor: caller,
    action: `catalogue.${kind}.${active ? "restore" : "retire"}`,
    targetType: kind,
    targetId: id,
    detail: found[0].code,
  });
}
