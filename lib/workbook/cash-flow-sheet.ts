import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { VALUE_SOURCES, type ValueSource } from "@/lib/engine";
import { IRR_HIGHEST_RATE } from "@/lib/engine/finance";
import { FINANCE_TERMS, PAYBACK_STATUS_LABELS, SCENARIO_LABELS } from "@/lib/glossary";
import {
  BEYOND_HORIZON,
  NOT_APPLICABLE,
  NO_BREAK_EVEN,
  IRR_ABOVE_SEARCH,
  NO_RATE_FOUND,
  NO_SIGN_CHANGE,
  breakEvenSlopes,
  breakEvenValues,
  coolingOpenLoop,
  irrGuess,
  irrValue,
  paybackStatusValue,
  paybackValue,
  roiValue,
  sourceValues,
  tariffInYear,
  yearFactors,
  yearValues,
} from "./cash-flow-values";
import {
  FORMATS,
  currencyFormat,
  styleGroupHeader,
  styleHeader,
  styleSection,
  tariffFormat,
} from "./formats";
import {
  CASH_FLOW,
  MAX_HORIZON_YEARS,
  NAME,
  SCENARIOS,
  SCENARIO_TITLE,
  SHEET,
  cashFlowColumn,
  columnLetter,
  defineName,
  scenarioName,
  sourceRow,
  sourceYearColumn,
  yearRow,
  type AxesRanges,
  type MachineRanges,
  type ScenarioKey,
} from "./layout";

/** The engine's own scenario, as a label suffix: "Drive energy saved, engineering estimate". */
const ESTIMATE = SCENARIO_LABELS.physics.toLowerCase();

const GROUP_HEADERS = [
  "Cash flow",
  "Cumulative",
  "Discounted cash flow",
  "Cumulative, discounted",
  "Payback reached this year (years)",
  "Discounted payback reached this year (years)",
];

const { terms, results, termsColumn } = CASH_FLOW;
const first = yearRow(0);
const last = yearRow(MAX_HORIZON_YEARS);

/** Σ over a range, or 0 when the table it sums is empty. */
const sumOf = (range: string | null): string => (range === null ? "0" : `SUM(${range})`);

export { coolingOpenLoop };

/**
 * The three scenarios of docs/model.md (The business case) with live formulas. Years run down the rows,
 * t = 0..30; years beyond Horizon_Years count 0, so the horizon can be changed in the file.
 * CF_0 = −Capex; CF_t is the sum of its value by source (the block below the terms): energy and
 * cooling at the escalated tariff, reliability, maintenance and throughput less service at the
 * inflated price, and tax on the flow less straight-line depreciation.
 */
export function writeCashFlowSheet(
  workbook: ExcelJS.Workbook,
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  axes: AxesRanges,
  machines: MachineRanges,
): void {
  const currency = currencyFormat(input.currency);
  sheet.getColumn(1).width = 44;
  sheet.getColumn(2).width = 16;
  for (let c = 3; c < 3 + 3 * CASH_FLOW.groupWidth; c++) sheet.getColumn(c).width = 15;

  const groupRow = sheet.getRow(CASH_FLOW.groupRow);
  const headerRow = sheet.getRow(CASH_FLOW.headerRow);
  groupRow.getCell(1).value = "Year";
  headerRow.getCell(1).value = "t";
  groupRow.getCell(2).value = "Tariff";
  headerRow.getCell(2).value = "Tariff in year t";
  for (const scenario of SCENARIOS) {
    const start = CASH_FLOW.groupStart[scenario];
    groupRow.getCell(start).value = SCENARIO_TITLE[scenario];
    sheet.mergeCells(
      CASH_FLOW.groupRow,
      start,
      CASH_FLOW.groupRow,
      start + CASH_FLOW.groupWidth - 1,
    );
    GROUP_HEADERS.forEach((h, i) => (headerRow.getCell(start + i).value = h));
  }
  styleGroupHeader(groupRow);
  styleHeader(headerRow);
  headerRow.height = 45;

  for (let t = 0; t <= MAX_HORIZON_YEARS; t++) {
    const row = sheet.getRow(yearRow(t));
    row.getCell(1).value = t;
    row.getCell(1).alignment = { horizontal: "left" };
    if (t >= 1) {
      const tariff = row.getCell(2);
      // docs/model.md (The business case): the tariff of year t is tariff·(1 + escalation)^(t−1).
      tariff.value = {
        formula: `${NAME.tariff}*(1+${NAME.escalation}/100)^($A${row.number}-1)`,
        result: tariffInYear(input, t),
      };
      tariff.numFmt = tariffFormat(input.currency);
    }
  }
  for (const scenario of SCENARIOS) writeScenario(sheet, input, result, scenario, currency);
  writeResults(workbook, sheet, input, result, currency);
  writeBreakEven(workbook, sheet, input, result);
  writeTerms(workbook, sheet, input, result, axes, machines, currency);
  writeSources(sheet, input, result, currency);
}

