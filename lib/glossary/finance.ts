/**
 * Finance figures in plain words, for the reviewer who signs the investment off. The engine
 * and the workbook's defined names keep their short keys (capex, NPV_Physics); a reader sees these.
 */
export const FINANCE_TERMS = {
  /** What the engine calls capex: everything paid before the first saving. */
  upFrontCost: "Up-front cost",
  upFrontCostOneUnit: "Up-front cost, one unit",
  upFrontCostAllUnits: "Up-front cost, all units",
  /** The year-0 row of a cash-flow table. */
  upFrontCostYear: "0 (up-front cost)",
  labourRate: "Labour rate",
  npv: "Net present value",
  payback: "Payback",
  /** The payback a proposal is sold on: that of the engine's own scenario. */
  estimatedPayback: "Payback (engineering estimate)",
  /** What the vendor invoices for a quote (lib/pipeline/revenue.ts); the pipeline weights this. */
  vendorRevenue: "Vendor revenue",
  /** The customer's whole up-front cost, their own downtime and project cost included. */
  customerInvestment: "Customer investment",
  weightedRevenue: "Weighted revenue",
} as const;

/** What the vendor's revenue of a quote is made of, in the words the pipeline explains it with. */
export const VENDOR_REVENUE_BREAKDOWN =
  "the kits at list price less their discounts, plus the installation hours at the labour rate and the commissioning, for every unit";

/** Why the customer's investment is larger than what the vendor sells them. */
export const CUSTOMER_INVESTMENT_NOTE =
  "the vendor's revenue plus the customer's own costs: their machines' downtime while the kits are fitted and the project's one-time cost";

/**
 * What the up-front cost is made of (docs/model.md (The business case)), said wherever the figure
 * is shown to someone who must approve it.
 */
export const UP_FRONT_COST_BREAKDOWN =
  "the kits after discount, their installation hours at the labour rate and their commissioning, the machines' downtime while they are fitted, and the project's one-time cost";
