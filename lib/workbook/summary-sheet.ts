import type ExcelJS from "exceljs";
import { VALUE_SOURCES, type CaseResult, type ParsedCase } from "@/lib/engine";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import { SOURCE_ORIGIN, typedShare } from "@/lib/results/value-reliance";
import {
  BAND_POSITION_LABELS,
  FINANCE_TERMS,
  PAYBACK_STATUS_LABELS,
  SCENARIO_LABELS,
} from "@/lib/glossary";
import {
  NOT_APPLICABLE,
  breakEvenValues,
  irrValue,
  paybackStatusValue,
  paybackValue,
  roiValue,
  sourceValues,
  yearFactors,
} from "./cash-flow-values";
import { coolingOpenLoop } from "./cash-flow-sheet";
import { FORMATS, currencyFormat, styleHeader, styleTitle, tariffFormat } from "./formats";
import {
  CASH_FLOW,
  NAME,
  SCENARIOS,
  SCENARIO_TITLE,
  SHEET,
  absolute,
  sheetRef,
  cashFlowColumn,
  sourceRow,
  sourceYearColumn,
  MAX_HORIZON_YEARS,
  scenarioName,
  yearRow,
  type AxesRanges,
  type MachineRanges,
  type ScenarioKey,
} from "./layout";
import { writeMachineValue } from "./summary-machines";
import { safeText } from "./safe-text";
import type { WorkbookMeta } from "./types";

/** The engine's own scenario, as a label suffix: "Drive energy saved, engineering estimate". */
const ESTIMATE = SCENARIO_LABELS.physics.toLowerCase();

export const SUMMARY_TABLE_HEADER_ROW = 11;

interface Figure {
  label: string;
  unit: string;
  format: string;
  formula: (s: ScenarioKey, column: string, row: number) => string;
  value: (s: ScenarioKey) => number | string;
}

/**
 * The headline of the three scenarios. Every figure is a formula over the Cash flow sheet (by
 * its defined names), so the Summary moves when a reviewer changes an input.
 */