function writeScenario(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  scenario: ScenarioKey,
  currency: string,
): void {
  const values = yearValues(input, result.scenarios[scenario]);
  const col = (part: keyof typeof CASH_FLOW.offset) => cashFlowColumn(scenario, part);
  const [flow, cum, disc, discCum, payback, discPayback] = [
    col("flow"),
    col("cumulative"),
    col("discounted"),
    col("discountedCumulative"),
    col("payback"),
    col("discountedPayback"),
  ];
  const sumRow = sourceRow(scenario, "sum");

  for (let t = 0; t <= MAX_HORIZON_YEARS; t++) {
    const r = yearRow(t);
    const p = r - 1;
    const v = values[t];
    const row = sheet.getRow(r);
    const set = (column: string, formula: string, value: number | string, format: string) => {
      const cell = row.getCell(column);
      cell.value = { formula, result: value };
      cell.numFmt = format;
    };
    if (t === 0) {
      set(flow, `-${NAME.capex}`, v.flow, currency);
      set(cum, `${flow}${r}`, v.cumulative, currency);
      set(disc, `${flow}${r}`, v.discounted, currency);
      set(discCum, `${disc}${r}`, v.discountedCumulative, currency);
      continue;
    }
    const inHorizon = `$A${r}<=${NAME.horizon}`;
    // The sum of the year's value by source (the block below): they add up to it by construction.
    set(flow, `IF(${inHorizon},${sourceYearColumn(t)}${sumRow},0)`, v.flow, currency);
    set(cum, `${cum}${p}+${flow}${r}`, v.cumulative, currency);
    set(disc, `${flow}${r}/(1+${NAME.discountRate}/100)^$A${r}`, v.discounted, currency);
    set(discCum, `${discCum}${p}+${disc}${r}`, v.discountedCumulative, currency);
    // docs/model.md (The business case): at the first t whose cumulative reaches 0, payback = (t − 1) + (−cum_(t−1))/CF_t.
    set(
      payback,
      `IF(AND(${inHorizon},${cum}${p}<0,${cum}${r}>=0),$A${r}-1+(-${cum}${p})/${flow}${r},"")`,
      v.payback,
      FORMATS.years,
    );
    set(
      discPayback,
      `IF(AND(${inHorizon},${discCum}${p}<0,${discCum}${r}>=0),$A${r}-1+(-${discCum}${p})/${disc}${r},"")`,
      v.discountedPayback,
      FORMATS.years,
    );
  }
}

const RESULT_LABELS: Record<keyof typeof results, string> = {
  saving: "Energy saving counted (kWh/yr, drives and cooling)",
  npv: "NPV",
  irr: "IRR",
  payback: "Payback, simple (years)",
  discountedPayback: "Payback, discounted (years)",
  roi: "ROI over the horizon (%)",
  irrGuess: "IRR search starts at (lower bound of the IRR)",
  paybackStatus: `Payback status (${Object.values(PAYBACK_STATUS_LABELS).join(", ")})`,
};

