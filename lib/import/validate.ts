import type { StoredStepLossEvent } from "@/lib/engine/stored";
import type { ParsedMotion } from "@/lib/engine/schema";
import { motionSchema, stepLossEventSchema } from "@/lib/validations/installed-base";
import { parseCell } from "./cells";
import {
  IMPORT_FIELDS,
  importField,
  nestedKey,
  type AxisColumns,
  type ImportField,
  type ImportFieldKey,
} from "./fields";
import { headerFor, type HeaderMatch } from "./headers";
import type { SheetData } from "./read";
import { lowerFirst } from "@/lib/words";

/** The site's values for the fields a row may leave blank (docs/model.md duty). */
export interface SiteDefaults {
  hoursPerYear: number;
  ambientC: number;
}

/**
 * One valid row: every axis column in SI units, its motion and step-loss event build-up as the
 * engine parsed them (null when the row has none), its machine's name and its spreadsheet row.
 */
export type ValidatedAxis = AxisColumns & {
  motion: ParsedMotion | null;
  event: StoredStepLossEvent | null;
  machineName: string;
  sourceRow: number;
};

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

/** Fields of a nested object (motion, event) with their slot and their key in that object. */
const nestedFields = (group: "motion" | "event") =>
  IMPORT_FIELDS.flatMap((field, slot) => {
    const nested = nestedKey(field.key);
    return nested?.group === group ? [{ field, slot, name: nested.name }] : [];
  });
const MOTION_FIELDS = nestedFields("motion");
const EVENT_FIELDS = nestedFields("event");
const FLAT_SLOTS = IMPORT_FIELDS.flatMap((f, slot) =>
  slot !== MACHINE_SLOT && nestedKey(f.key) === null ? [slot] : [],
);
const DUTY_SLOTS = IMPORT_FIELDS.flatMap((f, slot) => (f.requiredUnlessMotion ? [slot] : []));

type Value = number | string | boolean | null;

function toAxis(
  values: readonly Value[],
  sourceRow: number,
  motion: ParsedMotion | null,
  event: StoredStepLossEvent | null,
): ValidatedAxis {
  const axis: Record<string, unknown> = {};
  for (const slot of FLAT_SLOTS) axis[IMPORT_FIELDS[slot].key] = values[slot];
  axis.motion = motion;
  axis.event = event;
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
    const cellsOk = errors.length === errorsBefore;
    // A mechanism typed but misspelt has its own message; the row is then judged as a motion row.
    const mechanismColumn = columnOf.get("motion.mechanism");
    const withMechanism =
      mechanismColumn !== undefined && (cells[mechanismColumn.index] ?? "").trim() !== "";
    const motion = withMechanism ? motionOf(values, columnOf, rowNumber, errors, cellsOk) : null;
    if (!withMechanism) noMotionWithoutMechanism(values, columnOf, rowNumber, errors);
    const event = eventOf(values, cells, columnOf, rowNumber, errors, cellsOk);
    if (!withMechanism) {
      dutyRequired(values, cells, columnOf, match.missing, rowNumber, errors);
      crossFieldChecks(values, cells, columnOf, rowNumber, errors);
    } else {
      // docs/model.md (Motion from the mechanism) derives these; a blank is stored as a placeholder the engine never gets.
      for (const slot of DUTY_SLOTS) values[slot] ??= 0;
    }

    if (headerOk && errors.length === errorsBefore)
      rows.push(toAxis(values, rowNumber, motion, event));
  }

  return { rowsRead, rows, errors, machinesNamed: [...machines] };
}

const lowerLabel = (field: ImportField) => lowerFirst(field.label);

/** The header of the column that fills `key`, or the field's label when no column does. */
const columnName = (key: ImportFieldKey, columnOf: ReadonlyMap<ImportFieldKey, Column>) =>
  columnOf.get(key)?.header ?? (importField(key) as ImportField).label;

