import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { AXIS_COLUMNS } from "./axes-columns";
import { currencyFormat, styleGroupHeader, styleHeader } from "./formats";
import { SHEET, absoluteRange, columnLetter, type AxesRanges } from "./layout";

export const AXES_HEADER_ROWS = 2;
export const AXES_FIRST_ROW = AXES_HEADER_ROWS + 1;

/** Column letter of each Axes column key. */
export const AXIS_COLUMN_LETTER: ReadonlyMap<string, string> = new Map(
  AXIS_COLUMNS.map((c, i) => [c.key, columnLetter(i + 1)]),
);

export function axisColumnLetter(key: string): string {
  const letter = AXIS_COLUMN_LETTER.get(key);
  if (letter === undefined) throw new Error(`no Axes column "${key}"`);
  return letter;
}

/**
 * One row per axis: its inputs, its per-axis results (one unit) and its money and totals as
 * formulas over the same row. Returns the ranges the Cash flow sheet sums.
 */
export function writeAxesSheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): AxesRanges {
  const currency = currencyFormat(input.currency);
  sheet.columns = AXIS_COLUMNS.map((c) => ({ width: c.width }));
  // One style object per column, shared by its cells: exceljs recognises a style object it has
  // seen and skips re-serialising it, which is most of the time a 2,000-axis sheet takes to
  // write. The shared objects are never mutated after this point.
  const styles: Partial<ExcelJS.Style>[] = AXIS_COLUMNS.map((c) =>
    c.format ? { numFmt: c.format === "currency" ? currency : c.format } : {},
  );

  const groups = sheet.addRow(
    AXIS_COLUMNS.map((c, i) => (i === 0 || AXIS_COLUMNS[i - 1].group !== c.group ? c.group : null)),
  );
  styleGroupHeader(groups);
  const headers = sheet.addRow(AXIS_COLUMNS.map((c) => c.header));
  styleHeader(headers);
  headers.height = 45;

  const machineNames = new Map(input.machines.map((m) => [m.id, m.name]));
  input.axes.forEach((axis, i) => {
    const rowNumber = AXES_FIRST_ROW + i;
    const context = {
      axis,
      result: result.axes[i],
      machineName: machineNames.get(axis.machineId) ?? "",
      finance: input.finance,
      cell: (key: string) => `${axisColumnLetter(key)}${rowNumber}`,
    };
    const row = sheet.addRow(AXIS_COLUMNS.map((c) => c.value(context)));
    for (let c = 0; c < styles.length; c++) row.getCell(c + 1).style = styles[c];
    // Streaming writer: the row is serialised now and its cells let go.
    row.commit();
  });
  sheet.autoFilter = {
    from: { row: AXES_HEADER_ROWS, column: 1 },
    to: { row: AXES_HEADER_ROWS, column: AXIS_COLUMNS.length },
  };

  const last = AXES_FIRST_ROW + input.axes.length - 1;
  const range = (key: string) =>
    absoluteRange(SHEET.axes, axisColumnLetter(key), AXES_FIRST_ROW, last);
  return {
    machineId: range("machine"),
    capexTotal: range("capexTotal"),
    energySavedTotal: range("savedTotal"),
    coolingSavedTotal: range("coolingTotal"),
    energyOpenLoopTotal: range("olEnergyTotal"),
    coolingOpenLoopTotal: range("olCoolingTotal"),
    reliability: range("reliability"),
    maintenance: range("maintenanceTotal"),
  };
}