function writeResults(
  workbook: ExcelJS.Workbook,
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  currency: string,
): void {
  styleSection(sheet.getCell(CASH_FLOW.resultsTitleRow, 1));
  sheet.getCell(CASH_FLOW.resultsTitleRow, 1).value = "Results";
  for (const [key, row] of Object.entries(results))
    sheet.getCell(row, 1).value = RESULT_LABELS[key as keyof typeof results];

  const { totals } = result;
  const bandBase = totals.energyOpenLoopKWhPerYear + coolingOpenLoop(result, input);
  for (const scenario of SCENARIOS) {
    const s = result.scenarios[scenario];
    const flow = cashFlowColumn(scenario, "flow");
    const range = (part: keyof typeof CASH_FLOW.offset, from = first) =>
      `${cashFlowColumn(scenario, part)}${from}:${cashFlowColumn(scenario, part)}${last}`;
    const title = sheet.getCell(CASH_FLOW.resultsTitleRow, CASH_FLOW.groupStart[scenario]);
    title.value = SCENARIO_TITLE[scenario];
    title.font = { bold: true };

    const put = (
      row: number,
      name: string,
      formula: string,
      value: number | string,
      format: string,
    ) => {
      const cell = sheet.getCell(`${flow}${row}`);
      cell.value = { formula, result: value };
      cell.numFmt = format;
      defineName(workbook, name, SHEET.cashFlow, { column: flow, row });
    };
    // docs/model.md (The business case): physics counts the drive and cooling energy saved; a band scenario counts its fraction
    // of today's (open-loop) drive and cooling energy.
    const savingFormula =
      scenario === "physics"
        ? `${NAME.energySaved}+${NAME.coolingSaved}`
        : `${scenario === "bandLow" ? NAME.bandLow : NAME.bandHigh}/100*(${NAME.energyOpenLoop}+${NAME.coolingOpenLoop})`;
    const savingValue =
      scenario === "physics"
        ? totals.energySavedKWhPerYear + totals.coolingSavedKWhPerYear
        : ((scenario === "bandLow" ? input.band.lowPct : input.band.highPct) / 100) * bandBase;
    put(
      results.saving,
      `${scenarioName("Saving", scenario)}_kWh`,
      savingFormula,
      savingValue,
      FORMATS.kWh,
    );

    // docs/model.md (The business case): NPV = CF_0 + Σ CF_t/(1+r)^t; the spreadsheet NPV() discounts its first value one period.
    put(
      results.npv,
      scenarioName("NPV", scenario),
      `NPV(${NAME.discountRate}/100,${range("flow", first + 1)})+${flow}${first}`,
      Number(s.npv),
      currency,
    );
    const flows = range("flow");
    // IRR() iterates from a guess, 10 % by default, and gives up after a few steps when the root
    // is far from it (LibreOffice: 20 Newton steps). With CF_0 < 0 and every later flow ≥ 0,
    // Jensen's inequality puts (ΣCF_t/Capex)^(1/t̄) − 1, t̄ the cash-weighted mean year, at or
    // below the IRR, and Newton's method on the convex, falling NPV(r) climbs from there
    // straight to the root. Other flows start from the default.
    const later = range("flow", first + 1);
    const years = `$A$${first + 1}:$A$${last}`;
    const guessCell = `${flow}${results.irrGuess}`;
    put(
      results.irrGuess,
      scenarioName("IrrGuess", scenario),
      `IF(AND(${flow}${first}<0,COUNTIF(${later},"<0")=0,SUM(${later})>0),(SUM(${later})/-${flow}${first})^(SUM(${later})/SUMPRODUCT(${years},${later}))-1,0.1)`,
      irrGuess(s),
      FORMATS.ratio,
    );
    put(
      results.irr,
      scenarioName("IRR", scenario),
      `IF(AND(COUNTIF(${flows},">0")>0,COUNTIF(${flows},"<0")>0),IFERROR(IRR(${flows},${guessCell}),IF(AND(${flow}${first}<0,NPV(${IRR_HIGHEST_RATE},${later})+${flow}${first}>0),"${IRR_ABOVE_SEARCH}","${NO_RATE_FOUND}")),"${NO_SIGN_CHANGE}")`,
      irrValue(s),
      FORMATS.ratio,
    );
    const paybackFormula = (part: "payback" | "discountedPayback") =>
      `IF(${NAME.capex}=0,0,IF(COUNT(${range(part, first + 1)})=0,"${BEYOND_HORIZON}",MIN(${range(part, first + 1)})))`;
    put(
      results.payback,
      scenarioName("Payback", scenario),
      paybackFormula("payback"),
      paybackValue(s.paybackYears),
      FORMATS.years,
    );
    put(
      results.discountedPayback,
      scenarioName("DiscountedPayback", scenario),
      paybackFormula("discountedPayback"),
      paybackValue(s.discountedPaybackYears),
      FORMATS.years,
    );
    // docs/model.md (The business case): "reached" with a simple payback; else "beyond-horizon" while the last flow is > 0.
    put(
      results.paybackStatus,
      scenarioName("PaybackStatus", scenario),
      `IF(ISNUMBER(${flow}${results.payback}),"${PAYBACK_STATUS_LABELS.reached}",IF(INDEX(${flows},${NAME.horizon}+1)>0,"${PAYBACK_STATUS_LABELS["beyond-horizon"]}","${PAYBACK_STATUS_LABELS.never}"))`,
      PAYBACK_STATUS_LABELS[paybackStatusValue(s)],
      "@",
    );
    // docs/model.md (The business case): ROI % = 100·(Σ_(t≥1) CF_t + CF_0)/Capex.
    put(
      results.roi,
      scenarioName("ROI", scenario),
      `IF(${NAME.capex}=0,"${NOT_APPLICABLE}",100*SUM(${flows})/${NAME.capex})`,
      roiValue(s.roiPct),
      FORMATS.pct2,
    );
  }
}

