import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { FINANCE_TERMS, RECORD_KEY_HEADER } from "@/lib/glossary";
import {
  FORMATS,
  currencyFormat,
  styleHeader,
  styleInput,
  styleSection,
  tariffFormat,
} from "./formats";
import { NAME, SHEET, absoluteRange, defineName, type MachineRanges } from "./layout";
import { safeText } from "./safe-text";
import { machineWarningText } from "./warning-text";

/** Where a default comes from, in the three kinds the product distinguishes. */
const COMMON = "common practice";
const ESTIMATE = "estimate — replace with the customer's figure";
const published = (source: string) => `published source: ${source}`;

interface Entry {
  part: string;
  label: string;
  path: string;
  value: number | string | null;
  unit: string;
  defaultValue: string;
  source: string;
  format?: string;
  /** Set when a formula reads the cell through this defined name. */
  name?: string;
}

const money = (amount: string): number => Number(amount);

function entries(input: ParsedCase): Entry[] {
  const { finance, margins, band, sensitivity, thermal, currency } = input;
  const cur = currencyFormat(currency);
  return [
    {
      part: "Case",
      label: "Currency",
      path: "currency",
      value: currency,
      unit: "ISO 4217",
      defaultValue: "",
      source: "the case",
    },
    {
      part: "Finance",
      label: "Electricity tariff",
      path: "finance.tariffPerKWh",
      value: money(finance.tariffPerKWh),
      unit: `${currency}/kWh`,
      defaultValue: "required",
      source: `${ESTIMATE} (their electricity bill)`,
      format: tariffFormat(currency),
      name: NAME.tariff,
    },
    {
      part: "Finance",
      label: "Tariff escalation",
      path: "finance.tariffEscalationPct",
      value: finance.tariffEscalationPct,
      unit: "% per year",
      defaultValue: "0",
      source: ESTIMATE,
      format: FORMATS.pct2,
      name: NAME.escalation,
    },
    {
      part: "Finance",
      label: "Discount rate",
      path: "finance.discountRatePct",
      value: finance.discountRatePct,
      unit: "% per year",
      defaultValue: "8",
      source: `${ESTIMATE} (their cost of capital)`,
      format: FORMATS.pct2,
      name: NAME.discountRate,
    },
    {
      part: "Finance",
      label: "Horizon",
      path: "finance.horizonYears",
      value: finance.horizonYears,
      unit: "years (1 to 30)",
      defaultValue: "5",
      source: COMMON,
      format: FORMATS.whole,
      name: NAME.horizon,
    },
    {
      part: "Finance",
      label: FINANCE_TERMS.labourRate,
      path: "finance.laborRatePerHour",
      value: money(finance.laborRatePerHour),
      unit: `${currency}/h`,
      defaultValue: "0",
      source: ESTIMATE,
      format: cur,
      name: NAME.laborRate,
    },
    {
      part: "Finance",
      label: "Cost of an hour of downtime",
      path: "finance.downtimeCostPerHour",
      value: money(finance.downtimeCostPerHour),
      unit: `${currency}/h`,
      defaultValue: "0",
      source: ESTIMATE,
      format: cur,
      name: NAME.downtimeCost,
    },
    {
      part: "Finance",
      label: "One-time project cost (engineering, travel)",
      path: "finance.projectOneTimeCost",
      value: money(finance.projectOneTimeCost),
      unit: currency,
      defaultValue: "0",
      source: ESTIMATE,
      format: cur,
      name: NAME.projectCost,
    },
    {
      part: "Finance",
      label: "Annual service cost of the closed-loop fleet",
      path: "finance.annualServiceCost",
      value: money(finance.annualServiceCost),
      unit: `${currency}/year`,
      defaultValue: "0",
      source: ESTIMATE,
      format: cur,
      name: NAME.serviceCost,
    },
    {
      part: "Finance",
      label: "Cabinet cooler COP",
      path: "finance.coolingCop",
      value: finance.coolingCop ?? "none (no active cooling)",
      unit: "",
      defaultValue: "none",
      source: `${ESTIMATE}; cabinet coolers rate about 1–2 at L35/L35 (DIN 3168 rating points, from memory). Already applied in the per-axis cooling energy`,
      format: FORMATS.pct2,
    },
    {
      part: "Finance",
      label: "Grid emission factor",
      path: "finance.gridKgCo2PerKWh",
      value: finance.gridKgCo2PerKWh,
      unit: "kg CO₂/kWh",
      defaultValue: "0",
      source: `${ESTIMATE} (their supplier's factor)`,
      format: FORMATS.physics,
      name: NAME.gridFactor,
    },
    {
      part: "Finance",
      label: "Inflation",
      path: "finance.inflationPct",
      value: finance.inflationPct,
      unit: "% per year, on reliability, maintenance, throughput and service",
      defaultValue: "0",
      source: ESTIMATE,
      format: FORMATS.pct2,
      name: NAME.inflation,
    },
    {
      part: "Finance",
      label: "Tax rate",
      path: "finance.taxRatePct",
      value: finance.taxRatePct,
      unit: "% of the flow less depreciation (0 = pre-tax flows)",
      defaultValue: "0",
      source: `${ESTIMATE} (their tax adviser's rate); a negative tax is a shield the rest of the business uses (${COMMON} in project appraisal)`,
      format: FORMATS.pct2,
      name: NAME.taxRate,
    },
    {
      part: "Finance",
      label: `Depreciation period (straight line over the whole ${FINANCE_TERMS.upFrontCost.toLowerCase()})`,
      path: "finance.depreciationYears",
      value: finance.depreciationYears,
      unit: "years (1 to 30)",
      defaultValue: "5",
      source: `${ESTIMATE} (their accounting rule)`,
      format: FORMATS.whole,
      name: NAME.depreciationYears,
    },
    {
      part: "Margins",
      label: "Required open-loop torque margin",
      path: "margins.openLoopRequiredPct",
      value: margins.openLoopRequiredPct,
      unit: "% of pull-out torque",
      defaultValue: "40",
      source: `${COMMON} (30–50 %)`,
      format: FORMATS.pct,
    },
    {
      part: "Margins",
      label: "Required closed-loop torque margin",
      path: "margins.closedLoopRequiredPct",
      value: margins.closedLoopRequiredPct,
      unit: "% of torque at speed",
      defaultValue: "15",
      source: `${COMMON} (10–20 %)`,
      format: FORMATS.pct,
    },
    {
      part: "Band",
      label: "Band, low end",
      path: "band.lowPct",
      value: band.lowPct,
      unit: "% of today's drive and cooling energy",
      defaultValue: "25",
      source: `${COMMON}: the 25–50 % closed-loop energy gain claimed in the trade`,
      format: FORMATS.pct,
      name: NAME.bandLow,
    },
    {
      part: "Band",
      label: "Band, high end",
      path: "band.highPct",
      value: band.highPct,
      unit: "% of today's drive and cooling energy",
      defaultValue: "50",
      source: `${COMMON}: the 25–50 % closed-loop energy gain claimed in the trade`,
      format: FORMATS.pct,
      name: NAME.bandHigh,
    },
    {
      part: "Sensitivity",
      label: "Swing of each driver",
      path: "sensitivity.swingPct",
      value: sensitivity.swingPct,
      unit: "± %",
      defaultValue: "20",
      source: COMMON,
      format: FORMATS.pct,
    },
    {
      part: "Thermal",
      label: "Insulation life halves every",
      path: "thermal.lifeHalvingK",
      value: thermal.lifeHalvingK,
      unit: "K",
      defaultValue: "10",
      source: `${COMMON}: a rule of thumb, as IEC 60216 gives every insulation material an interval of its own`,
      format: FORMATS.pct,
    },
  ];
}

