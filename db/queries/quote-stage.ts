import { and, eq, max } from "drizzle-orm";
import { db } from "@/db";
import { cases, proposals, quotes, type CaseStage } from "@/db/schema";
import type { QuoteStage } from "@/lib/pipeline/stages";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

// The case's own stage follows the quote of its newest version: accepted wins the case, declined
// loses it, anything still open keeps it proposed. An older version's quote moves nothing.
const CASE_STAGE_OF: Record<QuoteStage, CaseStage | null> = {
  ready: "proposed",
  sent: "proposed",
  changes: "proposed",
  accepted: "won",
  declined: "lost",
  replaced: null,
};

export function setQuoteStage(
  tx: Tx,
  quote: { id: number; caseId: number; version: number },
  stage: QuoteStage,
  extra: Partial<typeof quotes.$inferInsert> = {},
) {
  const stamp = new Date().toISOString();
  const decided = stage === "accepted" || stage === "declined";
  tx.update(quotes)
    // A decided quote has closed: its close date becomes the day of the decision.
    .set({
      stage,
      decidedAt: decided ? stamp : null,
      ...(decided ? { expectedCloseOn: stamp.slice(0, 10) } : {}),
      updatedAt: stamp,
      ...extra,
    })
    .where(eq(quotes.proposalId, quote.id))
    .run();
  const [{ latest }] = tx
    .select({ latest: max(proposals.version) })
    .from(proposals)
    .where(eq(proposals.caseId, quote.caseId))
    .all();
  const caseStage = CASE_STAGE_OF[stage];
  if (caseStage && latest === quote.version)
    tx.update(cases)
      .set({ stage: caseStage, updatedAt: stamp })
      .where(and(eq(cases.id, quote.caseId)))
      .run();
}
