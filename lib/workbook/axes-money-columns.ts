import { avoidsEvents, eventCostValue, money, type AxisColumn } from "./axis-column";
import { FORMATS } from "./formats";
import { FINANCE_TERMS } from "@/lib/glossary";
import { NAME } from "./layout";

/** Each axis's money and totals, as formulas over its own row, that the Cash flow sheet sums. */
export const AXIS_MONEY_COLUMNS: readonly AxisColumn[] = [
  // docs/model.md (The business case): one unit's capex = price·(1 − discount) + installHours·laborRate + commissioning.
  {
    key: "capexUnit",
    group: "Money and totals (formulas)",
    header: FINANCE_TERMS.upFrontCostOneUnit,
    width: 13,
    format: "currency",
    value: (r) => ({
      formula: `${r.cell("price")}*(1-${r.cell("discount")}/100)+${r.cell("installHours")}*${NAME.laborRate}+${r.cell("commissioning")}`,
      result: money(r.result.capex),
    }),
  },
  {
    key: "capexTotal",
    group: "Money and totals (formulas)",
    header: FINANCE_TERMS.upFrontCostAllUnits,
    width: 13,
    format: "currency",
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("capexUnit")}`,
      result: money(r.result.totals.capex),
    }),
  },
  {
    key: "olEnergyTotal",
    group: "Money and totals (formulas)",
    header: "Drive energy today, all units (kWh/yr)",
    width: 12,
    format: FORMATS.kWh,
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("olEnergy")}`,
      result: r.axis.quantity * r.result.openLoop.energyKWhPerYear,
    }),
  },
  {
    key: "olCoolingTotal",
    group: "Money and totals (formulas)",
    header: "Cooling energy today, all units (kWh/yr)",
    width: 12,
    format: FORMATS.kWh,
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("olCooling")}`,
      result: r.axis.quantity * r.result.openLoop.coolingKWhPerYear,
    }),
  },
  {
    key: "savedTotal",
    group: "Money and totals (formulas)",
    header: "Drive energy saved, all units (kWh/yr)",
    width: 12,
    format: FORMATS.kWh,
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("savedUnit")}`,
      result: r.result.totals.energySavedKWhPerYear,
    }),
  },
  {
    key: "coolingTotal",
    group: "Money and totals (formulas)",
    header: "Cooling energy saved, all units (kWh/yr)",
    width: 12,
    format: FORMATS.kWh,
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("coolingUnit")}`,
      result: r.result.totals.coolingSavedKWhPerYear,
    }),
  },
  // docs/model.md (The business case): reliability counts only the axes that avoid events (the "Avoids step-loss events" column).
  {
    key: "reliability",
    group: "Money and totals (formulas)",
    header: "Step losses avoided, per year",
    width: 13,
    format: "currency",
    value: (r) => ({
      formula: `IF(${r.cell("avoidsEvents")}="no",0,${r.cell("qty")}*${r.cell("events")}*${r.cell("avoided")}/100*${r.cell("eventCost")})`,
      result: avoidsEvents(r.result)
        ? (r.axis.quantity *
            r.axis.reliability.stepLossEventsPerYear *
            r.axis.reliability.avoidedPct *
            eventCostValue(r)) /
          100
        : 0,
    }),
  },
  {
    key: "maintenanceTotal",
    group: "Money and totals (formulas)",
    header: "Maintenance saving, per year",
    width: 13,
    format: "currency",
    value: (r) => ({
      formula: `${r.cell("qty")}*${r.cell("maintenanceUnit")}`,
      result: r.axis.quantity * money(r.axis.retrofit.maintenanceSavingPerYear),
    }),
  },
];
