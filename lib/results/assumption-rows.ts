import type { ParsedCase } from "@/lib/engine";

export type AssumptionRow = { group: string; label: string; value: string; note: string };

// Where each figure comes from, in the three kinds the product distinguishes (as the workbook's
// Assumptions sheet says them).
const ESTIMATE = "estimate; replace with your own figure";
const COMMON = "common practice";

const plain = (v: number | string | null, unit = "") =>
  v === null
    ? "none"
    : `${typeof v === "number" ? v.toLocaleString("en-GB") : v}${unit ? ` ${unit}` : ""}`;

/** The assumptions a frozen proposal was computed with, in words and units. */
export function assumptionRows(input: ParsedCase): AssumptionRow[] {
  const { finance: f, margins: m, band: b, currency: c } = input;
  return [
    {
      group: "Finance",
      label: "Electricity tariff",
      value: plain(f.tariffPerKWh, `${c}/kWh`),
      note: `${ESTIMATE} (your electricity bill)`,
    },
    {
      group: "Finance",
      label: "Tariff escalation",
      value: plain(f.tariffEscalationPct, "% per year"),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Discount rate",
      value: plain(f.discountRatePct, "% per year"),
      note: `${ESTIMATE} (your cost of capital)`,
    },
    { group: "Finance", label: "Horizon", value: plain(f.horizonYears, "years"), note: ESTIMATE },
    {
      group: "Finance",
      label: "Labour rate",
      value: plain(f.laborRatePerHour, `${c}/h`),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Downtime cost",
      value: plain(f.downtimeCostPerHour, `${c}/h`),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Project one-time cost",
      value: plain(f.projectOneTimeCost, c),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Annual service cost",
      value: plain(f.annualServiceCost, `${c}/year`),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Cabinet cooling COP",
      value: f.coolingCop === null ? "no cooling counted" : plain(f.coolingCop),
      note: ESTIMATE,
    },
    {
      group: "Finance",
      label: "Grid CO₂ factor",
      value: plain(f.gridKgCo2PerKWh, "kg/kWh"),
      note: ESTIMATE,
    },
    {
      group: "Sizing",
      label: "Open-loop required margin",
      value: plain(m.openLoopRequiredPct, "%"),
      note: `${COMMON} (30–50 % of pull-out torque)`,
    },
    {
      group: "Sizing",
      label: "Closed-loop required margin",
      value: plain(m.closedLoopRequiredPct, "%"),
      note: `${COMMON} (10–20 %)`,
    },
    {
      group: "Claims",
      label: "Energy band, low end",
      value: plain(b.lowPct, "%"),
      note: "trade claim for closed-loop energy gains",
    },
    {
      group: "Claims",
      label: "Energy band, high end",
      value: plain(b.highPct, "%"),
      note: "trade claim for closed-loop energy gains",
    },
  ];
}
