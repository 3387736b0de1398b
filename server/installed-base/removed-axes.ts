import "server-only";
import { listRemovedAxes } from "@/db/queries/case-removed-axes";
import type { SessionUser } from "@/lib/auth/session-user";

// The case page's notice reads through here: components reach data via server/, not db/.
export function removedAxesOfCase(caller: SessionUser, caseId: number) {
  return listRemovedAxes(caller, caseId);
}