export function writeSummarySheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  meta: WorkbookMeta,
  ranges: { axes: AxesRanges; machines: MachineRanges },
): void {
  const currency = currencyFormat(input.currency);
  sheet.getColumn(1).width = 46;
  for (const c of [2, 3, 4]) sheet.getColumn(c).width = 22;
  sheet.getColumn(5).width = 16;
  for (const c of [6, 7, 8, 9]) sheet.getColumn(c).width = 20;

  const title = sheet.getCell("A1");
  title.value = safeText(meta.title);
  styleTitle(title);
  const facts: [string, string][] = [
    ["Account", meta.accountName],
    ["Site", meta.siteName],
    ["Case", meta.caseName],
    ["Proposal version", meta.version === null ? "draft (not frozen)" : String(meta.version)],
    ["Currency", input.currency],
    ["Engine version", meta.engineVersion],
    ["Generated at", meta.generatedAt],
    ["Axes (units)", `${input.axes.length} (${input.axes.reduce((n, a) => n + a.quantity, 0)})`],
  ];
  facts.forEach(([label, value], i) => {
    sheet.getCell(2 + i, 1).value = label;
    sheet.getCell(2 + i, 2).value = safeText(value);
  });

  const header = sheet.getRow(SUMMARY_TABLE_HEADER_ROW);
  header.values = ["Figure", ...SCENARIOS.map((s) => SCENARIO_TITLE[s]), "Unit"];
  styleHeader(header);
  header.height = 30;

  const { scenarios, totals } = result;
  const savingValue = (s: ScenarioKey) =>
    s === "physics"
      ? totals.energySavedKWhPerYear + totals.coolingSavedKWhPerYear
      : ((s === "bandLow" ? input.band.lowPct : input.band.highPct) / 100) *
        (totals.energyOpenLoopKWhPerYear + coolingOpenLoop(result, input));
  const cashFlowCell = (s: ScenarioKey, row: number) =>
    absolute(SHEET.cashFlow, cashFlowColumn(s, "flow"), row);

  const figures: Figure[] = [
    {
      label: FINANCE_TERMS.upFrontCost,
      unit: input.currency,
      format: currency,
      formula: () => NAME.capex,
      value: () => Number(totals.capex),
    },
    {
      label: "Energy saving counted (drives and cooling)",
      unit: "kWh/yr",
      format: FORMATS.kWh,
      formula: (s) => `${scenarioName("Saving", s)}_kWh`,
      value: savingValue,
    },
    {
      label: "CO₂ avoided",
      unit: "t/yr",
      format: FORMATS.physics,
      formula: (_s, column, row) => `${column}${row - 1}*${NAME.gridFactor}/1000`,
      value: (s) => (savingValue(s) * input.finance.gridKgCo2PerKWh) / 1000,
    },
    {
      label: "Cash flow in year 1",
      unit: input.currency,
      format: currency,
      formula: (s) => cashFlowCell(s, yearRow(1)),
      value: (s) => Number(scenarios[s].cashFlows[1]),
    },
    {
      label: "NPV",
      unit: input.currency,
      format: currency,
      formula: (s) => scenarioName("NPV", s),
      value: (s) => Number(scenarios[s].npv),
    },
    {
      label: "IRR",
      unit: "per year",
      format: FORMATS.ratio,
      formula: (s) => scenarioName("IRR", s),
      value: (s) => irrValue(scenarios[s]),
    },
    {
      label: "Payback, simple",
      unit: "years",
      format: FORMATS.years,
      formula: (s) => scenarioName("Payback", s),
      value: (s) => paybackValue(scenarios[s].paybackYears),
    },
    {
      label: "Payback, discounted",
      unit: "years",
      format: FORMATS.years,
      formula: (s) => scenarioName("DiscountedPayback", s),
      value: (s) => paybackValue(scenarios[s].discountedPaybackYears),
    },
    {
      label: "Payback status",
      unit: Object.values(PAYBACK_STATUS_LABELS).join(", "),
      format: "@",
      formula: (s) => scenarioName("PaybackStatus", s),
      value: (s) => PAYBACK_STATUS_LABELS[paybackStatusValue(scenarios[s])],
    },
    {
      label: "ROI over the horizon",
      unit: "%",
      format: FORMATS.pct2,
      formula: (s) => scenarioName("ROI", s),
      value: (s) => roiValue(scenarios[s].roiPct),
    },
  ];
  figures.forEach((f, i) => {
    const row = SUMMARY_TABLE_HEADER_ROW + 1 + i;
    sheet.getCell(row, 1).value = f.label;
    SCENARIOS.forEach((s, j) => {
      const cell = sheet.getCell(row, 2 + j);
      cell.value = {
        formula: f.formula(s, cell.address.replace(/\d+$/, ""), row),
        result: f.value(s),
      };
      cell.numFmt = f.format;
    });
    sheet.getCell(row, 5).value = f.unit;
  });

  const bandTop = SUMMARY_TABLE_HEADER_ROW + figures.length + 2;
  writeBandPosition(sheet, input, result, bandTop);
  // docs/model.md (The business case): where the physics scenario's NPV crosses 0.
  const breakEven = breakEvenValues(input, result);
  const breakEvenRows: [string, string, number | string, string][] = [
    [
      `Break-even tariff, ${ESTIMATE} (NPV = 0)`,
      NAME.breakEvenTariff,
      breakEven.tariff,
      tariffFormat(input.currency),
    ],
    [
      `Break-even step-loss factor, ${ESTIMATE} (× every axis's events)`,
      NAME.breakEvenStepLoss,
      breakEven.stepLossFactor,
      FORMATS.ratio,
    ],
  ];
  breakEvenRows.forEach(([label, formula, value, format], i) => {
    sheet.getCell(bandTop + 5 + i, 1).value = label;
    const cell = sheet.getCell(bandTop + 5 + i, 2);
    cell.value = { formula, result: value };
    cell.numFmt = format;
  });
  sheet.getCell(bandTop + 8, 1).value =
    "Savings and payback are estimates from the stated assumptions (Assumptions sheet); read the Cautions sheet.";
  writeValueBySource(sheet, input, result, currency, bandTop + 10);
  // Below the case's value by source: the same split by machine (lib/workbook/summary-machines.ts).
  writeMachineValue(
    sheet,
    input,
    result,
    ranges,
    currency,
    bandTop + 12 + VALUE_SOURCES.length + 4,
  );
}

/** First row of the Summary's value-by-source block (its header); the sources follow in VALUE_SOURCES order, then the total. */
export const summarySourcesTop = (sheet: ExcelJS.Worksheet): number | null => {
  let found: number | null = null;
  sheet.eachRow((row, n) => {
    if (row.getCell(1).value === SOURCES_HEADER) found = n;
  });
  return found;
};

