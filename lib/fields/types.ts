import type { BoundedField } from "./bounds";

/** How a value is typed and stored: "money" is a decimal string (docs/model.md: money never goes through doubles). */
export type FieldKind = "text" | "number" | "int" | "enum" | "money" | "boolean";

/** A quantity that may be typed in other units and is converted to the stored (SI) one. */
export type UnitKind = "torque" | "inductance" | "speed" | "inertia" | "none";

/**
 * The range of a number: a key of FIELD_BOUNDS (lib/fields/bounds.ts), or "share" for a
 * percentage of a whole (0–100, worded without a unit: "must be at most 100").
 */
export type FieldRange = BoundedField | "share";

/**
 * One input field, described once. Every screen, sheet and schema that shows or checks the field
 * takes these from here: the engine's schema (lib/engine/schema.ts), the forms
 * (lib/validations), the import columns (lib/import/fields.ts), the axes table
 * (components/installed-base/axis-columns.ts) and the workbook's Axes sheet.
 */
export interface FieldSpec {
  /** The one user-facing name, British English; also the import template's header. */
  readonly label: string;
  /** What the value is and where it comes from (a datasheet, the plant, common practice). */
  readonly help: string;
  readonly kind: FieldKind;
  /** The unit it is stored in (SI, or % and °C); null when it has none. */
  readonly unit: string | null;
  /** Other units it may be typed in, converted on input; absent = only `unit`. */
  readonly accepts?: UnitKind;
  readonly range?: FieldRange;
  /** The value of a field left out. Absent: required, unless `optional`. */
  readonly default?: number | string | boolean;
  /** May stay empty without a default (null when stored). */
  readonly optional?: true;
  readonly choices?: readonly string[];
  /** How a choice reads in a form's list, where the stored word alone says too little. */
  readonly choiceLabels?: Readonly<Record<string, string>>;
  /** For text: the most characters it takes. */
  readonly maxLength?: number;
  /** Left blank on a form or an import row, the site's value of the same name is taken. */
  readonly siteDefault?: true;
  /** Required without a mechanism; with one, docs/model.md (Motion from the mechanism) derives it. */
  readonly requiredUnlessMotion?: true;
  /** Import header texts other than the label that name this field and no other. */
  readonly aliases?: readonly string[];
  /**
   * Checked by the engine on the whole object the row builds rather than cell by cell on
   * import (motion fields whose bound depends on nothing else but whose message the engine owns).
   */
  readonly importCheckedOnObject?: true;
  /** Its width in the workbook's Axes sheet, in characters; absent = not an Axes column. */
  readonly sheetWidth?: number;
  /** The number format of its Axes column (lib/workbook/formats.ts names them). */
  readonly sheetFormat?: "whole" | "physics" | "fine" | "pct" | "pct2" | "currency" | "sci";
}

/** The label with its unit, as a header or a form label reads: "Holding torque [N·m]". */
export function labelWithUnit(spec: Pick<FieldSpec, "label" | "unit">, brackets = "[]"): string {
  if (spec.unit === null) return spec.label;
  return `${spec.label} ${brackets[0]}${spec.unit}${brackets[1]}`;
}
