import { AXIS_FIELDS, type AxisFieldKey, type AxisFieldSpec } from "../fields";

/**
 * The axis fields a catalogue motor fills: the axis registry's "motor" group (lib/fields/axis.ts),
 * which the motors table (db/schema/catalogue.ts) stores under the same names and units
 * (tests/unit/catalogue-motor-form-values.test.ts keeps the two lists equal). The catalogue holds
 * no pull-out curve, so the form has none to take from it.
 */
export const CATALOGUE_MOTOR_FIELDS = [
  "rotorTeeth",
  "holdingTorqueNm",
  "ratedCurrentA",
  "phaseResistanceOhm",
  "phaseInductanceMh",
  "thermalResistanceKPerW",
  "ratedTempRiseK",
  "insulationClass",
  "hysteresisWPerHz",
  "eddyWPerHz2",
] as const satisfies readonly AxisFieldKey[];
export type CatalogueMotorField = (typeof CATALOGUE_MOTOR_FIELDS)[number];

/** What a catalogue motor row carries for the axis form (a Motor row of db/schema fits it). */
export type CatalogueMotorFigures = { id: number } & Record<
  CatalogueMotorField,
  number | string | null
>;

// A torque field's form value is { value, unit }; the schema converts it back to N·m.
function formValueOf(key: CatalogueMotorField, stored: number | string | null): unknown {
  const spec = AXIS_FIELDS[key] as AxisFieldSpec;
  if (stored === null) return ""; // an optional figure the motor lacks: the field is left blank
  return spec.accepts === "torque" ? { value: stored, unit: spec.unit } : stored;
}

/**
 * The axis form's values taken from a catalogue motor: each motor figure in the field's form
 * shape, and the motor as the axis's reference motor.
 */
export function motorToAxisFormValues(motor: CatalogueMotorFigures) {
  const values: Record<string, unknown> = { referenceMotorId: motor.id };
  for (const key of CATALOGUE_MOTOR_FIELDS) values[key] = formValueOf(key, motor[key]);
  return values as { referenceMotorId: number } & Record<CatalogueMotorField, unknown>;
}

// The number a form value stands for, in the stored unit, or null when it is blank or another unit.
function storedNumber(key: CatalogueMotorField, value: unknown): number | string | null {
  const spec = AXIS_FIELDS[key] as AxisFieldSpec;
  if (spec.accepts === "torque") {
    const torque = value as { value?: unknown; unit?: unknown } | undefined;
    if (!torque || torque.unit !== spec.unit) return null;
    value = torque.value;
  }
  if (value === "" || value === undefined || value === null) return null;
  if (spec.kind === "enum") return String(value);
  const n = Number(value);
  return Number.isFinite(n) ? n : null;
}

/**
 * The fields whose current form value is still the catalogue motor's: what the form marks as
 * "from the catalogue". A field the user changed (or typed in another unit) is theirs.
 */
export function fieldsFromCatalogue(
  motor: CatalogueMotorFigures,
  values: Partial<Record<CatalogueMotorField, unknown>>,
): CatalogueMotorField[] {
  return CATALOGUE_MOTOR_FIELDS.filter((key) => {
    const stored = motor[key];
    const current = storedNumber(key, values[key]);
    return stored === null ? current === null : current === stored;
  });
}