const BREAK_EVEN_LABELS: Record<keyof typeof CASH_FLOW.breakEven, string> = {
  tariffSlope: `NPV change per 1 of tariff (per kWh), ${ESTIMATE}`,
  tariff: `Break-even tariff (per kWh): NPV = 0, ${ESTIMATE}`,
  stepLossSlope: `NPV change per 1 of the step-loss factor, ${ESTIMATE}`,
  stepLossFactor: `Break-even step-loss factor (× every axis's events): NPV = 0, ${ESTIMATE}`,
};

/**
 * docs/model.md (The business case): the flows are affine in the tariff and in a factor on every axis's events,
 * so NPV is too, with the slopes (1 − tax)·kWh·Σ escalation_t·discount_t and
 * (1 − tax)·reliability·Σ inflation_t·discount_t over the shared factor rows. Break-even =
 * where that line crosses 0; "none" when the slope is ≤ 0 or the answer negative, as the engine.
 */
function writeBreakEven(
  workbook: ExcelJS.Workbook,
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): void {
  const { breakEven } = CASH_FLOW;
  const { sources } = CASH_FLOW;
  const flow = cashFlowColumn("physics", "flow");
  const years = (row: number) =>
    `$${sourceYearColumn(1)}$${row}:$${sourceYearColumn(MAX_HORIZON_YEARS)}$${row}`;
  const slopes = breakEvenSlopes(input, result);
  const values = breakEvenValues(input, result);
  const keep = `(1-${NAME.taxRate}/100)`;
  const rows: [keyof typeof breakEven, string | null, string, number | string, string][] = [
    [
      "tariffSlope",
      null,
      `${keep}*(${NAME.energySaved}+${NAME.coolingSaved})*SUMPRODUCT(${years(sources.escalationRow)},${years(sources.discountRow)})`,
      slopes.tariff,
      FORMATS.ratio,
    ],
    [
      "tariff",
      NAME.breakEvenTariff,
      `IF(${flow}${breakEven.tariffSlope}<=0,"${NO_BREAK_EVEN}",IF(${NAME.tariff}-NPV_Physics/${flow}${breakEven.tariffSlope}<0,"${NO_BREAK_EVEN}",${NAME.tariff}-NPV_Physics/${flow}${breakEven.tariffSlope}))`,
      values.tariff,
      tariffFormat(input.currency),
    ],
    [
      "stepLossSlope",
      null,
      `${keep}*${NAME.reliability}*SUMPRODUCT(${years(sources.inflationRow)},${years(sources.discountRow)})`,
      slopes.stepLoss,
      FORMATS.ratio,
    ],
    [
      "stepLossFactor",
      NAME.breakEvenStepLoss,
      `IF(${flow}${breakEven.stepLossSlope}<=0,"${NO_BREAK_EVEN}",IF(1-NPV_Physics/${flow}${breakEven.stepLossSlope}<0,"${NO_BREAK_EVEN}",1-NPV_Physics/${flow}${breakEven.stepLossSlope}))`,
      values.stepLossFactor,
      FORMATS.ratio,
    ],
  ];
  for (const [key, name, formula, value, format] of rows) {
    const row = breakEven[key];
    sheet.getCell(row, 1).value = BREAK_EVEN_LABELS[key];
    const cell = sheet.getCell(`${flow}${row}`);
    cell.value = { formula, result: value };
    cell.numFmt = format;
    if (name) defineName(workbook, name, SHEET.cashFlow, { column: flow, row });
  }
}

