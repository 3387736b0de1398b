import { and, desc, eq, inArray, lt } from "drizzle-orm";
import { proposals, quotes, type Proposal } from "../schema";
import { quoteFigures } from "../../lib/pipeline/figures";
import { OPEN_STAGES } from "../../lib/pipeline/stages";
import type { Db } from "../client";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

// A first guess at the close date: two months after freezing (an estimate the manager replaces).
const DEFAULT_CLOSE_DAYS = 60;

export function dateAfterDays(days: number, from = new Date()): string {
  return new Date(from.getTime() + days * 24 * 3600 * 1000).toISOString().slice(0, 10);
}

/**
 * The quote of a newly frozen proposal: ready to send, owned and dated like the version before
 * it (or by the case's owner, two months out); the case's older open quotes are replaced by it.
 */
export function openQuoteFor(
  tx: Tx,
  proposal: Pick<Proposal, "id" | "caseId" | "version" | "input" | "result">,
  caseOwnerId: number,
  extra: Partial<typeof quotes.$inferInsert> = {},
) {
  const previous = tx
    .select({ ownerId: quotes.ownerId, expectedCloseOn: quotes.expectedCloseOn })
    .from(quotes)
    .innerJoin(proposals, eq(proposals.id, quotes.proposalId))
    .where(and(eq(proposals.caseId, proposal.caseId), lt(proposals.version, proposal.version)))
    .orderBy(desc(proposals.version))
    .get();
  const olderIds = tx
    .select({ id: proposals.id })
    .from(proposals)
    .where(and(eq(proposals.caseId, proposal.caseId), lt(proposals.version, proposal.version)))
    .all()
    .map((r) => r.id);
  if (olderIds.length)
    tx.update(quotes)
      .set({ stage: "replaced", updatedAt: new Date().toISOString() })
      .where(and(inArray(quotes.proposalId, olderIds), inArray(quotes.stage, [...OPEN_STAGES])))
      .run();
  tx.insert(quotes)
    .values({
      proposalId: proposal.id,
      ownerId: previous?.ownerId ?? caseOwnerId,
      expectedCloseOn: previous?.expectedCloseOn ?? dateAfterDays(DEFAULT_CLOSE_DAYS),
      ...quoteFigures(proposal.input, proposal.result),
      ...extra,
    })
    .run();
}
