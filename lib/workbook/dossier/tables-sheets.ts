import type ExcelJS from "exceljs";
import type { Dossier } from "@/lib/dossier";
import type { ParsedCase, SensitivityDriver } from "@/lib/engine";
import { DRIVER_LABELS, FINANCE_TERMS, SCENARIO_LABELS } from "@/lib/glossary";
import { BEYOND_HORIZON } from "../cash-flow-values";
import {
  FORMATS,
  currencyFormat,
  styleHeader,
  styleSection,
  styleTitle,
  tariffFormat,
} from "../formats";
import { SHEET, cashFlowColumn, sheetRef, yearRow } from "../layout";

const money = (v: string) => Number(v);
const payback = (years: number | null) => years ?? BEYOND_HORIZON;

/** The drivers by the glossary's names, as the tornado on screen names them. */
export const DRIVER_LABEL: Record<SensitivityDriver, string> = DRIVER_LABELS;

/**
 * Month by month, physics scenario: each month is a live twelfth of its year's flow on the
 * Cash flow sheet, so a change there carries through. Month 0 is the investment.
 */
export function writeMonthlySheet(sheet: ExcelJS.Worksheet, input: ParsedCase, dossier: Dossier) {
  const currency = currencyFormat(input.currency);
  sheet.columns = [{ width: 10 }, { width: 8 }, { width: 20 }, { width: 22 }, { width: 70 }];
  styleHeader(sheet.addRow(["Month", "Year t", "Cash flow", "Cumulative", "How"]));
  const flowCol = cashFlowColumn("physics", "flow");
  const ref = sheetRef(SHEET.cashFlow);
  dossier.monthly.rows.forEach((m, i) => {
    const r = i + 2;
    const row = sheet.addRow([m.month, m.year]);
    row.getCell(3).value = {
      formula:
        m.month === 0
          ? `${ref}!$${flowCol}$${yearRow(0)}`
          : `${ref}!$${flowCol}$${yearRow(m.year)}/12`,
      result: money(m.flow),
    };
    row.getCell(4).value = {
      formula: i === 0 ? `C${r}` : `D${r - 1}+C${r}`,
      result: money(m.cumulative),
    };
    row.getCell(3).numFmt = currency;
    row.getCell(4).numFmt = currency;
    if (i === 0)
      row.getCell(5).value =
        `The ${FINANCE_TERMS.upFrontCost.toLowerCase()} (−Capex), at the start`;
    if (i === 1)
      row.getCell(5).value =
        "Each year's flow spread evenly over its 12 months (tariff escalation steps yearly)";
  });
  sheet.addRow([]);
  const note = sheet.addRow([
    "Payback month",
    "",
    dossier.monthly.paybackMonth ?? BEYOND_HORIZON,
    "",
    "First month whose cumulative cash is ≥ 0; the NPV stays the yearly one of the Cash flow sheet.",
  ]);
  note.font = { bold: true };
}

/** Simple payback of the physics scenario over tariff (rows) × running hours (columns). */
export function writePaybackGridSheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  dossier: Dossier,
) {
  const grid = dossier.paybackGrid;
  sheet.getColumn(1).width = 22;
  sheet.getColumn(2).width = 16;
  for (let c = 3; c < 3 + grid.hoursPct.length; c++) sheet.getColumn(c).width = 13;
  styleTitle(sheet.addRow(["Simple payback (years), tariff × running hours"]).getCell(1));
  sheet.addRow([
    `Each cell is the ${SCENARIO_LABELS.physics.toLowerCase()} with the tariff and every axis's hours changed together; other terms as in the case.`,
  ]);
  sheet.addRow([]);
  styleHeader(
    sheet.addRow([
      "Tariff change",
      "Tariff",
      ...grid.hoursPct.map((h) => `Hours ${h > 0 ? "+" : ""}${h} %`),
    ]),
  );
  grid.tariffPct.forEach((t, i) => {
    const row = sheet.addRow([
      `${t > 0 ? "+" : ""}${t} %`,
      money(grid.tariffs[i]),
      ...grid.paybackYears[i].map(payback),
    ]);
    row.getCell(2).numFmt = tariffFormat(input.currency);
    for (let c = 3; c < 3 + grid.hoursPct.length; c++) row.getCell(c).numFmt = FORMATS.years;
    if (t === 0) row.font = { bold: true };
  });
}

/** NPV and simple payback with each driver moved alone by ±10, ±20 and ±30 %. */
export function writeSensitivitySheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  dossier: Dossier,
) {
  const currency = currencyFormat(input.currency);
  sheet.columns = [
    { width: 26 },
    { width: 10 },
    ...Array.from({ length: 4 }, () => ({ width: 18 })),
  ];
  for (const { swingPct, rows } of dossier.sensitivity) {
    styleSection(sheet.addRow([`Each driver at −${swingPct} % and +${swingPct} %`]).getCell(1));
    styleHeader(
      sheet.addRow([
        "Driver",
        "Swing",
        `NPV at −${swingPct} %`,
        `NPV at +${swingPct} %`,
        `Payback at −${swingPct} % (years)`,
        `Payback at +${swingPct} % (years)`,
      ]),
    );
    for (const r of rows) {
      const row = sheet.addRow([
        DRIVER_LABEL[r.driver],
        `±${swingPct} %`,
        money(r.low.npv),
        money(r.high.npv),
        payback(r.low.paybackYears),
        payback(r.high.paybackYears),
      ]);
      row.getCell(3).numFmt = currency;
      row.getCell(4).numFmt = currency;
      row.getCell(5).numFmt = FORMATS.years;
      row.getCell(6).numFmt = FORMATS.years;
    }
    sheet.addRow([]);
  }
}
