import Decimal from "decimal.js";
import type { CaseInput } from "../engine";

// What the vendor bills for a quote, as against what the customer invests. The customer's
// up-front cost (docs/model.md (The business case)) is every axis unit's kit after discount,
// installation hours at the labour rate and commissioning, PLUS the downtime of each machine and
// the project's one-time cost. Those last two are the customer's own costs: nobody invoices them,
// so a pipeline that summed the up-front cost overstated what the vendor sells. The vendor's
// revenue is the first part alone, split so that finance can tie it to an invoice.

// Exact decimals for money (docs/model.md: money never goes through number arithmetic).
const Exact = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_EVEN });

export type VendorRevenue = {
  /** Σ quantity × kit list price. */
  kitsAtListPrice: string;
  /** Σ quantity × kit list price × discount %: what the vendor gives away; revenue subtracts it. */
  discounts: string;
  /** Σ quantity × installation hours × labour rate. */
  installation: string;
  /** Σ quantity × commissioning cost per unit. */
  commissioning: string;
  /** kits at list price − discounts + installation + commissioning, unrounded. */
  revenue: string;
};

// A frozen input is stored as the engine received it, so a field the schema defaults
// (lib/engine/schema.ts) may be absent; money may be a decimal string or a number.
const amount = (v: Decimal.Value | undefined) => new Exact(v === undefined ? 0 : String(v));
const plain = (v: Decimal) => (v.isZero() ? "0" : v.toFixed());

/** The vendor's revenue of a frozen proposal's input, with its parts, unrounded. */
export function vendorRevenue(input: CaseInput): VendorRevenue {
  const laborRate = amount(input.finance?.laborRatePerHour);
  let kits = new Exact(0);
  let discounts = new Exact(0);
  let installation = new Exact(0);
  let commissioning = new Exact(0);
  for (const axis of input.axes) {
    const quantity = amount(axis.quantity);
    const retrofit = axis.retrofit;
    const list = quantity.times(amount(retrofit.kit.price));
    kits = kits.plus(list);
    discounts = discounts.plus(list.times(retrofit.discountPct ?? 0).div(100));
    installation = installation.plus(quantity.times(retrofit.installHours ?? 0).times(laborRate));
    commissioning = commissioning.plus(quantity.times(amount(retrofit.commissioningCost)));
  }
  return {
    kitsAtListPrice: plain(kits),
    discounts: plain(discounts),
    installation: plain(installation),
    commissioning: plain(commissioning),
    revenue: plain(kits.minus(discounts).plus(installation).plus(commissioning)),
  };
}

/**
 * The revenue as a quote stores it when its proposal is frozen (db/schema/quotes.ts), one column
 * per part, so that reading the pipeline does not work it out of every frozen input again.
 */
export type StoredRevenue = {
  vendorRevenue: string | null;
  revenueKitsAtListPrice: string | null;
  revenueDiscounts: string | null;
  revenueInstallation: string | null;
  revenueCommissioning: string | null;
};

export function revenueColumns(r: VendorRevenue): { [K in keyof StoredRevenue]: string } {
  return {
    vendorRevenue: r.revenue,
    revenueKitsAtListPrice: r.kitsAtListPrice,
    revenueDiscounts: r.discounts,
    revenueInstallation: r.installation,
    revenueCommissioning: r.commissioning,
  };
}

/** The stored revenue, or null when any part is missing (a quote not yet backfilled). */
export function storedRevenue(row: StoredRevenue): VendorRevenue | null {
  const {
    vendorRevenue: revenue,
    revenueKitsAtListPrice: kitsAtListPrice,
    revenueDiscounts: discounts,
    revenueInstallation: installation,
    revenueCommissioning: commissioning,
  } = row;
  if (
    revenue === null ||
    kitsAtListPrice === null ||
    discounts === null ||
    installation === null ||
    commissioning === null
  )
    return null;
  return { kitsAtListPrice, discounts, installation, commissioning, revenue };
}
