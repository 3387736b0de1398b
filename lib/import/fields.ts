// The stored row's type names the columns an import fills; a type import, erased at build.
// eslint-disable-next-line @typescript-eslint/no-restricted-imports
import type { Axis } from "@/db/schema/installed-base";
import type { StoredStepLossEvent } from "@/lib/engine/stored";
import {
  AXIS_FIELDS,
  boundOf,
  EVENT_FIELDS,
  MOTION_FIELDS,
  SHARE_BOUND,
  type FieldBound,
  type FieldSpec,
  type MotionFieldKey as MotionKey,
} from "@/lib/fields";

/** Unit conversion a column may carry; "none" columns take their one unit only (or none). */
export type QuantityKind = "torque" | "inductance" | "speed" | "inertia" | "none";

export type FieldType = "text" | "number" | "int" | "enum" | "money-string" | "boolean";

/**
 * The axis columns an import fills, in SI units as stored. Not imported: the ids, the reference
 * motor (chosen in the app) and pullOutCurve — a measured curve is a list of points, which does
 * not fit one spreadsheet cell per field; it is entered on the axis form — and the resonance band
 * (a model setting, entered with the API). Motion and the step-loss event build-up are objects,
 * filled from the `motion.*` and `event.*` columns.
 */
export type AxisColumns = Omit<
  Axis,
  | "id"
  | "siteId"
  | "machineId"
  | "referenceMotorId"
  | "pullOutCurve"
  | "createdAt"
  | "motion"
  | "event"
  | "resonance"
>;

/** Columns of docs/model.md (Motion from the mechanism)'s MotionInput and of docs/model.md (The business case)'s reliability.event, by engine name. */
export type MotionFieldKey = `motion.${MotionKey}`;
export type EventFieldKey = `event.${keyof StoredStepLossEvent}`;

/** "machine" is the machine's name; each row names one, and new names create machines. */
export type ImportFieldKey = "machine" | keyof AxisColumns | MotionFieldKey | EventFieldKey;

export interface ImportField {
  key: ImportFieldKey;
  /** Plain English, as in the template header. */
  label: string;
  quantity: QuantityKind;
  /** SI unit for torque/inductance/speed; for "none" the only unit accepted; null = unitless. */
  unit: string | null;
  type: FieldType;
  required: boolean;
  /** Value of a blank cell or a missing column; absent with required false = stays empty (null). */
  default?: number | string;
  /** Blank takes the site's value, which the caller passes to validateRows. */
  siteDefault?: true;
  /**
   * Required on a row without a mechanism; with one, docs/model.md (Motion from the mechanism) derives the figure, a blank
   * cell is stored as 0 (a placeholder the engine never receives) and the column may be absent.
   */
  requiredUnlessMotion?: true;
  choices?: readonly string[];
  /** The engine's bounds (FIELD_BOUNDS) in the field's SI unit; they replace min and max. */
  bound?: FieldBound;
  /** Bounds in the field's SI unit; minExclusive makes min a "greater than". */
  min?: number;
  minExclusive?: boolean;
  max?: number;
  /** For text: the most characters a cell takes (else the length of a name). */
  maxLength?: number;
  /** Other header texts that name this field unambiguously. */
  synonyms?: readonly string[];
  /** What the datasheet (or the plant) value is. */
  help: string;
}

/** The import's own column: the machine is a name, not a stored axis field. */
const MACHINE: ImportField = {
  key: "machine",
  label: "Machine",
  quantity: "none",
  unit: null,
  type: "text",
  required: true,
  synonyms: ["Machine name"],
  help: "Name of the machine the axis belongs to; a name the site does not have yet creates that machine.",
};

const TYPE_OF: Record<FieldSpec["kind"], FieldType> = {
  text: "text",
  number: "number",
  int: "int",
  enum: "enum",
  money: "money-string",
  boolean: "boolean",
};

/**
 * A column from its registry field (lib/fields). A share (0–100) is checked with plain min and
 * max, worded without a unit; other ranges are the engine's own bound object, so that a cell is
 * refused exactly as the API refuses it.
 */
function columnOf(key: ImportFieldKey, spec: FieldSpec, nested: boolean): ImportField {
  const checkCell = spec.range !== undefined && spec.importCheckedOnObject !== true;
  const share = checkCell && spec.range === "share";
  const required =
    !nested &&
    spec.default === undefined &&
    spec.optional !== true &&
    spec.siteDefault !== true &&
    spec.requiredUnlessMotion !== true;
  // A nested object is parsed by the engine, which fills its defaults; a site default replaces a blank.
  const fillsBlank = !nested && spec.siteDefault !== true && spec.default !== undefined;
  return {
    key,
    label: spec.label,
    quantity: spec.accepts ?? "none",
    unit: spec.unit,
    type: TYPE_OF[spec.kind],
    required,
    ...(fillsBlank ? { default: spec.default as number | string } : {}),
    ...(spec.siteDefault ? { siteDefault: true as const } : {}),
    ...(spec.requiredUnlessMotion ? { requiredUnlessMotion: true as const } : {}),
    ...(spec.choices ? { choices: spec.choices } : {}),
    ...(checkCell && !share ? { bound: boundOf(spec.range!) } : {}),
    ...(share ? { min: SHARE_BOUND.min, max: SHARE_BOUND.max } : {}),
    ...(spec.aliases ? { synonyms: spec.aliases } : {}),
    ...(spec.maxLength !== undefined ? { maxLength: spec.maxLength } : {}),
    help: spec.help,
  };
}

// Not imported: the ids, the reference motor (chosen in the app), pullOutCurve (a measured curve
// is a list of points, entered on the axis form) and the resonance band (a model setting, entered
// with the API). Motion and the step-loss event build-up come from the `motion.*` and `event.*`
// columns; the engine's own schema checks the object a row builds, so that the importer and the
// engine cannot disagree.
const FROM_REGISTRY: ImportField[] = [
  ...Object.entries(AXIS_FIELDS as Record<string, FieldSpec>).map(([key, spec]) =>
    columnOf(key as ImportFieldKey, spec, false),
  ),
  ...Object.entries(MOTION_FIELDS as Record<string, FieldSpec>).map(([key, spec]) =>
    columnOf(`motion.${key}` as ImportFieldKey, spec, true),
  ),
  ...Object.entries(EVENT_FIELDS as Record<string, FieldSpec>).map(([key, spec]) =>
    columnOf(`event.${key}` as ImportFieldKey, spec, true),
  ),
];

/** Every importable field, in template column order. */
export const IMPORT_FIELDS: readonly ImportField[] = [MACHINE, ...FROM_REGISTRY];

/** The object a `motion.*` or `event.*` field belongs to and its key there. */
export function nestedKey(key: ImportFieldKey): { group: "motion" | "event"; name: string } | null {
  const dot = key.indexOf(".");
  if (dot < 0) return null;
  return { group: key.slice(0, dot) as "motion" | "event", name: key.slice(dot + 1) };
}

const BY_KEY = new Map<string, ImportField>(IMPORT_FIELDS.map((f) => [f.key, f]));

/** The field of a key, or undefined when the key is not an import field. */
export function importField(key: string): ImportField | undefined {
  return BY_KEY.get(key);
}
