import type { FieldSpec } from "./types";

export const MECHANISMS = ["belt", "rack", "screw", "rotary"] as const;
export type Mechanism = (typeof MECHANISMS)[number];

/**
 * docs/model.md (Motion from the mechanism): the mechanism and the move of one axis, the engine's
 * duty.motion. On import a blank cell takes the engine's default, and the bounds marked
 * `importCheckedOnObject` are checked by the engine's schema on the object a row builds.
 */
export const MOTION_FIELDS = {
  mechanism: {
    label: "Mechanism",
    help: "What the motor drives: belt, rack, screw or rotary. With a mechanism the speed, torques and move and hold shares are derived from the motion columns and may stay blank.",
    kind: "enum",
    unit: null,
    choices: MECHANISMS,
  },
  radiusMm: {
    label: "Pulley or pinion radius",
    help: "Pitch radius of the belt pulley or the rack pinion; required for a belt or a rack.",
    kind: "number",
    unit: "mm",
    range: "radiusMm",
    optional: true,
  },
  leadMm: {
    label: "Screw lead",
    help: "Travel per screw turn; required for a screw.",
    kind: "number",
    unit: "mm",
    range: "leadMm",
    optional: true,
  },
  efficiencyPct: {
    label: "Mechanism efficiency",
    help: "Efficiency of the belt, rack, screw or rotary stage; blank takes belt 95, rack 90, screw 90, rotary 100 (common practice, not a published value).",
    kind: "number",
    unit: "%",
    range: "efficiencyPct",
    optional: true,
    importCheckedOnObject: true,
  },
  gearRatio: {
    label: "Gear ratio",
    help: "Motor turns per turn of the mechanism's shaft; blank is 1 (no gearbox).",
    kind: "number",
    unit: null,
    range: "gearRatio",
    default: 1,
  },
  gearEfficiencyPct: {
    label: "Gear efficiency",
    help: "Efficiency of the gearbox; blank is 100 (no gearbox).",
    kind: "number",
    unit: "%",
    range: "efficiencyPct",
    default: 100,
    importCheckedOnObject: true,
  },
  massKg: {
    label: "Moving mass",
    help: "Mass the belt, rack or screw moves, carriage and payload together; blank is 0.",
    kind: "number",
    unit: "kg",
    range: "massKg",
    default: 0,
  },
  loadInertiaKgM2: {
    label: "Load inertia",
    help: "Inertia at the mechanism's shaft: pulleys, screw, rotary table; blank is 0.",
    kind: "number",
    unit: "kg·m²",
    accepts: "inertia",
    range: "inertiaKgM2",
    default: 0,
  },
  motorInertiaKgM2: {
    label: "Rotor inertia",
    help: "Rotor inertia of the motor from its datasheet; blank (0) means unknown, and the peak torque then misses the rotor's own share.",
    kind: "number",
    unit: "kg·m²",
    accepts: "inertia",
    range: "inertiaKgM2",
    default: 0,
  },
  inclineDeg: {
    label: "Incline",
    help: "Angle of the travel above horizontal, 0 to 90: 90 is a vertical axis whose forward move goes up. Blank is 0.",
    kind: "number",
    unit: "°",
    range: "inclineDeg",
    default: 0,
    importCheckedOnObject: true,
  },
  frictionCoeff: {
    label: "Friction coefficient",
    help: "Coulomb friction coefficient of the guide on its normal force; blank is 0.",
    kind: "number",
    unit: null,
    range: "frictionCoeff",
    default: 0,
  },
  externalForceN: {
    label: "Process force",
    help: "Force of the process against the motion of a belt, rack or screw; blank is 0.",
    kind: "number",
    unit: "N",
    range: "externalForceN",
    default: 0,
  },
  externalTorqueNm: {
    label: "Process torque",
    help: "Torque of the process against the motion at a rotary mechanism's shaft; blank is 0.",
    kind: "number",
    unit: "N·m",
    accepts: "torque",
    range: "dutyTorqueNm",
    default: 0,
  },
  stroke: {
    label: "Stroke",
    help: "Length of one move: millimetres for a belt, rack or screw, degrees for a rotary mechanism; required with a mechanism.",
    kind: "number",
    unit: null,
    range: "stroke",
  },
  moveTimeS: {
    label: "Move duration",
    help: "Time one move takes, from standstill to standstill; required with a mechanism.",
    kind: "number",
    unit: "s",
    range: "moveTimeS",
  },
  accelSharePct: {
    label: "Acceleration share",
    help: "Share of the move spent accelerating (the same share decelerating), at most 50; blank is 25 (common practice).",
    kind: "number",
    unit: "%",
    range: "accelSharePct",
    default: 25,
    importCheckedOnObject: true,
  },
  dwellTimeS: {
    label: "Dwell after each move",
    help: "Standstill after each move, holding position; blank is 0.",
    kind: "number",
    unit: "s",
    range: "dwellTimeS",
    default: 0,
  },
  returnMove: {
    label: "Return move",
    help: "Yes when each forward move is followed by the move back; blank is yes.",
    kind: "boolean",
    unit: null,
    default: true,
  },
  energizedPct: {
    label: "Cycling share",
    help: "Share of the running hours in which the axis cycles; blank is 100.",
    kind: "number",
    unit: "%",
    range: "share",
    default: 100,
    importCheckedOnObject: true,
  },
  maxInertiaRatio: {
    label: "Highest inertia ratio",
    help: "Load-to-rotor inertia ratio above which the axis is warned; blank is 10 (common practice for open-loop steppers).",
    kind: "number",
    unit: null,
    range: "maxInertiaRatio",
    default: 10, // common practice for open-loop steppers
  },
} as const satisfies Record<string, FieldSpec>;

export type MotionFieldKey = keyof typeof MOTION_FIELDS;
