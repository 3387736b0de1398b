import type ExcelJS from "exceljs";
import type { AxisResult, ParsedAxis, ParsedCase } from "@/lib/engine";

/** What one column of the Axes sheet writes for an axis. `cell(key)` is the same row's cell of another column. */
export interface AxisRowContext {
  axis: ParsedAxis;
  result: AxisResult;
  machineName: string;
  finance: ParsedCase["finance"];
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

/** The closed-loop status the reliability formula tests (docs/model.md (The business case): not "undersized"). */
export const UNDERSIZED = "undersized";

/**
 * Whether the axis avoids step-loss events closed loop (docs/model.md (The business case)): its kit is not
 * undersized, and a sensorless kit does not run below its minimum speed (open loop in effect).
 * Read from the result's status and warnings, which a result of engine v1 has too.
 */
export const avoidsEvents = (result: AxisResult): boolean =>
  result.closedLoop.status !== UNDERSIZED && !result.warnings.includes("SENSORLESS_LOW_SPEED");

/** The cost of one event as the Axes sheet's formula computes it (docs/model.md (The business case)), in doubles. */
export function eventCostValue(r: AxisRowContext): number {
  const { costPerEvent, event } = r.axis.reliability;
  return (
    money(costPerEvent ?? "0") +
    ((event?.downtimeMinutes ?? 0) / 60) * money(r.finance.downtimeCostPerHour) +
    (event?.scrapParts ?? 0) * money(event?.scrapCostPerPart ?? "0") +
    (event?.restartLaborHours ?? 0) * money(r.finance.laborRatePerHour)
  );
}
