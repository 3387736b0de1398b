import type ExcelJS from "exceljs";
import { currencyMinorUnits } from "@/lib/engine";

/**
 * Number formats. The currency is the case's ISO 4217 code (validated as three capital
 * letters, so it is safe inside a format string), shown after the amount with the currency's
 * own minor unit, e.g. `#,##0.00 "EUR"` or `#,##0 "JPY"`.
 */
export function currencyFormat(currency: string): string {
  const places = currencyMinorUnits(currency);
  const digits = places > 0 ? `.${"0".repeat(places)}` : "";
  const unit = ` "${currency}"`;
  return `#,##0${digits}${unit};-#,##0${digits}${unit}`;
}

/** A price per kWh needs more places than the currency's minor unit (0.2400 EUR/kWh). */
export function tariffFormat(currency: string): string {
  return `#,##0.0000 "${currency}/kWh"`;
}

export const FORMATS = {
  kWh: "#,##0.00",
  ratio: "0.00%",
  years: "0.00",
  pct: "0.0",
  pct2: "0.00",
  physics: "0.000",
  fine: "0.000000",
  whole: "0",
  text: "@",
} as const;

const HEADER_FILL: ExcelJS.Fill = {
  type: "pattern",
  pattern: "solid",
  fgColor: { argb: "FFE4E8EE" },
};
const GROUP_FILL: ExcelJS.Fill = {
  type: "pattern",
  pattern: "solid",
  fgColor: { argb: "FFCBD3DE" },
};
const INPUT_FILL: ExcelJS.Fill = {
  type: "pattern",
  pattern: "solid",
  fgColor: { argb: "FFFFF6D6" },
};

/** Column headers: bold on a light fill, wrapped so that units fit under the name. */
export function styleHeader(row: ExcelJS.Row): void {
  row.font = { bold: true };
  row.alignment = { vertical: "middle", wrapText: true };
  row.eachCell((cell) => {
    cell.fill = HEADER_FILL;
  });
}

/** A group header above the column headers (Motor, Drive today, Open loop …). */
export function styleGroupHeader(row: ExcelJS.Row): void {
  row.font = { bold: true };
  row.eachCell((cell) => {
    cell.fill = GROUP_FILL;
  });
}

export function styleTitle(cell: ExcelJS.Cell): void {
  cell.font = { bold: true, size: 14 };
}

export function styleSection(cell: ExcelJS.Cell): void {
  cell.font = { bold: true, size: 12 };
}

/** Cells a reviewer is meant to change: the formulas read them. */
export function styleInput(cell: ExcelJS.Cell): void {
  cell.fill = INPUT_FILL;
}

/**
 * Frozen header rows (and leading columns) and the print setup: landscape A4, one page wide,
 * the header rows repeated on every page. Given when the sheet is added: exceljs's streaming
 * writer writes the sheet's views and page properties as soon as the sheet exists.
 */
export function sheetOptions(
  frozenRows: number,
  frozenColumns = 0,
): Partial<ExcelJS.AddWorksheetOptions> {
  return {
    views: [{ state: "frozen", xSplit: frozenColumns, ySplit: frozenRows }],
    pageSetup: {
      orientation: "landscape",
      paperSize: 9, // A4
      fitToPage: true,
      fitToWidth: 1,
      fitToHeight: 0,
      printTitlesRow: `1:${frozenRows}`,
    },
  };
}
