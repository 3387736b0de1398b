import { inArray } from "drizzle-orm";
import { db } from "@/db";
import { proposals, quotes } from "@/db/schema";
import type { CaseInput } from "@/lib/engine";
import {
  storedRevenue,
  vendorRevenue,
  type StoredRevenue,
  type VendorRevenue,
} from "@/lib/pipeline/revenue";

// SQLite allows a limited number of bound values per statement; the ids go in slices.
const SLICE = 500;

/** The stored revenue columns of a quote, for a select (db/queries/proposals.ts). */
export const revenueColumnsOfQuote = {
  vendorRevenue: quotes.vendorRevenue,
  revenueKitsAtListPrice: quotes.revenueKitsAtListPrice,
  revenueDiscounts: quotes.revenueDiscounts,
  revenueInstallation: quotes.revenueInstallation,
  revenueCommissioning: quotes.revenueCommissioning,
};

/**
 * The vendor's revenue of each proposal, worked out of its frozen input (which never changes, so
 * the figure never moves). Only the input is read, not the much larger result. The fallback for
 * a quote whose stored revenue is missing; see revenueOfQuotes.
 */
export function revenueByProposal(ids: readonly number[]): Map<number, VendorRevenue> {
  const out = new Map<number, VendorRevenue>();
  const unique = [...new Set(ids)];
  for (let i = 0; i < unique.length; i += SLICE) {
    const rows = db
      .select({ id: proposals.id, input: proposals.input })
      .from(proposals)
      .where(inArray(proposals.id, unique.slice(i, i + SLICE)))
      .all();
    for (const r of rows) out.set(r.id, vendorRevenue(r.input as CaseInput));
  }
  return out;
}

/**
 * The vendor's revenue of each quote as stored when its proposal was frozen. A quote still lacking
 * it (frozen before migration 0013 and not yet backfilled by db/backfill-vendor-revenue.ts) has it
 * worked out of its frozen input instead, so a read never shows a blank.
 */
export function revenueOfQuotes(
  rows: readonly (StoredRevenue & { id: number })[],
): Map<number, VendorRevenue> {
  const out = new Map<number, VendorRevenue>();
  const missing: number[] = [];
  for (const r of rows) {
    const stored = storedRevenue(r);
    if (stored) out.set(r.id, stored);
    else missing.push(r.id);
  }
  if (missing.length) for (const [id, r] of revenueByProposal(missing)) out.set(id, r);
  return out;
}
