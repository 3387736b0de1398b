import { IMPORT_FIELDS, importField, type ImportField, type ImportFieldKey } from "./fields";
import { resolveColumnUnit, splitHeader, supportedUnits } from "./units";

/** The field a column fills and the unit its values are in (factor to the field's SI unit). */
export interface ColumnMapping {
  key: ImportFieldKey;
  /** Canonical unit, "" for a unitless field. */
  unit: string;
  factor: number;
}

/** Column index (0-based, as in the sheet's `headers`) → what the column fills. */
export type HeaderMapping = Record<number, ColumnMapping>;

export interface HeaderProblem {
  /** Column index, or null when a user mapping names a header the sheet does not have. */
  column: number | null;
  header: string;
  /** The field the column was meant for, when known; it is then not reported as missing. */
  key?: ImportFieldKey;
  message: string;
}

export interface HeaderMatch {
  mapping: HeaderMapping;
  problems: HeaderProblem[];
  /** Columns with a header that no field claims; their cells are not read. */
  ignored: { column: number; header: string }[];
  /** Required fields no column fills. */
  missing: ImportFieldKey[];
}

/** User mapping: header text (as in the file) → field key; null or "" leaves the column out. */
export type MappingOverride = Record<string, string | null>;

/** Case, spaces, punctuation and accents do not matter: "Holding-Torque" = "holding torque". */
export function normalizeHeaderLabel(text: string): string {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]/g, "");
}

function buildNameIndex(): Map<string, ImportField> {
  const index = new Map<string, ImportField>();
  for (const field of IMPORT_FIELDS) {
    for (const name of [field.label, field.key, ...(field.synonyms ?? [])]) {
      const normalized = normalizeHeaderLabel(name);
      const taken = index.get(normalized);
      // A name two fields share would make matching depend on field order; refuse at load time.
      if (taken !== undefined && taken.key !== field.key) {
        throw new Error(`Header name "${name}" is claimed by both ${taken.key} and ${field.key}`);
      }
      index.set(normalized, field);
    }
  }
  return index;
}

const NAME_INDEX = buildNameIndex();

/** The field a header names by its label, key or a synonym, ignoring its unit. */
export function fieldForHeader(header: string): ImportField | undefined {
  return (
    NAME_INDEX.get(normalizeHeaderLabel(splitHeader(header).label)) ??
    NAME_INDEX.get(normalizeHeaderLabel(header))
  );
}

/** `Holding torque [N·m]`, or `Machine` for a field without a unit: the template header. */
export function headerFor(field: ImportField): string {
  return field.unit === null ? field.label : `${field.label} [${field.unit}]`;
}

function unitProblem(field: ImportField, unitText: string): string {
  const units = supportedUnits(field);
  if (field.quantity === "none") {
    return `unit "${unitText}" does not fit ${field.label}; enter the values in ${field.unit} and head the column "${headerFor(field)}"`;
  }
  const article = /^[aeiou]/.test(field.quantity) ? "an" : "a";
  return `unit "${unitText}" is not ${article} ${field.quantity} unit; use one of ${units.join(", ")}, e.g. "${headerFor(field)}"`;
}

/**
 * Which field each column fills, from its header text: label, key or an unambiguous synonym,
 * case-, space- and punctuation-insensitive, with the unit read from `[unit]` or `(unit)` at the
 * end. `override` (header text → field key) takes precedence over the automatic match; the unit
 * still comes from the header, and a header without one is in the field's SI unit.
 * Unitless fields (names, counts, choices, money) ignore any bracket text.
 */
export function matchHeaders(
  headers: readonly string[],
  override: MappingOverride = {},
): HeaderMatch {
  const mapping: HeaderMapping = {};
  const problems: HeaderProblem[] = [];
  const ignored: HeaderMatch["ignored"] = [];
  const columnOfKey = new Map<ImportFieldKey, number>();
  const overridden = new Set<string>();
  const overrideByHeader = new Map(Object.entries(override).map(([h, k]) => [h.trim(), k]));

  headers.forEach((rawHeader, column) => {
    const header = rawHeader.trim();
    if (header === "") return;

    let field: ImportField | undefined;
    const choice = overrideByHeader.get(header);
    if (choice !== undefined) {
      overridden.add(header);
      if (choice === null || choice === "") {
        ignored.push({ column, header });
        return;
      }
      field = importField(choice);
      if (field === undefined) {
        problems.push({
          column,
          header,
          message: `the mapping assigns "${choice}", which is not an import field; choose one of the template's columns or leave the column out`,
        });
        return;
      }
    } else {
      field = fieldForHeader(header);
      if (field === undefined) {
        ignored.push({ column, header });
        return;
      }
    }

    const unitText = field.unit === null ? null : splitHeader(header).unit;
    const unit = resolveColumnUnit(field, unitText);
    if (unit === undefined) {
      problems.push({
        column,
        header,
        key: field.key,
        message: unitProblem(field, unitText ?? ""),
      });
      return;
    }

    const first = columnOfKey.get(field.key);
    if (first !== undefined) {
      problems.push({
        column,
        header,
        key: field.key,
        message: `a second ${field.label} column (the first is "${headers[first].trim()}"); delete one of them or map this one to another field`,
      });
      return;
    }
    columnOfKey.set(field.key, column);
    mapping[column] = {
      key: field.key,
      unit: field.unit === null ? "" : unit.unit,
      factor: unit.factor,
    };
  });

  for (const header of overrideByHeader.keys()) {
    if (!overridden.has(header)) {
      problems.push({
        column: null,
        header,
        message: `the mapping names a column "${header}" that the sheet does not have; pick the sheet that has it or remove it from the mapping`,
      });
    }
  }

  const attempted = new Set<ImportFieldKey>([
    ...columnOfKey.keys(),
    ...problems.flatMap((p) => (p.key === undefined ? [] : [p.key])),
  ]);
  // A mechanism column lets rows derive the duty figures (docs/model.md (Motion from the mechanism)); without one, their
  // columns are as required as before motion existed.
  const withMotion = attempted.has("motion.mechanism");
  const missing = IMPORT_FIELDS.filter(
    (f) => (f.required || (f.requiredUnlessMotion && !withMotion)) && !attempted.has(f.key),
  ).map((f) => f.key);

  return { mapping, problems, ignored, missing };
}
