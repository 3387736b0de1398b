import { and, asc, eq, gt, isNull, or } from "drizzle-orm";
import type { CaseInput } from "../lib/engine";
import { revenueColumns, vendorRevenue } from "../lib/pipeline/revenue";
import type { Db } from "./client";
import { proposals, quotes } from "./schema";

// Quotes frozen before migration 0013 have no stored vendor's revenue. They get it here, from
// their frozen input, with the very function that fills it in when a proposal is frozen
// (lib/pipeline/figures.ts quoteFigures), so a backfilled quote reads exactly like a new one.
// Runs after every migration run (db/migrate.ts): once all are filled, it costs one query.

// Inputs are read in batches so that a large database is not held in memory at once.
const BATCH = 200;

const lacking = or(
  isNull(quotes.vendorRevenue),
  isNull(quotes.revenueKitsAtListPrice),
  isNull(quotes.revenueDiscounts),
  isNull(quotes.revenueInstallation),
  isNull(quotes.revenueCommissioning),
);

/**
 * Stores the vendor's revenue of every quote that lacks it; returns how many were filled. A frozen
 * input it cannot sum is left as it is (the pipeline then works it out on read, as it always
 * did) and named on the console, rather than stopping the app from starting.
 */
export function backfillVendorRevenue(db: Db): number {
  let filled = 0;
  // Walks the quotes by id, so a quote left unfilled is never selected again in this run.
  let after = 0;
  for (;;) {
    const rows = db
      .select({ id: quotes.proposalId, input: proposals.input })
      .from(quotes)
      .innerJoin(proposals, eq(proposals.id, quotes.proposalId))
      .where(and(lacking, gt(quotes.proposalId, after)))
      .orderBy(asc(quotes.proposalId))
      .limit(BATCH)
      .all();
    if (rows.length === 0) return filled;
    after = rows[rows.length - 1].id;
    db.transaction((tx) => {
      for (const r of rows) {
        let columns;
        try {
          columns = revenueColumns(vendorRevenue(r.input as CaseInput));
        } catch (error) {
          console.warn(`Vendor's revenue of proposal ${r.id} not stored: ${String(error)}`);
          continue;
        }
        tx.update(quotes).set(columns).where(eq(quotes.proposalId, r.id)).run();
        filled++;
      }
    });
  }
}