const CONSTANTS: readonly { label: string; value: string; source: string }[] = [
  {
    label: "Temperature coefficient of copper resistance",
    value: "0.00393 1/K at 20 °C",
    source: published("International Annealed Copper Standard (IEC 60028)"),
  },
  {
    label: "Insulation class limits",
    value: "B 130 °C, F 155 °C, H 180 °C",
    source: published("IEC 60085, Table 1"),
  },
  {
    label: "Torque units converted to N·m",
    value: "oz·in, lbf·in, lbf·ft, kgf·cm",
    source: published("NIST SP 811, Appendix B"),
  },
  {
    label: "Motor thermal resistance when not given",
    value: "rated temperature rise / (2·I_R²·R20)",
    source: COMMON,
  },
];

const COLUMNS = [
  { header: "Part", width: 14 },
  { header: "Input", width: 44 },
  { header: "Value", width: 18 },
  { header: "Unit", width: 30 },
  { header: "Default", width: 10 },
  { header: "Source", width: 80 },
  { header: "Input path", width: 32 },
];

/**
 * Every input of the finance, margins, band, sensitivity and thermal parts, with its source,
 * then the machines (their downtime and throughput feed Capex and the yearly flows) and the
 * constants of the model. Per-axis inputs are on the Axes sheet.
 */
