import type ExcelJS from "exceljs";
import { VALUE_SOURCES, type ValueSource } from "@/lib/engine";
import { SCENARIO_LABELS, SHEET } from "@/lib/glossary";

/**
 * Where each sheet puts what the others read. The Cash flow sheet has a fixed shape (31 year
 * rows, since the horizon may be set from 1 to 30 years in the file), so its cells are constants;
 * the Axes and Assumptions tables grow with the case and report their ranges when written.
 */

// The sheet names are glossary terms (lib/glossary/sheets.ts).
export { SHEET };

/** Header rows kept in view (and printed on every page) and leading columns kept in view, per sheet. */
export const FROZEN: Record<(typeof SHEET)[keyof typeof SHEET], { rows: number; columns: number }> =
  {
    [SHEET.summary]: { rows: 1, columns: 0 },
    [SHEET.axes]: { rows: 2, columns: 2 },
    [SHEET.cashFlow]: { rows: 2, columns: 1 },
    [SHEET.assumptions]: { rows: 1, columns: 0 },
    [SHEET.cautions]: { rows: 1, columns: 0 },
  };

/** The horizon of docs/model.md is a whole number of years from 1 to 30. */
export const MAX_HORIZON_YEARS = 30;

export const SCENARIOS = ["physics", "bandLow", "bandHigh"] as const;
export type ScenarioKey = (typeof SCENARIOS)[number];

