import { parseCell } from "./cells";
import {
  IMPORT_FIELDS,
  importField,
  type AxisColumns,
  type ImportField,
  type ImportFieldKey,
} from "./fields";
import { headerFor, type HeaderMatch } from "./headers";
import type { SheetData } from "./read";

/** The site's values for the fields a row may leave blank (ENGINE.md §2 duty). */
export interface SiteDefaults {
  hoursPerYear: number;
  ambientC: number;
}

/** One valid row: every axis column in SI units, its machine's name and its spreadsheet row. */
export type ValidatedAxis = AxisColumns & { machineName: string; sourceRow: number };

export interface ImportCellError {
  /** Row number as a spreadsheet shows it: the header is row 1, the first data row 2. */
  row: number;
  /** The header text as in the file; the field's label for a column that is missing. */
  column: string;
  message: string;
}

export interface ValidationResult {
  /** Non-blank data rows. */
  rowsRead: number;
  /** Only rows without any error, in file order; none when the header row has an error. */
  rows: ValidatedAxis[];
  errors: ImportCellError[];
  /** Distinct machine names in the order the file first names them. */
  machinesNamed: string[];
}

const SLOT = new Map<ImportFieldKey, number>(IMPORT_FIELDS.map((f, i) => [f.key, i]));
const slotOf = (key: ImportFieldKey) => SLOT.get(key) as number;
const MACHINE_SLOT = slotOf("machine");
const LOAD_SLOT = slotOf("loadTorqueNm");
const PEAK_SLOT = slotOf("peakTorqueNm");
const MOVE_SLOT = slotOf("movePct");
const HOLD_SLOT = slotOf("holdPct");

type Value = number | string | null;

function toAxis(values: readonly Value[], sourceRow: number): ValidatedAxis {
  const axis: Record<string, unknown> = {};
  for (let i = 0; i < IMPORT_FIELDS.length; i++) {
    if (i !== MACHINE_SLOT) axis[IMPORT_FIELDS[i].key] = values[i];
  }
  axis.machineName = values[MACHINE_SLOT];
  axis.sourceRow = sourceRow;
  return axis as ValidatedAxis;
}

interface Column {
  index: number;
  header: string;
  field: ImportField;
  slot: number;
  unit: string;
  factor: number;
}

/** Value of a field no column fills, or a blank cell. */
function absentValue(field: ImportField, site: SiteDefaults): Value {
  if (field.siteDefault) return site[field.key as keyof SiteDefaults];
  return field.default ?? null;
}

const isBlankRow = (row: readonly string[]) =>
  row.every((cell) => cell === undefined || cell.trim() === "");

const showIn = (si: number, typed: string, unit: string) =>
  unit === "N·m"
    ? `${Number(si.toPrecision(12))} N·m`
    : `${typed.trim()} ${unit} = ${Number(si.toPrecision(6))} N·m`;

/**
 * Every data row of `sheet` checked against the import fields through `match` (from
 * matchHeaders). Header problems and missing required columns are errors of row 1. Blank rows
 * are skipped and not counted; a blank cell takes its field's default (or the site's value).
 * Hand-written checks rather than a zod schema per row: 10,000 rows × 33 columns stay well
 * under the benchmark's 5 s, and every message names the column's unit.
 */
export function validateRows(
  sheet: Pick<SheetData, "headers" | "rows">,
  match: HeaderMatch,
  siteDefaults: SiteDefaults,
): ValidationResult {
  const errors: ImportCellError[] = [];
  for (const problem of match.problems)
    errors.push({ row: 1, column: problem.header, message: problem.message });
  for (const key of match.missing) {
    const field = importField(key) as ImportField;
    errors.push({
      row: 1,
      column: field.label,
      message: `required column is missing; add a column headed "${headerFor(field)}" or map one of the columns to ${field.label}`,
    });
  }

  // With a header fault (a missing, doubled or misread column) no row can be complete.
  const headerOk = errors.length === 0;

  const columns: Column[] = Object.entries(match.mapping)
    .map(([index, m]) => ({
      index: Number(index),
      header: sheet.headers[Number(index)] ?? "",
      field: importField(m.key) as ImportField,
      slot: SLOT.get(m.key) as number,
      unit: m.unit,
      factor: m.factor,
    }))
    .sort((a, b) => a.index - b.index);
  const columnOf = new Map<ImportFieldKey, Column>(columns.map((c) => [c.field.key, c]));

  // Values live in an array in IMPORT_FIELDS order while a row is read: copying a 33-slot array
  // per row is far cheaper than spreading an object, which the 10,000-row benchmark notices.
  const absent = IMPORT_FIELDS.map((f) => absentValue(f, siteDefaults));
  const rows: ValidatedAxis[] = [];
  const machines = new Set<string>();
  let rowsRead = 0;

  for (let i = 0; i < sheet.rows.length; i++) {
    const cells = sheet.rows[i];
    if (isBlankRow(cells)) continue;
    rowsRead++;
    const rowNumber = i + 2;
    const values = absent.slice();
    const errorsBefore = errors.length;

    for (const column of columns) {
      const raw = cells[column.index] ?? "";
      const { field } = column;
      if (!field.required && raw.trim() === "") continue;
      const result = parseCell(field, raw, column.unit, column.factor, column.header);
      if (result.ok) values[column.slot] = result.value;
      else errors.push({ row: rowNumber, column: column.header, message: result.message });
    }
    const machine = values[MACHINE_SLOT];
    if (typeof machine === "string") machines.add(machine);
    crossFieldChecks(values, cells, columnOf, rowNumber, errors);

    if (headerOk && errors.length === errorsBefore) rows.push(toAxis(values, rowNumber));
  }

  return { rowsRead, rows, errors, machinesNamed: [...machines] };
}

/** ENGINE.md §2: peakTorqueNm ≥ loadTorqueNm; movePct + holdPct ≤ 100 (the rest is off). */
function crossFieldChecks(
  values: readonly Value[],
  cells: readonly string[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  row: number,
  errors: ImportCellError[],
): void {
  const [load, peak, move, hold] = [
    values[LOAD_SLOT],
    values[PEAK_SLOT],
    values[MOVE_SLOT],
    values[HOLD_SLOT],
  ];
  const peakColumn = columnOf.get("peakTorqueNm");
  const loadColumn = columnOf.get("loadTorqueNm");
  if (
    typeof load === "number" &&
    typeof peak === "number" &&
    peak < load &&
    peakColumn &&
    loadColumn
  ) {
    errors.push({
      row,
      column: peakColumn.header,
      message: `peak torque (${showIn(peak, cells[peakColumn.index], peakColumn.unit)}) must be at least the load torque (${showIn(load, cells[loadColumn.index], loadColumn.unit)}); correct one of them`,
    });
  }
  const holdColumn = columnOf.get("holdPct");
  if (typeof move === "number" && typeof hold === "number" && holdColumn) {
    // Rounded so that 60.1 + 39.9 counts as 100, as the user reads it.
    const sum = Number((move + hold).toPrecision(12));
    if (sum > 100) {
      errors.push({
        row,
        column: holdColumn.header,
        message: `move % + hold % is ${sum}; together they must be at most 100`,
      });
    }
  }
}