export function writeAssumptionsSheet(
  workbook: ExcelJS.Workbook,
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): MachineRanges {
  sheet.columns = COLUMNS.map((c) => ({ width: c.width }));
  const header = sheet.addRow(COLUMNS.map((c) => c.header));
  styleHeader(header);

  for (const entry of entries(input)) {
    const row = sheet.addRow([
      entry.part,
      entry.label,
      typeof entry.value === "string" ? safeText(entry.value) : entry.value,
      entry.unit,
      entry.defaultValue,
      entry.source,
      entry.path,
    ]);
    const value = row.getCell(3);
    if (entry.format && typeof entry.value === "number") value.numFmt = entry.format;
    if (entry.name) {
      styleInput(value);
      defineName(workbook, entry.name, SHEET.assumptions, { column: "C", row: row.number });
    }
  }

  sheet.addRow([]);
  const machines = writeMachines(sheet, input, result);
  sheet.addRow([]);
  styleSection(sheet.addRow(["Constants of the model"]).getCell(1));
  for (const c of CONSTANTS) sheet.addRow(["Model", c.label, c.value, "", "", c.source, ""]);
  return machines;
}

// Column A holds each machine's record key: the Summary's per-machine formulas match the Axes
// sheet's machine column against it (lib/workbook/summary-machines.ts), so it stays, headed as
// the technical key it is; the name a reader knows the machine by is beside it.
const MACHINE_HEADERS = [
  RECORD_KEY_HEADER.machine,
  "Machine",
  "Downtime for the retrofit (h)",
  "Throughput gain asked (%)",
  "Margin per output hour",
  "Throughput gain counted (%)",
  "Hours per year (most of its axes)",
  "Throughput value per year",
  "Notes",
];

function writeMachines(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): MachineRanges {
  styleSection(sheet.addRow(["Machines"]).getCell(1));
  styleHeader(sheet.addRow(MACHINE_HEADERS));
  const cur = currencyFormat(input.currency);
  const mostHours = new Map<string, number>();
  for (const axis of input.axes)
    mostHours.set(
      axis.machineId,
      Math.max(mostHours.get(axis.machineId) ?? 0, axis.duty.hoursPerYear),
    );
  const results = new Map(result.machines.map((m) => [m.id, m]));

  let first = 0;
  let last = 0;
  const rowOf = new Map<string, number>();
  for (const machine of input.machines) {
    const counted = results.get(machine.id);
    const hours = mostHours.get(machine.id) ?? 0;
    const gain = counted?.throughputGainPct ?? 0;
    const row = sheet.addRow([
      safeText(machine.id),
      safeText(machine.name),
      machine.downtimeHours,
      machine.throughputGainPct,
      money(machine.marginPerOutputHour),
      gain,
      hours,
      null,
      (counted?.warnings ?? []).map(machineWarningText).join(" "),
    ]);
    const r = row.number;
    // docs/model.md (The business case): a machine earns gain/100 · marginPerOutputHour · (highest hoursPerYear among its axes).
    row.getCell(8).value = {
      formula: `F${r}/100*E${r}*G${r}`,
      result: Number(counted?.throughputPerYear ?? 0),
    };
    row.getCell(5).numFmt = cur;
    row.getCell(8).numFmt = cur;
    styleInput(row.getCell(3));
    styleInput(row.getCell(5));
    if (first === 0) first = r;
    last = r;
    rowOf.set(machine.id, r);
  }
  if (first === 0) return { downtimeHours: null, throughput: null, rowOf };
  return {
    rowOf,
    downtimeHours: absoluteRange(SHEET.assumptions, "C", first, last),
    throughput: absoluteRange(SHEET.assumptions, "H", first, last),
  };
}
