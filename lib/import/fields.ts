// The stored row's type names the columns an import fills; a type import, erased at build.
// eslint-disable-next-line @typescript-eslint/no-restricted-imports
import type { Axis } from "@/db/schema/installed-base";
import type { StoredStepLossEvent } from "@/lib/engine/stored";
import type { ParsedMotion } from "@/lib/engine/schema";
import { MECHANISMS } from "@/lib/engine/schema";
import { FIELD_BOUNDS, type FieldBound } from "@/lib/engine/schema-fields";

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
export type MotionFieldKey = `motion.${keyof ParsedMotion}`;
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
  /** Other header texts that name this field unambiguously. */
  synonyms?: readonly string[];
  /** What the datasheet (or the plant) value is. */
  help: string;
}

type FieldSpec = Omit<ImportField, "key">;

// Defaults and bounds are docs/model.md's; "common practice" defaults are marked so in the help,
// as docs/model.md asks. Ambient bounds follow the site form (lib/validations/installed-base.ts).
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
    bound: FIELD_BOUNDS.quantity,
    label: "Quantity",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 1,
    synonyms: ["Qty"],
    help: "Number of identical axes this row stands for.",
  },
  rotorTeeth: {
    bound: FIELD_BOUNDS.rotorTeeth,
    label: "Rotor teeth",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 50,
    help: "Rotor teeth of the hybrid stepper motor: 50 for a 1.8° step, 100 for a 0.9° step.",
  },
  holdingTorqueNm: {
    bound: FIELD_BOUNDS.holdingTorqueNm,
    label: "Holding torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: true,
    help: "Datasheet holding torque of the motor: both phases on at rated current, at standstill.",
  },
  ratedCurrentA: {
    bound: FIELD_BOUNDS.ratedCurrentA,
    label: "Rated current",
    quantity: "none",
    unit: "A",
    type: "number",
    required: true,
    synonyms: ["Rated phase current"],
    help: "Datasheet rated current per phase.",
  },
  phaseResistanceOhm: {
    bound: FIELD_BOUNDS.phaseResistanceOhm,
    label: "Phase resistance",
    quantity: "none",
    unit: "Ω",
    type: "number",
    required: true,
    synonyms: ["Resistance per phase"],
    help: "Datasheet resistance of one phase winding at 20 °C.",
  },
  phaseInductanceMh: {
    bound: FIELD_BOUNDS.phaseInductanceMh,
    label: "Phase inductance",
    quantity: "inductance",
    unit: "mH",
    type: "number",
    required: true,
    synonyms: ["Inductance per phase"],
    help: "Datasheet inductance of one phase winding.",
  },
  thermalResistanceKPerW: {
    bound: FIELD_BOUNDS.thermalResistanceKPerW,
    label: "Thermal resistance",
    quantity: "none",
    unit: "K/W",
    type: "number",
    required: false,
    help: "Winding-to-ambient thermal resistance of the mounted motor; leave blank to derive it from the rated temperature rise.",
  },
  ratedTempRiseK: {
    bound: FIELD_BOUNDS.ratedTempRiseK,
    label: "Rated temperature rise",
    quantity: "none",
    unit: "K",
    type: "number",
    required: false,
    default: 80,
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
    bound: FIELD_BOUNDS.hysteresisWPerHz,
    label: "Hysteresis loss coefficient",
    quantity: "none",
    unit: "W/Hz",
    type: "number",
    required: false,
    default: 0,
    help: "Iron-loss coefficient kh in P = kh·f + ke·f², f the electrical frequency; 0 when the datasheet does not give it.",
  },
  eddyWPerHz2: {
    bound: FIELD_BOUNDS.eddyWPerHz2,
    label: "Eddy-current loss coefficient",
    quantity: "none",
    unit: "W/Hz²",
    type: "number",
    required: false,
    default: 0,
    help: "Iron-loss coefficient ke in P = kh·f + ke·f², f the electrical frequency; 0 when the datasheet does not give it.",
  },
  busVoltageV: {
    bound: FIELD_BOUNDS.busVoltageV,
    label: "Bus voltage",
    quantity: "none",
    unit: "V",
    type: "number",
    required: true,
    synonyms: ["DC bus voltage"],
    help: "DC supply voltage of the drive.",
  },
  currentSettingA: {
    bound: FIELD_BOUNDS.currentSettingA,
    label: "Drive current setting",
    quantity: "none",
    unit: "A",
    type: "number",
    required: true,
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
    bound: FIELD_BOUNDS.microsteps,
    label: "Microsteps",
    quantity: "none",
    unit: null,
    type: "int",
    required: false,
    default: 16,
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
    bound: FIELD_BOUNDS.efficiencyPct,
    label: "Drive efficiency",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    default: 90,
    help: "Electrical efficiency of the drive's power stage.",
  },
  driveStandbyW: {
    bound: FIELD_BOUNDS.standbyW,
    label: "Drive standby power",
    quantity: "none",
    unit: "W",
    type: "number",
    required: false,
    default: 2,
    help: "Power the drive draws for its own electronics whenever it is on.",
  },
  hoursPerYear: {
    bound: FIELD_BOUNDS.hoursPerYear,
    label: "Hours per year",
    quantity: "none",
    unit: "h",
    type: "number",
    required: false,
    siteDefault: true,
    synonyms: ["Operating hours per year"],
    help: "Hours a year the machine runs; leave blank to take the site's hours per year.",
  },
  movePct: {
    label: "Move time",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    requiredUnlessMotion: true,
    min: 0,
    max: 100,
    help: "Share of the running hours the axis is moving.",
  },
  holdPct: {
    label: "Hold time",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    requiredUnlessMotion: true,
    min: 0,
    max: 100,
    help: "Share of the running hours the axis holds its position energised; for the rest it is off.",
  },
  speedRpm: {
    bound: FIELD_BOUNDS.speedRpm,
    label: "Speed",
    quantity: "speed",
    unit: "rpm",
    type: "number",
    required: false,
    requiredUnlessMotion: true,
    synonyms: ["Motor speed"],
    help: "Motor shaft speed while the axis moves.",
  },
  loadTorqueNm: {
    bound: FIELD_BOUNDS.dutyTorqueNm,
    label: "Load torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: false,
    requiredUnlessMotion: true,
    help: "RMS load torque at the motor shaft while moving: friction, process force and the acceleration share.",
  },
  peakTorqueNm: {
    bound: FIELD_BOUNDS.dutyTorqueNm,
    label: "Peak torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: false,
    requiredUnlessMotion: true,
    help: "Highest torque at the motor shaft while moving, usually when accelerating; at least the load torque.",
  },
  holdTorqueNm: {
    bound: FIELD_BOUNDS.dutyTorqueNm,
    label: "Standstill load torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: false,
    default: 0,
    help: "Load the motor must hold at standstill, such as gravity on a vertical axis; 0 on a horizontal axis.",
  },
  ambientC: {
    bound: FIELD_BOUNDS.ambientC,
    label: "Ambient temperature",
    quantity: "none",
    unit: "°C",
    type: "number",
    required: false,
    siteDefault: true,
    help: "Air temperature around the motor; leave blank to take the site's ambient temperature.",
  },
  stepLossEventsPerYear: {
    bound: FIELD_BOUNDS.stepLossEventsPerYear,
    label: "Step-loss events per year",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    default: 0,
    help: "Times a year this axis loses steps and causes a crash, scrap or a restart.",
  },
  costPerEvent: {
    label: "Cost per step-loss event",
    quantity: "none",
    unit: null,
    type: "money-string",
    required: false,
    default: "0",
    help: "Cost of one step-loss event in the site's currency: scrap, downtime and labour. Leave it blank when the event columns below build the cost up.",
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
  // docs/model.md (Motion from the mechanism): the mechanism and the move. A blank cell takes the engine's default; without a
  // mechanism the motion columns must stay blank. Bounds are the engine's own (motionInputSchema),
  // checked on the object a row builds, so that the importer and the engine cannot disagree.
  "motion.mechanism": {
    label: "Mechanism",
    quantity: "none",
    unit: null,
    type: "enum",
    required: false,
    choices: MECHANISMS,
    help: "What the motor drives: belt, rack, screw or rotary. With a mechanism the speed, torques and move and hold shares are derived from the motion columns and may stay blank.",
  },
  "motion.radiusMm": {
    bound: FIELD_BOUNDS.radiusMm,
    label: "Pulley or pinion radius",
    quantity: "none",
    unit: "mm",
    type: "number",
    required: false,
    help: "Pitch radius of the belt pulley or the rack pinion; required for a belt or a rack.",
  },
  "motion.leadMm": {
    bound: FIELD_BOUNDS.leadMm,
    label: "Screw lead",
    quantity: "none",
    unit: "mm",
    type: "number",
    required: false,
    help: "Travel per screw turn; required for a screw.",
  },
  "motion.efficiencyPct": {
    label: "Mechanism efficiency",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    help: "Efficiency of the belt, rack, screw or rotary stage; blank takes belt 95, rack 90, screw 90, rotary 100 (common practice, not a published value).",
  },
  "motion.gearRatio": {
    bound: FIELD_BOUNDS.gearRatio,
    label: "Gear ratio",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    help: "Motor turns per turn of the mechanism's shaft; blank is 1 (no gearbox).",
  },
  "motion.gearEfficiencyPct": {
    label: "Gear efficiency",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    help: "Efficiency of the gearbox; blank is 100 (no gearbox).",
  },
  "motion.massKg": {
    bound: FIELD_BOUNDS.massKg,
    label: "Moving mass",
    quantity: "none",
    unit: "kg",
    type: "number",
    required: false,
    help: "Mass the belt, rack or screw moves, carriage and payload together; blank is 0.",
  },
  "motion.loadInertiaKgM2": {
    bound: FIELD_BOUNDS.inertiaKgM2,
    label: "Load inertia",
    quantity: "inertia",
    unit: "kg·m²",
    type: "number",
    required: false,
    help: "Inertia at the mechanism's shaft: pulleys, screw, rotary table; blank is 0.",
  },
  "motion.motorInertiaKgM2": {
    bound: FIELD_BOUNDS.inertiaKgM2,
    label: "Rotor inertia",
    quantity: "inertia",
    unit: "kg·m²",
    type: "number",
    required: false,
    help: "Rotor inertia of the motor from its datasheet; blank (0) means unknown, and the peak torque then misses the rotor's own share.",
  },
  "motion.inclineDeg": {
    label: "Incline",
    quantity: "none",
    unit: "°",
    type: "number",
    required: false,
    help: "Angle of the travel above horizontal, 0 to 90: 90 is a vertical axis whose forward move goes up. Blank is 0.",
  },
  "motion.frictionCoeff": {
    bound: FIELD_BOUNDS.frictionCoeff,
    label: "Friction coefficient",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    help: "Coulomb friction coefficient of the guide on its normal force; blank is 0.",
  },
  "motion.externalForceN": {
    bound: FIELD_BOUNDS.externalForceN,
    label: "Process force",
    quantity: "none",
    unit: "N",
    type: "number",
    required: false,
    help: "Force of the process against the motion of a belt, rack or screw; blank is 0.",
  },
  "motion.externalTorqueNm": {
    bound: FIELD_BOUNDS.dutyTorqueNm,
    label: "Process torque",
    quantity: "torque",
    unit: "N·m",
    type: "number",
    required: false,
    help: "Torque of the process against the motion at a rotary mechanism's shaft; blank is 0.",
  },
  "motion.stroke": {
    bound: FIELD_BOUNDS.stroke,
    label: "Stroke",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    help: "Length of one move: millimetres for a belt, rack or screw, degrees for a rotary mechanism; required with a mechanism.",
  },
  "motion.moveTimeS": {
    bound: FIELD_BOUNDS.moveTimeS,
    label: "Move duration",
    quantity: "none",
    unit: "s",
    type: "number",
    required: false,
    help: "Time one move takes, from standstill to standstill; required with a mechanism.",
  },
  "motion.accelSharePct": {
    label: "Acceleration share",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    help: "Share of the move spent accelerating (the same share decelerating), at most 50; blank is 25 (common practice).",
  },
  "motion.dwellTimeS": {
    bound: FIELD_BOUNDS.dwellTimeS,
    label: "Dwell after each move",
    quantity: "none",
    unit: "s",
    type: "number",
    required: false,
    help: "Standstill after each move, holding position; blank is 0.",
  },
  "motion.returnMove": {
    label: "Return move",
    quantity: "none",
    unit: null,
    type: "boolean",
    required: false,
    help: "Yes when each forward move is followed by the move back; blank is yes.",
  },
  "motion.energizedPct": {
    label: "Cycling share",
    quantity: "none",
    unit: "%",
    type: "number",
    required: false,
    help: "Share of the running hours in which the axis cycles; blank is 100.",
  },
  "motion.maxInertiaRatio": {
    bound: FIELD_BOUNDS.maxInertiaRatio,
    label: "Highest inertia ratio",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    help: "Load-to-rotor inertia ratio above which the axis is warned; blank is 10 (common practice for open-loop steppers).",
  },
  // docs/model.md (The business case): the cost of one step-loss event built up from what it causes, priced with the
  // case's downtime cost and labour rate. Any of these columns filled builds it.
  "event.downtimeMinutes": {
    bound: FIELD_BOUNDS.downtimeMinutes,
    label: "Downtime per step-loss event",
    quantity: "none",
    unit: "min",
    type: "number",
    required: false,
    help: "Minutes the machine stands after one step-loss event; priced at the case's downtime cost per hour.",
  },
  "event.scrapParts": {
    bound: FIELD_BOUNDS.scrapParts,
    label: "Scrap parts per step-loss event",
    quantity: "none",
    unit: null,
    type: "number",
    required: false,
    help: "Parts scrapped by one step-loss event.",
  },
  "event.scrapCostPerPart": {
    label: "Cost per scrap part",
    quantity: "none",
    unit: null,
    type: "money-string",
    required: false,
    help: "Cost of one scrapped part in the site's currency.",
  },
  "event.restartLaborHours": {
    bound: FIELD_BOUNDS.restartLaborHours,
    label: "Restart labour per step-loss event",
    quantity: "none",
    unit: "h",
    type: "number",
    required: false,
    help: "Hours of work to restart after one step-loss event; priced at the case's labour rate.",
  },
} as const satisfies Record<ImportFieldKey, FieldSpec>;

/** Every importable field, in template column order. */
export const IMPORT_FIELDS: readonly ImportField[] = Object.entries(SPECS).map(
  ([key, spec]) => ({ key: key as ImportFieldKey, ...spec }) as ImportField,
);

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
