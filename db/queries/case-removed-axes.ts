import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { caseRemovedAxes, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { getCaseOrThrow } from "./cases";

// The axes that left an open case because they (or their machine) were deleted: what the case
// page's notice lists. Written by db/queries/installed-base-delete.ts.
export function listRemovedAxes(caller: SessionUser, caseId: number) {
  getCaseOrThrow(caller, caseId);
  return db
    .select({
      id: caseRemovedAxes.id,
      axisLabel: caseRemovedAxes.axisLabel,
      machineName: caseRemovedAxes.machineName,
      removedWith: caseRemovedAxes.removedWith,
      removedByName: users.name,
      removedAt: caseRemovedAxes.removedAt,
    })
    .from(caseRemovedAxes)
    .leftJoin(users, eq(users.id, caseRemovedAxes.removedById))
    .where(eq(caseRemovedAxes.caseId, caseId))
    .orderBy(asc(caseRemovedAxes.removedAt), asc(caseRemovedAxes.id))
    .all();
}

export type RemovedAxis = ReturnType<typeof listRemovedAxes>[number];