function writeTerms(
  workbook: ExcelJS.Workbook,
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  axes: AxesRanges,
  machines: MachineRanges,
  currency: string,
): void {
  const title = sheet.getCell(CASH_FLOW.termsTitleRow, 1);
  title.value = "Yearly terms the flows read";
  styleSection(title);
  const { totals } = result;
  const downtime =
    machines.downtimeHours === null ? "0" : `SUM(${machines.downtimeHours})*${NAME.downtimeCost}`;
  const rows: {
    row: number;
    label: string;
    name: string | null;
    formula: string;
    value: number;
    format: string;
    how: string;
  }[] = [
    {
      row: terms.capex,
      label: FINANCE_TERMS.upFrontCost,
      name: NAME.capex,
      formula: `${sumOf(axes.capexTotal)}+${downtime}+${NAME.projectCost}`,
      value: Number(totals.capex),
      format: currency,
      how: "Σ axes' up-front cost (Axes) + Σ machines' downtime hours × cost per hour + one-time project cost",
    },
    {
      row: terms.energySaved,
      label: `Drive energy saved, ${ESTIMATE} (kWh/yr)`,
      name: NAME.energySaved,
      formula: sumOf(axes.energySavedTotal),
      value: totals.energySavedKWhPerYear,
      format: FORMATS.kWh,
      how: "Σ over the Axes sheet",
    },
    {
      row: terms.coolingSaved,
      label: `Cooling energy saved, ${ESTIMATE} (kWh/yr)`,
      name: NAME.coolingSaved,
      formula: sumOf(axes.coolingSavedTotal),
      value: totals.coolingSavedKWhPerYear,
      format: FORMATS.kWh,
      how: "Σ over the Axes sheet; negative when the kit's drive loses more heat than today's",
    },
    {
      row: terms.energyOpenLoop,
      label: "Drive energy today, open loop (kWh/yr)",
      name: NAME.energyOpenLoop,
      formula: sumOf(axes.energyOpenLoopTotal),
      value: totals.energyOpenLoopKWhPerYear,
      format: FORMATS.kWh,
      how: "Σ over the Axes sheet; the band scenarios take their fraction of it",
    },
    {
      row: terms.coolingOpenLoop,
      label: "Cooling energy today, open loop (kWh/yr)",
      name: NAME.coolingOpenLoop,
      formula: sumOf(axes.coolingOpenLoopTotal),
      value: coolingOpenLoop(result, input),
      format: FORMATS.kWh,
      how: "Σ over the Axes sheet; the band scenarios take their fraction of it",
    },
    {
      row: terms.reliability,
      label: "Step losses avoided, per year",
      name: NAME.reliability,
      formula: sumOf(axes.reliability),
      value: Number(totals.reliabilityPerYear),
      format: currency,
      how: "Σ over the Axes sheet; axes whose kit is undersized count 0",
    },
    {
      row: terms.maintenance,
      label: "Maintenance saving, per year",
      name: NAME.maintenance,
      formula: sumOf(axes.maintenance),
      value: Number(totals.maintenancePerYear),
      format: currency,
      how: "Σ over the Axes sheet",
    },
    {
      row: terms.throughput,
      label: "Throughput value, per year",
      name: NAME.throughput,
      formula: sumOf(machines.throughput),
      value: Number(totals.throughputPerYear),
      format: currency,
      how: "Σ over the machines on the Assumptions sheet",
    },
    {
      row: terms.service,
      label: "Annual service cost",
      name: null,
      formula: NAME.serviceCost,
      value: Number(input.finance.annualServiceCost),
      format: currency,
      how: "from the Assumptions sheet",
    },
    {
      row: terms.recurring,
      label: "Yearly terms besides energy",
      name: NAME.recurring,
      formula: `${termsColumn}${terms.reliability}+${termsColumn}${terms.maintenance}+${termsColumn}${terms.throughput}-${termsColumn}${terms.service}`,
      value:
        Number(totals.reliabilityPerYear) +
        Number(totals.maintenancePerYear) +
        Number(totals.throughputPerYear) -
        Number(input.finance.annualServiceCost),
      format: currency,
      how: "reliability + maintenance + throughput − service, in year 1 (before inflation)",
    },
    {
      row: terms.depreciation,
      label: "Depreciation per year, straight line",
      name: NAME.depreciation,
      formula: `SLN(${NAME.capex},0,${NAME.depreciationYears})`,
      value: Number(totals.capex) / input.finance.depreciationYears,
      format: currency,
      how: "SLN(Capex, 0, depreciation years): the whole capex, no salvage value, over the depreciation years; none after them",
    },
  ];
  const howColumn = columnLetter(CASH_FLOW.groupStart.physics + 1);
  for (const t of rows) {
    sheet.getCell(t.row, 1).value = t.label;
    const cell = sheet.getCell(`${termsColumn}${t.row}`);
    cell.value = { formula: t.formula, result: t.value };
    cell.numFmt = t.format;
    sheet.getCell(`${howColumn}${t.row}`).value = t.how;
    if (t.name) defineName(workbook, t.name, SHEET.cashFlow, { column: termsColumn, row: t.row });
  }
}

