import type ExcelJS from "exceljs";
import type { AxisResult, ParsedAxis } from "@/lib/engine";

/** What one column of the Axes sheet writes for an axis. `cell(key)` is the same row's cell of another column. */
export interface AxisRowContext {
  axis: ParsedAxis;
  result: AxisResult;
  machineName: string;
  cell: (key: string) => string;
}

export interface AxisColumn {
  key: string;
  group: string;
  header: string;
  width: number;
  /** "currency" is resolved to the case's currency format. */
  format?: string | "currency";
  value: (row: AxisRowContext) => ExcelJS.CellValue;
}

/** A number or, where the engine reports null, a word saying why there is none. */
export const orNull = (value: number | null, text = "n/a"): number | string => value ?? text;

/** A number from a money string: spreadsheets compute in doubles, which hold cents exactly enough. */
export const money = (amount: string): number => Number(amount);

/** The closed-loop status the reliability formula tests (ENGINE.md §8: not "undersized"). */
export const UNDERSIZED = "undersized";
