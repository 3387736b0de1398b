import { eq, isNull, or } from "drizzle-orm";
import type { CaseInput } from "../lib/engine";
import { revenueColumns, vendorRevenue } from "../lib/pipeline/revenue";
import type { Db } from "./client";
import { proposals, quotes } from "./schema";

// Quotes frozen before migration 0013 have no stored vendor's revenue. They get it here, from
// their frozen input, with the very function that fills it in when a proposal is frozen
// (lib/pipeline/figures.ts quoteFigures), so a backfilled quote reads exactly like a new one.
// Runs after every migration (db/migrate.ts): once filled, nothing is left to do but one query.

// Inputs are read in batches so that a large database is not held in memory at once.
const BATCH = 200;

const lacking = or(
  isNull(quotes.vendorRevenue),
  isNull(quotes.revenueKitsAtListPrice),
  isNull(quotes.revenueDiscounts),
  isNull(quotes.revenueInstallation),
  isNull(quotes.revenueCommissioning),
);

/** Stores the vendor's revenue of every quote that lacks it; returns how many were filled. */
export function backfillVendorRevenue(db: Db): number {
  let filled = 0;
  for (;;) {
    const rows = db
      .select({ id: quotes.proposalId, input: proposals.input })
      .from(quotes)
      .innerJoin(proposals, eq(proposals.id, quotes.proposalId))
      .where(lacking)
      .limit(BATCH)
      .all();
    if (rows.length === 0) return filled;
    db.transaction((tx) => {
      for (const r of rows)
        tx.update(quotes)
          .set(revenueColumns(vendorRevenue(r.input as CaseInput)))
          .where(eq(quotes.proposalId, r.id))
          .run();
    });
    filled += rows.length;
  }
}
