import "server-only";
import { getCaseOrThrow } from "@/db/queries/cases";
import { storeProposalVersion } from "@/db/queries/proposal-versions";
import type { Proposal } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { evaluateCached } from "./results";

/**
 * Freezes the case as its next proposal version: the input and result the engine gives now
 * (from the result cache when the input is unchanged), stored by db/queries/cases.ts.
 */
export function freezeProposal(caller: SessionUser, caseId: number): Proposal {
  const found = getCaseOrThrow(caller, caseId);
  const { input, result } = evaluateCached(found);
  return storeProposalVersion(caller, found, input, result);
}
