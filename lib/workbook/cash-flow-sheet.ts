import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import {
  BEYOND_HORIZON,
  NOT_APPLICABLE,
  NO_RATE_FOUND,
  NO_SIGN_CHANGE,
  irrGuess,
  irrValue,
  paybackValue,
  roiValue,
  tariffInYear,
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
  yearRow,
  type AxesRanges,
  type MachineRanges,
  type ScenarioKey,
} from "./layout";

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

/**
 * The three scenarios of ENGINE.md §8 with live formulas. Years run down the rows, t = 0..30;
 * years beyond Horizon_Years count 0, so the horizon can be changed in the file. CF_0 = −Capex;
 * CF_t = saving·tariff·(1 + escalation)^(t−1) + reliability + maintenance + throughput − service.
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
      // §8: the tariff of year t is tariff·(1 + escalation)^(t−1).
      tariff.value = {
        formula: `${NAME.tariff}*(1+${NAME.escalation}/100)^($A${row.number}-1)`,
        result: tariffInYear(input, t),
      };
      tariff.numFmt = tariffFormat(input.currency);
    }
  }
  for (const scenario of SCENARIOS) writeScenario(sheet, input, result, scenario, currency);
  writeResults(workbook, sheet, input, result, currency);
  writeTerms(workbook, sheet, input, result, axes, machines, currency);
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
  const saving = `${scenarioName("Saving", scenario)}_kWh`;

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
    set(flow, `IF(${inHorizon},${saving}*$B${r}+${NAME.recurring},0)`, v.flow, currency);
    set(cum, `${cum}${p}+${flow}${r}`, v.cumulative, currency);
    set(disc, `${flow}${r}/(1+${NAME.discountRate}/100)^$A${r}`, v.discounted, currency);
    set(discCum, `${discCum}${p}+${disc}${r}`, v.discountedCumulative, currency);
    // §8: at the first t whose cumulative reaches 0, payback = (t − 1) + (−cum_(t−1))/CF_t.
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
    // §8: physics counts the drive and cooling energy saved; a band scenario counts its fraction
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

    // §8: NPV = CF_0 + Σ CF_t/(1+r)^t; the spreadsheet NPV() discounts its first value one period.
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
      `IF(AND(COUNTIF(${flows},">0")>0,COUNTIF(${flows},"<0")>0),IFERROR(IRR(${flows},${guessCell}),"${NO_RATE_FOUND}"),"${NO_SIGN_CHANGE}")`,
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
    // §8: ROI % = 100·(Σ_(t≥1) CF_t + CF_0)/Capex.
    put(
      results.roi,
      scenarioName("ROI", scenario),
      `IF(${NAME.capex}=0,"${NOT_APPLICABLE}",100*SUM(${flows})/${NAME.capex})`,
      roiValue(s.roiPct),
      FORMATS.pct2,
    );
  }
}

/** Today's cabinet cooling energy of the fleet: the band scenarios take their fraction of it. */
export function coolingOpenLoop(result: CaseResult, input: ParsedCase): number {
  let total = 0;
  result.axes.forEach(
    (axis, i) => (total += input.axes[i].quantity * axis.openLoop.coolingKWhPerYear),
  );
  return total;
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
      label: "Capex",
      name: NAME.capex,
      formula: `${sumOf(axes.capexTotal)}+${downtime}+${NAME.projectCost}`,
      value: Number(totals.capex),
      format: currency,
      how: "Σ axes' capex (Axes) + Σ machines' downtime hours × cost per hour + one-time project cost",
    },
    {
      row: terms.energySaved,
      label: "Drive energy saved, physics (kWh/yr)",
      name: NAME.energySaved,
      formula: sumOf(axes.energySavedTotal),
      value: totals.energySavedKWhPerYear,
      format: FORMATS.kWh,
      how: "Σ over the Axes sheet",
    },
    {
      row: terms.coolingSaved,
      label: "Cooling energy saved, physics (kWh/yr)",
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
      how: "reliability + maintenance + throughput − service",
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
