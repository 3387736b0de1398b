import { inArray } from "drizzle-orm";
import { db } from "@/db";
import { proposals } from "@/db/schema";
import type { CaseInput } from "@/lib/engine";
import { vendorRevenue, type VendorRevenue } from "@/lib/pipeline/revenue";

// SQLite allows a limited number of bound values per statement; the ids go in slices.
const SLICE = 500;

/**
 * The vendor's revenue of each proposal, read from its frozen input (which never changes, so the
 * figure never moves). Only the input is read, not the much larger result.
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
