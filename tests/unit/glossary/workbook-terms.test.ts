import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { buildDossier } from "@/lib/dossier";
import { caseInputSchema } from "@/lib/engine";
import {
  BAND_POSITION_LABELS,
  DOSSIER_SHEET,
  DRIVER_LABELS,
  FINANCE_TERMS,
  LOOP_STATUS_LABELS,
  PAYBACK_STATUS_LABELS,
  SCENARIO_LABELS,
  SHEET,
} from "@/lib/glossary";
import { DEFAULT_RANGES } from "@/lib/validations/dossier";
import { buildDossierWorkbook } from "@/lib/workbook";
import { CASH_FLOW, SCENARIOS } from "@/lib/workbook/layout";
import { SUMMARY_TABLE_HEADER_ROW } from "@/lib/workbook/summary-sheet";
import { META, buildWorkbookOf, sheetOf } from "../workbook/fixture-workbook";

// A reviewer reads the workbook beside the screens: its sheet names, scenario headings and status
// cells must be the glossary's words, not the database's or the engine's keys.

/** What a cell shows: its text, or a formula's cached result. */
const shown = (cell: ExcelJS.Cell): unknown => {
  const v = cell.value as { result?: unknown } | unknown;
  return v !== null && typeof v === "object" && "result" in v ? v.result : v;
};

function textCells(workbook: ExcelJS.Workbook): { where: string; text: string }[] {
  const out: { where: string; text: string }[] = [];
  workbook.eachSheet((sheet) =>
    sheet.eachRow((row) =>
      row.eachCell((cell) => {
        const value = shown(cell);
        if (typeof value === "string")
          out.push({ where: `${sheet.name}!${cell.address}`, text: value });
      }),
    ),
  );
  return out;
}

const RAW_STATUS_KEYS = [
  ...Object.keys(LOOP_STATUS_LABELS),
  ...Object.keys(PAYBACK_STATUS_LABELS),
  ...Object.keys(BAND_POSITION_LABELS),
];
const scenarioTitles = SCENARIOS.map((s) => SCENARIO_LABELS[s]);

describe("the proposal workbook speaks the glossary", () => {
  it("names its sheets, in reading order, with the glossary's sheet names", async () => {
    const { workbook } = await buildWorkbookOf();
    expect(workbook.worksheets.map((s) => s.name)).toEqual(Object.values(SHEET));
  });

  it("heads the scenario columns of the Summary and the Cash flow sheet with the scenarios' names", async () => {
    const { workbook } = await buildWorkbookOf();
    const summary = sheetOf(workbook, SHEET.summary);
    expect([2, 3, 4].map((c) => summary.getRow(SUMMARY_TABLE_HEADER_ROW).getCell(c).value)).toEqual(
      scenarioTitles,
    );
    const cashFlow = sheetOf(workbook, SHEET.cashFlow);
    for (const s of SCENARIOS) {
      const column = CASH_FLOW.groupStart[s];
      expect(cashFlow.getRow(CASH_FLOW.groupRow).getCell(column).value).toBe(SCENARIO_LABELS[s]);
      expect(cashFlow.getRow(CASH_FLOW.resultsTitleRow).getCell(column).value).toBe(
        SCENARIO_LABELS[s],
      );
      expect(cashFlow.getCell(CASH_FLOW.sources.blockStart[s], 1).value).toBe(SCENARIO_LABELS[s]);
    }
  });

  it("writes each status cell as a glossary status: loop statuses on Axes, payback status on Summary and Cash flow", async () => {
    const { workbook, result } = await buildWorkbookOf();
    const axes = sheetOf(workbook, SHEET.axes);
    const headers = (axes.getRow(2).values as ExcelJS.CellValue[]).map((v) => String(v ?? ""));
    const statusColumns = headers.flatMap((h, c) => (h === "Status" ? [c] : []));
    expect(statusColumns).toHaveLength(2);
    const loopLabels = Object.values(LOOP_STATUS_LABELS);
    for (let r = 3; r < 3 + result.axes.length; r++)
      for (const c of statusColumns) expect(loopLabels).toContain(axes.getRow(r).getCell(c).value);

    const paybackLabels = Object.values(PAYBACK_STATUS_LABELS);
    const summary = sheetOf(workbook, SHEET.summary);
    let statusRow: ExcelJS.Row | undefined;
    summary.eachRow((row) => {
      if (row.getCell(1).value === "Payback status") statusRow = row;
    });
    expect(statusRow).toBeDefined();
    for (const c of [2, 3, 4]) expect(paybackLabels).toContain(shown(statusRow!.getCell(c)));
    const cashFlow = sheetOf(workbook, SHEET.cashFlow);
    for (const s of SCENARIOS) {
      const cell = cashFlow.getCell(CASH_FLOW.results.paybackStatus, CASH_FLOW.groupStart[s]);
      expect(paybackLabels).toContain(shown(cell));
      for (const label of paybackLabels) expect(cell.formula).toContain(`"${label}"`);
    }
  });

  it("calls the investment the up-front cost and the labour rate by its British name", async () => {
    const { workbook } = await buildWorkbookOf();
    const labels = textCells(workbook).map((c) => c.text);
    expect(labels).toContain(FINANCE_TERMS.upFrontCost);
    expect(labels).toContain(FINANCE_TERMS.upFrontCostOneUnit);
    expect(labels).toContain(FINANCE_TERMS.labourRate);
  });

  it("prints no raw status key, no American 'Labor' and no bare 'Capex' or 'physics' label in any cell", async () => {
    const { workbook } = await buildWorkbookOf();
    for (const { where, text } of textCells(workbook)) {
      expect(RAW_STATUS_KEYS, where).not.toContain(text);
      expect(text, where).not.toMatch(/\bLabor\b|^Capex\b|\bphysics\b/);
    }
  });
});

describe("the dossier workbook speaks the glossary", () => {
  it("adds its sheets under the glossary's names and names the drivers as the tornado on screen does", async () => {
    const input = caseInputSchema.parse(fixtureCase);
    const dossier = buildDossier(input, { seed: 4242, ...DEFAULT_RANGES });
    const file = await buildDossierWorkbook(input, dossier, {
      ...META,
      engineVersion: dossier.result.engineVersion,
    });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(file as unknown as ArrayBuffer);
    const names = workbook.worksheets.map((s) => s.name);
    expect(names.slice(0, 5 + Object.keys(DOSSIER_SHEET).length)).toEqual([
      ...Object.values(SHEET),
      ...Object.values(DOSSIER_SHEET),
    ]);

    const driverLabels = Object.values(DRIVER_LABELS);
    for (const name of [DOSSIER_SHEET.sensitivity, DOSSIER_SHEET.uncertainty]) {
      const sheet = sheetOf(workbook, name);
      let afterHeader = false;
      let drivers = 0;
      sheet.eachRow((row) => {
        const first = row.getCell(1).value;
        if (first === "Driver") afterHeader = true;
        else if (afterHeader && typeof first === "string" && first !== "") {
          if (first.startsWith("Each driver") || !driverLabels.includes(first)) afterHeader = false;
          else drivers++;
        } else afterHeader = false;
      });
      expect(drivers, name).toBeGreaterThanOrEqual(4);
    }
    for (const { where, text } of textCells(workbook)) {
      expect(RAW_STATUS_KEYS, where).not.toContain(text);
      expect(text, where).not.toMatch(/\bLabor\b|^Capex\b|\bphysics\b/);
    }
  });
});