/** Without a mechanism the typed duty figures are required (a missing column is a row-1 error). */
function dutyRequired(
  values: readonly Value[],
  cells: readonly string[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  missing: readonly ImportFieldKey[],
  row: number,
  errors: ImportCellError[],
): void {
  for (const slot of DUTY_SLOTS) {
    const field = IMPORT_FIELDS[slot];
    if (values[slot] !== null || missing.includes(field.key)) continue;
    const column = columnOf.get(field.key);
    // A cell with something unreadable in it has its own message already.
    if (column && (cells[column.index] ?? "").trim() !== "") continue;
    const unit = column?.unit ?? field.unit;
    errors.push({
      row,
      column: columnName(field.key, columnOf),
      message: `required: enter the ${lowerLabel(field)}${unit ? ` in ${unit}` : ""}, or fill the Mechanism and motion columns to derive it`,
    });
  }
}

/** Motion figures on a row without a mechanism would be silently dropped: refuse the first. */
function noMotionWithoutMechanism(
  values: readonly Value[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  row: number,
  errors: ImportCellError[],
): void {
  const given = MOTION_FIELDS.find((m) => values[m.slot] !== null);
  if (given)
    errors.push({
      row,
      column: columnName(given.field.key, columnOf),
      message: `motion figures need a mechanism: fill the Mechanism column (belt, rack, screw or rotary) or leave the motion columns blank`,
    });
}

/**
 * The row's MotionInput (docs/model.md (Motion from the mechanism)), checked by the engine's own schema so that the importer
 * accepts exactly what the engine does; each problem is reported at the column it concerns.
 * Blank cells are left out, so the engine's defaults apply.
 */
function motionOf(
  values: readonly Value[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  row: number,
  errors: ImportCellError[],
  cellsOk: boolean,
): ParsedMotion | null {
  // A cell already refused would be reported again as "required" by the schema.
  if (!cellsOk) return null;
  const given = MOTION_FIELDS.filter((m) => values[m.slot] !== null);
  const parsed = motionSchema.safeParse(
    Object.fromEntries(given.map((m) => [m.name, values[m.slot]])),
  );
  if (parsed.success) return parsed.data;
  reportNested("motion", parsed.error.issues, columnOf, row, errors);
  return null;
}

/**
 * The row's step-loss event build-up (docs/model.md (The business case)) when any of its cells is filled. The engine
 * refuses a cost per event beside it, so a filled cost cell is an error here too.
 */
function eventOf(
  values: readonly Value[],
  cells: readonly string[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  row: number,
  errors: ImportCellError[],
  cellsOk: boolean,
): StoredStepLossEvent | null {
  const given = EVENT_FIELDS.filter((e) => values[e.slot] !== null);
  if (given.length === 0) return null;
  const costColumn = columnOf.get("costPerEvent");
  if (costColumn && (cells[costColumn.index] ?? "").trim() !== "") {
    errors.push({
      row,
      column: costColumn.header,
      message: `give either the cost per step-loss event or its build-up (${given.map((e) => columnName(e.field.key, columnOf)).join(", ")}), not both; leave one of them blank`,
    });
    return null;
  }
  if (!cellsOk) return null;
  const parsed = stepLossEventSchema.safeParse(
    Object.fromEntries(given.map((e) => [e.name, values[e.slot]])),
  );
  if (parsed.success) return parsed.data;
  reportNested("event", parsed.error.issues, columnOf, row, errors);
  return null;
}

function reportNested(
  group: "motion" | "event",
  issues: readonly { path: readonly PropertyKey[]; message: string }[],
  columnOf: ReadonlyMap<ImportFieldKey, Column>,
  row: number,
  errors: ImportCellError[],
): void {
  for (const issue of issues) {
    const key = `${group}.${String(issue.path[0])}` as ImportFieldKey;
    const field = importField(key);
    const column = field
      ? columnName(field.key, columnOf)
      : columnName("motion.mechanism", columnOf);
    // The engine's "required: expected a number" says what, the column says which.
    const message =
      field && issue.message.startsWith("required: expected")
        ? `required with a mechanism: enter the ${lowerLabel(field)}${field.unit ? ` in ${columnOf.get(field.key)?.unit ?? field.unit}` : ""}`
        : issue.message;
    errors.push({ row, column, message });
  }
}

/** docs/model.md: peakTorqueNm ≥ loadTorqueNm; movePct + holdPct ≤ 100 (the rest is off). */
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