const SOURCES_HEADER = "Value by source over the horizon";

/**
 * Each source added over the horizon, as live sums of the Cash flow sheet's value-by-source rows
 * (lib/workbook/layout.ts sourceRow), and their total, which is the sum of the flows of years 1..N.
 */
function writeValueBySource(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  currency: string,
  top: number,
): void {
  const header = sheet.getRow(top);
  header.getCell(1).value = SOURCES_HEADER;
  SCENARIOS.forEach((s, j) => {
    header.getCell(2 + j).value = SCENARIO_TITLE[s];
    header.getCell(DISCOUNTED_COLUMN + j).value = `${SCENARIO_TITLE[s]}, discounted`;
  });
  header.getCell(ORIGIN_COLUMN).value = "Where its figures come from";
  styleHeader(header);
  const cashFlowYears = (r: number) =>
    `${sheetRef(SHEET.cashFlow)}!$${sourceYearColumn(1)}$${r}:$${sourceYearColumn(MAX_HORIZON_YEARS)}$${r}`;
  // Each year divided by (1 + rate)^t, as the engine's NPV does (lib/engine/finance.ts): the
  // Cash flow sheet's discount-factor row reads the case's rate (defined name DiscountRate_Pct).
  const discountYears = cashFlowYears(CASH_FLOW.sources.discountRow);
  const factors = yearFactors(input, Number(result.totals.capex)).discount;
  const discountedOf = (values: readonly (string | number)[]) =>
    values.reduce<number>((acc, v, t) => acc + Number(v) * (factors[t] ?? 0), 0);
  const sumOf = (values: readonly (string | number)[]) =>
    values.reduce<number>((acc, v) => acc + Number(v), 0);
  // Worked from the stored flows when a result predates value by source (lib/workbook/cash-flow-values.ts).
  const values = Object.fromEntries(SCENARIOS.map((s) => [s, sourceValues(input, result, s)]));
  VALUE_SOURCES.forEach((source, i) => {
    const row = top + 1 + i;
    sheet.getCell(row, 1).value = VALUE_SOURCE_LABELS[source];
    const origin = SOURCE_ORIGIN[source];
    sheet.getCell(row, ORIGIN_COLUMN).value = origin ? ORIGIN_WORDS[origin] : ORIGIN_WORDS.neither;
    SCENARIOS.forEach((s, j) => {
      const r = sourceRow(s, source);
      const cell = sheet.getCell(row, 2 + j);
      cell.value = {
        formula: `SUM(${cashFlowYears(r)})`,
        result: sumOf(values[s][source]),
      };
      cell.numFmt = currency;
      const discounted = sheet.getCell(row, DISCOUNTED_COLUMN + j);
      discounted.value = {
        formula: `SUMPRODUCT(${cashFlowYears(r)},${discountYears})`,
        result: discountedOf(values[s][source]),
      };
      discounted.numFmt = currency;
    });
  });
  const totalRow = top + 1 + VALUE_SOURCES.length;
  sheet.getCell(totalRow, 1).value = "Total: the flows of years 1 to the horizon";
  SCENARIOS.forEach((s, j) => {
    const column = sheet.getCell(totalRow, 2 + j).address.replace(/\d+$/, "");
    const cell = sheet.getCell(totalRow, 2 + j);
    cell.value = {
      formula: `SUM(${column}${top + 1}:${column}${totalRow - 1})`,
      result: sumOf(result.scenarios[s].cashFlows.slice(1)),
    };
    cell.numFmt = currency;
    cell.font = { bold: true };
    const discountedColumn = sheet
      .getCell(totalRow, DISCOUNTED_COLUMN + j)
      .address.replace(/\d+$/, "");
    const discounted = sheet.getCell(totalRow, DISCOUNTED_COLUMN + j);
    const flows = result.scenarios[s].cashFlows;
    discounted.value = {
      formula: `SUM(${discountedColumn}${top + 1}:${discountedColumn}${totalRow - 1})`,
      result: discountedOf(flows.slice(1)),
    };
    discounted.numFmt = currency;
    discounted.font = { bold: true };
    // The discounted total less the up-front cost is the scenario's NPV, which finance can tie
    // to the headline above.
    const npv = sheet.getCell(totalRow + 1, DISCOUNTED_COLUMN + j);
    npv.value = {
      formula: `${discountedColumn}${totalRow}-${NAME.capex}`,
      result: discountedOf(flows.slice(1)) + Number(flows[0]),
    };
    npv.numFmt = currency;
  });
  sheet.getCell(totalRow + 1, 1).value =
    "Discounted total less the up-front cost: the net present value";
  writeTypedShare(sheet, result, top, totalRow + 2);
}