/** Spreadsheet column letters of a 1-based index: 1 → A, 27 → AA. */
export function columnLetter(index: number): string {
  let n = index;
  let letters = "";
  while (n > 0) {
    const rem = (n - 1) % 26;
    letters = String.fromCharCode(65 + rem) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

/** A sheet name as a formula reference prefix: quoted when it holds anything but letters. */
export function sheetRef(sheet: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(sheet) ? sheet : `'${sheet.replace(/'/g, "''")}'`;
}

export function absolute(sheet: string, column: string, row: number): string {
  return `${sheetRef(sheet)}!$${column}$${row}`;
}

export function absoluteRange(sheet: string, column: string, first: number, last: number): string {
  return `${sheetRef(sheet)}!$${column}$${first}:$${column}$${last}`;
}

/** The Cash flow sheet: years down the rows, three groups of six columns, one per scenario. */
export const CASH_FLOW = {
  groupRow: 1,
  headerRow: 2,
  /** Row of year t is firstYearRow + t. */
  firstYearRow: 3,
  lastYearRow: 3 + MAX_HORIZON_YEARS,
  yearColumn: "A",
  tariffColumn: "B",
  /** First column of each scenario's group. */
  groupStart: { physics: 3, bandLow: 9, bandHigh: 15 } satisfies Record<ScenarioKey, number>,
  /** Offsets within a group. */
  offset: {
    flow: 0,
    cumulative: 1,
    discounted: 2,
    discountedCumulative: 3,
    payback: 4,
    discountedPayback: 5,
  },
  groupWidth: 6,
  resultsTitleRow: 35,
  results: {
    saving: 36,
    npv: 37,
    irr: 38,
    payback: 39,
    discountedPayback: 40,
    roi: 41,
    irrGuess: 42,
    paybackStatus: 43,
  },
  /** Break-even values of the physics scenario (docs/model.md (The business case)), in its flow column. */
  breakEven: {
    tariffSlope: 44,
    tariff: 45,
    stepLossSlope: 46,
    stepLossFactor: 47,
  },
  termsTitleRow: 49,
  /** The yearly terms are one column: C. */
  termsColumn: "C",
  terms: {
    capex: 50,
    energySaved: 51,
    coolingSaved: 52,
    energyOpenLoop: 53,
    coolingOpenLoop: 54,
    reliability: 55,
    maintenance: 56,
    throughput: 57,
    service: 58,
    recurring: 59,
    depreciation: 60,
  },
  /**
   * Value by source, year by year (docs/model.md (The business case)): one row per source, years 1..30 across
   * the columns from C, under shared factor rows; each scenario's sum row is its cash flow.
   */
  sources: {
    titleRow: 62,
    headerRow: 63,
    escalationRow: 64,
    inflationRow: 65,
    discountRow: 66,
    depreciationRow: 67,
    /** Title row of each scenario's block; its seven sources follow, then the sum row. */
    blockStart: { physics: 69, bandLow: 79, bandHigh: 89 } satisfies Record<ScenarioKey, number>,
    firstYearColumn: 3,
  },
} as const;

export function cashFlowColumn(scenario: ScenarioKey, part: keyof typeof CASH_FLOW.offset): string {
  return columnLetter(CASH_FLOW.groupStart[scenario] + CASH_FLOW.offset[part]);
}

export const yearRow = (t: number): number => CASH_FLOW.firstYearRow + t;

/** Column of year t (1..30) in the value-by-source block. */
export const sourceYearColumn = (t: number): string =>
  columnLetter(CASH_FLOW.sources.firstYearColumn + t - 1);

/** Row of one source of a scenario in the value-by-source block; "sum" is its cash flow. */
export function sourceRow(scenario: ScenarioKey, source: ValueSource | "sum"): number {
  const start = CASH_FLOW.sources.blockStart[scenario];
  return source === "sum"
    ? start + 1 + VALUE_SOURCES.length
    : start + 1 + VALUE_SOURCES.indexOf(source);
}

/** Scenario part of the defined names: NPV_Physics, NPV_BandLow, NPV_BandHigh. */
export const SCENARIO_NAME: Record<ScenarioKey, string> = {
  physics: "Physics",
  bandLow: "BandLow",
  bandHigh: "BandHigh",
};

/**
 * Scenario titles are the glossary's names, as on screen and in the e-mails. The band each
 * trade-claim scenario assumes is an input on the Assumptions sheet, so a title does not repeat it.
 */
export const SCENARIO_TITLE: Record<ScenarioKey, string> = SCENARIO_LABELS;

/**
 * Workbook-level defined names. The formulas of the Cash flow and Summary sheets read the
 * inputs through these, so that a reviewer sees `Tariff` rather than `Assumptions!$C$2`.
 */
export const NAME = {
  capex: "Capex",
  energySaved: "EnergySaved_kWh",
  coolingSaved: "CoolingSaved_kWh",
  energyOpenLoop: "EnergyOpenLoop_kWh",
  coolingOpenLoop: "CoolingOpenLoop_kWh",
  reliability: "Reliability_PerYear",
  maintenance: "Maintenance_PerYear",
  throughput: "Throughput_PerYear",
  recurring: "Recurring_PerYear",
  tariff: "Tariff",
  escalation: "TariffEscalation_Pct",
  discountRate: "DiscountRate_Pct",
  horizon: "Horizon_Years",
  laborRate: "LabourRate_PerHour",
  downtimeCost: "DowntimeCost_PerHour",
  projectCost: "ProjectOneTimeCost",
  serviceCost: "AnnualServiceCost",
  gridFactor: "GridFactor_kgPerKWh",
  bandLow: "BandLow_Pct",
  bandHigh: "BandHigh_Pct",
  inflation: "Inflation_Pct",
  taxRate: "TaxRate_Pct",
  depreciationYears: "Depreciation_Years",
  depreciation: "Depreciation_PerYear",
  breakEvenTariff: "BreakEven_Tariff",
  breakEvenStepLoss: "BreakEven_StepLossFactor",
} as const;

export const scenarioName = (figure: string, scenario: ScenarioKey): string =>
  `${figure}_${SCENARIO_NAME[scenario]}`;

export function defineName(
  workbook: ExcelJS.Workbook,
  name: string,
  sheet: string,
  address: { column: string; row: number },
): void {
  workbook.definedNames.add(absolute(sheet, address.column, address.row), name);
}

/** What the Axes sheet reports for the formulas of the Cash flow sheet. */
export interface AxesRanges {
  /** The machine id of each axis, to add up a machine's axes. */
  machineId: string;
  capexTotal: string;
  energySavedTotal: string;
  coolingSavedTotal: string;
  energyOpenLoopTotal: string;
  coolingOpenLoopTotal: string;
  reliability: string;
  maintenance: string;
}

/** What the Assumptions sheet reports: the machine table's columns that Capex and throughput sum. */
export interface MachineRanges {
  downtimeHours: string | null;
  throughput: string | null;
  /** Row of each machine (by id) in the Assumptions sheet's machine table. */
  rowOf: ReadonlyMap<string, number>;
}
