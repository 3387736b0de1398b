import type { Axis } from "@/db/schema/installed-base";

/** Unit conversion a column may carry; "none" columns take their one unit only (or none). */
export type QuantityKind = "torque" | "inductance" | "speed" | "none";

export type FieldType = "text" | "number" | "int" | "enum" | "money-string";

/**
 * The axis columns an import fills, in SI units as stored. Not imported: the ids, the reference
 * motor (chosen in the app) and pullOutCurve — a measured curve is a list of points, which does
 * not fit one spreadsheet cell per field; it is entered on the axis form.
 */
export type AxisColumns = Omit<
  Axis,
  "id" | "siteId" | "machineId" | "referenceMotorId" | "pullOutCurve" | "createdAt"
>;

/** "machine" is the machine's name; each row names one, and new names create machines. */
export type ImportFieldKey = "machine" | keyof AxisColumns;

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
  choices?: readonly string[];
  /** Bounds in the field's SI unit; minExclusive makes min a "greater than". */
  min?: number;
  minExclusive?: boolean;
  max?: number;
  /** Other header texts that name this field unambiguously. */
  synonyms?: readonly string[];
  /** What the datasheet (or the plant) value is. */
  help: string;
}

type FieldSpec = Omit<ImportField, "key">;

// Defaults and bounds are ENGINE.md §2's; "common practice" defaults are marked so in the help,
// as ENGINE.md asks. Ambient bounds follow the site form (lib/validations/installed-base.ts).
// Synonyms are only header texts that cannot mean another field: "Motor current", for one,
// could be the rated current or the drive setting, so it is not listed.
const SPECS = {
  machine: {
    label: "Machine",
    quantity: "none",
    unit: null,
    type: "text",
    required: true,
    synonyms: ["Machine name"],
    help: "Name of the machine the axis belongs to; a name the site does not have yet creates that machine.",
  },
  label: {
    label: "Axis label",
    quantity: "none",
    unit: null,
    type: "text",
    required: true,
    synonyms: ["Axis", "Axis name"],
    help: "Name of the axis on its machine, such as X feed or Z lift.",
  },
  quantity: {
    label: "Quantity",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 1,
    min: 1,
    synonyms: ["Qty"],
    help: "Number of identical axes this row stands for.",
  },
  rotorTeeth: {
    label: "Rotor teeth",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 50,
    min: 1,
    help: "Rotor teeth of the hybrid stepper motor: 50 for a 1.8° step, 100 for a 0.9° step.",
  },
  holdingTorqueNm: {
    label: "Holding torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: true,
    min: 0,
    minExclusive: true,
    help: "Datasheet holding torque of the motor: both phases on at rated current, at standstill.",
  },
  ratedCurrentA: {
    label: "Rated current",
    quantity: "none",
    unit: "A",
    type: "number",
    required: true,
    min: 0,
    minExclusive: true,
    synonyms: ["Rated phase current"],
    help: "Datasheet rated current per phase.",
  },
  phaseResistanceOhm: {
    label: "Phase resistance",
    quantity: "none",
    unit: "Ω",
    type: "number",
    required: true,
    min: 0,
    minExclusive: true,
    synonyms: ["Resistance per phase"],
    help: "Datasheet resistance of one phase winding at 20 °C.",
  },
  phaseInductanceMh: {
    label: "Phase inductance",
    quantity: "inductance",
    unit: "mH",
    type: "number",
    required: true,
    min: 0,
    synonyms: ["Inductance per phase"],
    help: "Datasheet inductance of one phase winding.",
  },
  thermalResistanceKPerW: {
    label: "Thermal resistance",
    quantity: "none",
    unit: "K/W",
    type: "number",
    required: false,
    min: 0,
    minExclusive: true,
    help: "Winding-to-ambient thermal resistance of the mounted motor; leave blank to derive it from the rated temperature rise.",
  },
  ratedTempRiseK: {
    label: "Rated temperature rise",
    quantity: "none",
    unit: "K",
    type: "number",
    required: false,
    default: 80,
    min: 0,
    minExclusive: true,
    help: "Winding temperature rise at rated current from the datasheet; 80 K when not given is common practice, not a published value.",
  },
  insulationClass: {
    label: "Insulation class",
    quantity: "none",
    unit: null,
    type: "enum",
    required: false,
    default: "B",
    choices: ["B", "F", "H"],
    help: "Thermal class of the winding insulation (IEC 60085): B 130 °C, F 155 °C, H 180 °C.",
  },
  hysteresisWPerHz: {
    label: "Hysteresis loss coefficient",
    quantity: "none",
    unit: "W/Hz",
    type: "number",
    required: false,
    default: 0,
    min: 0,
    help: "Iron-loss coefficient kh in P = kh·f + ke·f², f the electrical frequency; 0 when the datasheet does not give it.",
  },
  eddyWPerHz2: {
    label: "Eddy-current loss coefficient",
    quantity: "none",
    unit: "W/Hz²",
    type: "number",
    required: false,
    default: 0,
    min: 0,
    help: "Iron-loss coefficient ke in P = kh·f + ke·f², f the electrical frequency; 0 when the datasheet does not give it.",
  },
  busVoltageV: {
    label: "Bus voltage",
    quantity: "none",
    unit: "V",
    type: "number",
    required: true,
    min: 0,
    minExclusive: true,
    synonyms: ["DC bus voltage"],
    help: "DC supply voltage of the drive.",
  },
  currentSettingA: {
    label: "Drive current setting",
    quantity: "none",
    unit: "A",
    type: "number",
    required: true,
    min: 0,
    synonyms: ["Current setting"],
    help: "Phase current the drive is set to today.",
  },
  currentConvention: {
    label: "Current convention",
    quantity: "none",
    unit: null,
    type: "enum",
    required: false,
    default: "peak",
    choices: ["peak", "rms"],
    help: "Whether the drive's current setting is a peak or an RMS value; it matters for microstepping only.",
  },
  stepMode: {
    label: "Step mode",
    quantity: "none",
    unit: null,
    type: "enum",
    required: false,
    default: "micro",
    choices: ["micro", "full", "half", "half-compensated"],
    help: "How the drive steps the motor today: microstepping, full steps (two phases on), half steps, or half steps with compensated current.",
  },
  microsteps: {
    label: "Microsteps",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 16,
    min: 1,
    help: "Microsteps per full step set on the drive; it sets the resolution only.",
  },
  idleCurrentPct: {
    label: "Idle current",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    default: 50,
    min: 0,
    max: 100,
    help: "Current the drive keeps at standstill, as a percentage of its current setting.",
  },
  driveEfficiencyPct: {
    label: "Drive efficiency",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    default: 90,
    min: 0,
    minExclusive: true,
    max: 100,
    help: "Electrical efficiency of the drive's power stage.",
  },
  driveStandbyW: {
    label: "Drive standby power",
    quantity: "none",
    unit: "W",
    type: "number",
    required: false,
    default: 2,
    min: 0,
    help: "Power the drive draws for its own electronics whenever it is on.",
  },
  hoursPerYear: {
    label: "Hours per year",
    quantity: "none",
    unit: "h",
    type: "number",
    required: false,
    siteDefault: true,
    min: 0,
    max: 8784,
    synonyms: ["Operating hours per year"],
    help: "Hours a year the machine runs; leave blank to take the site's hours per year.",
  },
  movePct: {
    label: "Move time",
    quantity: "none",
    unit: "%",
    type: "number",
    required: true,
    min: 0,
    max: 100,
    help: "Share of the running hours the axis is moving.",
  },
  holdPct: {
    label: "Hold time",
    quantity: "none",
    unit: "%",
    type: "number",
    required: true,
    min: 0,
    max: 100,
    help: "Share of the running hours the axis holds its position energised; for the rest it is off.",
  },
  speedRpm: {
    label: "Speed",
    quantity: "speed",
    unit: "rpm",
    type: "number",
    required: true,
    min: 0,
    synonyms: ["Motor speed"],
    help: "Motor shaft speed while the axis moves.",
  },
  loadTorqueNm: {
    label: "Load torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: true,
    min: 0,
    help: "RMS load torque at the motor shaft while moving: friction, process force and the acceleration share.",
  },
  peakTorqueNm: {
    label: "Peak torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: true,
    min: 0,
    help: "Highest torque at the motor shaft while moving, usually when accelerating; at least the load torque.",
  },
  holdTorqueNm: {
    label: "Standstill load torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: false,
    default: 0,
    min: 0,
    help: "Load the motor must hold at standstill, such as gravity on a vertical axis; 0 on a horizontal axis.",
  },
  ambientC: {
    label: "Ambient temperature",
    quantity: "none",
    unit: "°C",
    type: "number",
    required: false,
    siteDefault: true,
    min: -40,
    max: 80,
    help: "Air temperature around the motor; leave blank to take the site's ambient temperature.",
  },
  stepLossEventsPerYear: {
    label: "Step-loss events per year",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    default: 0,
    min: 0,
    help: "Times a year this axis loses steps and causes a crash, scrap or a restart.",
  },
  costPerEvent: {
    label: "Cost per step-loss event",
    quantity: "none",
    unit: null,
    type: "money-string",
    required: false,
    default: "0",
    help: "Cost of one step-loss event in the site's currency: scrap, downtime and labour.",
  },
  avoidedPct: {
    label: "Avoided step-loss events",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    default: 90,
    min: 0,
    max: 100,
    help: "Share of the step-loss events that closed-loop control avoids; the default of 90 % is an assumption without a published source.",
  },
} as const satisfies Record<ImportFieldKey, FieldSpec>;

/** Every importable field, in template column order. */
export const IMPORT_FIELDS: readonly ImportField[] = Object.entries(SPECS).map(
  ([key, spec]) => ({ key: key as ImportFieldKey, ...spec }) as ImportField,
);

const BY_KEY = new Map<string, ImportField>(IMPORT_FIELDS.map((f) => [f.key, f]));

/** The field of a key, or undefined when the key is not an import field. */
export function importField(key: string): ImportField | undefined {
  return BY_KEY.get(key);
}