/** Column of the value-by-source block that says where each source's figures come from. */
export const ORIGIN_COLUMN = 2 + 2 * SCENARIOS.length;

const ORIGIN_WORDS = {
  typed: "typed for this case",
  computed: "computed by the engine",
  neither: "follows from the others",
} as const;

/** Label of the Summary row that gives the share of the value resting on typed figures. */
export const TYPED_SHARE_LABEL =
  "Share of the value over the horizon resting on figures typed for this case";

/**
 * The share lib/results/value-reliance.ts states on screen, as a live formula: of the sources that
 * add value over the horizon (a positive sum), those typed for the case, over all of them but tax.
 */
function writeTypedShare(
  sheet: ExcelJS.Worksheet,
  result: CaseResult,
  top: number,
  row: number,
): void {
  const first = top + 1;
  const last = top + VALUE_SOURCES.length;
  const originColumn = sheet.getCell(first, ORIGIN_COLUMN).address.replace(/\d+$/, "");
  const origins = `$${originColumn}$${first}:$${originColumn}$${last}`;
  sheet.getCell(row, 1).value = TYPED_SHARE_LABEL;
  SCENARIOS.forEach((s, j) => {
    const column = sheet.getCell(row, 2 + j).address.replace(/\d+$/, "");
    const sums = `${column}${first}:${column}${last}`;
    const adding = (origin: string) => `SUMPRODUCT((${origins}${origin})*(${sums}>0)*${sums})`;
    const cell = sheet.getCell(row, 2 + j);
    const reliance = typedShare(result.scenarios[s]);
    cell.value = {
      formula: `IFERROR(${adding(`="${ORIGIN_WORDS.typed}"`)}/${adding(`<>"${ORIGIN_WORDS.neither}"`)},"${NOT_APPLICABLE}")`,
      result: reliance ?? NOT_APPLICABLE,
    };
    cell.numFmt = FORMATS.ratio;
  });
}

/** First column of the discounted value by source (one per scenario), beside the plain sums. */
export const DISCOUNTED_COLUMN = 2 + SCENARIOS.length;

/** Where the physics lands against the band claimed in the trade (docs/model.md (Energy and cooling), inclusive ends). */
function writeBandPosition(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  top: number,
): void {
  const { energyOpenLoopKWhPerYear: today, energySavedKWhPerYear: saved } = result.totals;
  const share = today > 0 ? saved / today : NOT_APPLICABLE;
  const rows: [string, string, number | string, string][] = [
    ["Drive energy today, open loop (kWh/yr)", NAME.energyOpenLoop, today, FORMATS.kWh],
    [`Drive energy saved, ${ESTIMATE} (kWh/yr)`, NAME.energySaved, saved, FORMATS.kWh],
    [
      "Share of today's drive energy saved",
      `IF(${NAME.energyOpenLoop}>0,${NAME.energySaved}/${NAME.energyOpenLoop},"${NOT_APPLICABLE}")`,
      share,
      FORMATS.ratio,
    ],
  ];
  rows.forEach(([label, formula, value, format], i) => {
    sheet.getCell(top + i, 1).value = label;
    const cell = sheet.getCell(top + i, 2);
    cell.value = { formula, result: value };
    cell.numFmt = format;
  });
  const shareCell = `B${top + 2}`;
  const position =
    typeof share !== "number"
      ? NOT_APPLICABLE
      : share * 100 < input.band.lowPct
        ? BAND_POSITION_LABELS.below
        : share * 100 > input.band.highPct
          ? BAND_POSITION_LABELS.above
          : BAND_POSITION_LABELS.within;
  sheet.getCell(top + 3, 1).value = "Against the band claimed in the trade";
  sheet.getCell(top + 3, 2).value = {
    formula: `IF(ISNUMBER(${shareCell}),IF(${shareCell}*100<${NAME.bandLow},"${BAND_POSITION_LABELS.below}",IF(${shareCell}*100>${NAME.bandHigh},"${BAND_POSITION_LABELS.above}","${BAND_POSITION_LABELS.within}")),"${NOT_APPLICABLE}")`,
    result: position,
  };
}