const SOURCE_LABELS: Record<ValueSource, string> = {
  energy: "Energy (drives)",
  cooling: "Cooling",
  reliability: "Reliability (step losses avoided)",
  maintenance: "Maintenance",
  throughput: "Throughput",
  service: "Service (cost)",
  tax: "Tax",
};

/**
 * Value by source, year by year (docs/model.md (The business case)), so that finance can reconcile every flow:
 * years 1..30 across, shared factor rows (0 beyond the horizon), then per scenario one row per
 * source and their sum, which is the scenario's cash flow in the year table above.
 */
function writeSources(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  currency: string,
): void {
  const { sources } = CASH_FLOW;
  const title = sheet.getCell(sources.titleRow, 1);
  title.value = "Value by source, year by year (the columns are years 1..30)";
  styleSection(title);
  const header = sheet.getRow(sources.headerRow);
  header.getCell(1).value = "t";
  const factors = yearFactors(input, Number(result.totals.capex));
  const hdr = (t: number) => `${sourceYearColumn(t)}$${sources.headerRow}`;
  const inHorizon = (t: number) => `${hdr(t)}<=${NAME.horizon}`;
  const shared: [number, string, (t: number) => string, number[], string][] = [
    [
      sources.escalationRow,
      "Tariff escalation factor (1 + escalation)^(t−1)",
      (t) => `IF(${inHorizon(t)},(1+${NAME.escalation}/100)^(${hdr(t)}-1),0)`,
      factors.escalation,
      FORMATS.ratio,
    ],
    [
      sources.inflationRow,
      "Inflation factor (1 + inflation)^(t−1)",
      (t) => `IF(${inHorizon(t)},(1+${NAME.inflation}/100)^(${hdr(t)}-1),0)`,
      factors.inflation,
      FORMATS.ratio,
    ],
    [
      sources.discountRow,
      "Discount factor 1/(1 + rate)^t",
      (t) => `1/(1+${NAME.discountRate}/100)^${hdr(t)}`,
      factors.discount,
      FORMATS.ratio,
    ],
    [
      sources.depreciationRow,
      "Depreciation (straight line)",
      (t) => `IF(AND(${inHorizon(t)},${hdr(t)}<=${NAME.depreciationYears}),${NAME.depreciation},0)`,
      factors.depreciation,
      currency,
    ],
  ];
  for (let t = 1; t <= MAX_HORIZON_YEARS; t++) {
    header.getCell(sourceYearColumn(t)).value = t;
    for (const [row, label, formula, values, format] of shared) {
      sheet.getCell(row, 1).value = label;
      const cell = sheet.getCell(`${sourceYearColumn(t)}${row}`);
      cell.value = { formula: formula(t), result: values[t - 1] };
      cell.numFmt = format;
    }
  }
  styleHeader(header);

  for (const scenario of SCENARIOS) {
    const start = sources.blockStart[scenario];
    const blockTitle = sheet.getCell(start, 1);
    blockTitle.value = SCENARIO_TITLE[scenario];
    blockTitle.font = { bold: true };
    const values = sourceValues(input, result, scenario);
    // docs/model.md (The business case): physics counts the energy saved; a band scenario its fraction of today's energy.
    const share =
      scenario === "physics" ? "" : `${scenario === "bandLow" ? NAME.bandLow : NAME.bandHigh}/100*`;
    const energyKWh = scenario === "physics" ? NAME.energySaved : `${share}${NAME.energyOpenLoop}`;
    const coolingKWh =
      scenario === "physics" ? NAME.coolingSaved : `${share}${NAME.coolingOpenLoop}`;
    const esc = (t: number) => `${sourceYearColumn(t)}$${sources.escalationRow}`;
    const infl = (t: number) => `${sourceYearColumn(t)}$${sources.inflationRow}`;
    const first = sourceRow(scenario, "energy");
    const lastBeforeTax = sourceRow(scenario, "service");
    const formulas: Record<ValueSource, (t: number) => string> = {
      energy: (t) => `${energyKWh}*${NAME.tariff}*${esc(t)}`,
      cooling: (t) => `${coolingKWh}*${NAME.tariff}*${esc(t)}`,
      reliability: (t) => `${NAME.reliability}*${infl(t)}`,
      maintenance: (t) => `${NAME.maintenance}*${infl(t)}`,
      throughput: (t) => `${NAME.throughput}*${infl(t)}`,
      service: (t) => `-${NAME.serviceCost}*${infl(t)}`,
      // docs/model.md (The business case): tax on the flow before tax less the year's depreciation; negative is a shield.
      tax: (t) => {
        const c = sourceYearColumn(t);
        return `IF(${inHorizon(t)},-${NAME.taxRate}/100*(SUM(${c}${first}:${c}${lastBeforeTax})-${c}$${sources.depreciationRow}),0)`;
      },
    };
    for (const source of VALUE_SOURCES)
      sheet.getCell(sourceRow(scenario, source), 1).value = SOURCE_LABELS[source];
    const sumRow = sourceRow(scenario, "sum");
    sheet.getCell(sumRow, 1).value = "Cash flow (sum of the sources)";
    sheet.getCell(sumRow, 1).font = { bold: true };
    for (let t = 1; t <= MAX_HORIZON_YEARS; t++) {
      const c = sourceYearColumn(t);
      let total = 0;
      for (const source of VALUE_SOURCES) {
        const cell = sheet.getCell(`${c}${sourceRow(scenario, source)}`);
        const value = values[source][t - 1];
        total += value;
        cell.value = { formula: formulas[source](t), result: value };
        cell.numFmt = currency;
      }
      const sum = sheet.getCell(`${c}${sumRow}`);
      sum.value = {
        formula: `SUM(${c}${first}:${c}${sourceRow(scenario, "tax")})`,
        result:
          t <= input.finance.horizonYears ? Number(result.scenarios[scenario].cashFlows[t]) : total,
      };
      sum.numFmt = currency;
      sum.font = { bold: true };
    }
  }
}
