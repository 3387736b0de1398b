import type { FieldSpec } from "./types";

/**
 * The closed-loop kit of the catalogue (docs/model.md, RetrofitInput.kit): what it can drive and
 * what it draws. Its code, name, price and currency are the catalogue's own fields.
 */
export const KIT_FIELDS = {
  sensing: {
    label: "Sensing",
    help: "How the kit closes the loop: an encoder, or sensorless from the motor's back-EMF.",
    kind: "enum",
    unit: null,
    choices: ["encoder", "sensorless"],
    default: "encoder",
  },
  maxCurrentPeakA: {
    label: "Kit peak current",
    help: "Highest phase current the kit's drive delivers, peak; blank takes √2 × the motor's rated current.",
    kind: "number",
    unit: "A",
    range: "maxCurrentPeakA",
    optional: true,
  },
  busVoltageV: {
    label: "Kit bus voltage",
    help: "DC supply voltage of the kit's drive; blank keeps today's bus voltage.",
    kind: "number",
    unit: "V",
    range: "busVoltageV",
    optional: true,
  },
  efficiencyPct: {
    label: "Kit drive efficiency",
    help: "Electrical efficiency of the kit's power stage.",
    kind: "number",
    unit: "%",
    range: "efficiencyPct",
    default: 92,
  },
  standbyW: {
    label: "Kit standby power",
    help: "Power the kit's drive draws for its own electronics whenever it is on.",
    kind: "number",
    unit: "W",
    range: "standbyW",
    default: 3,
  },
  encoderW: {
    label: "Encoder power",
    help: "Power the encoder draws; blank is 0.5 W with an encoder and 0 sensorless (docs/model.md).",
    kind: "number",
    unit: "W",
    range: "standbyW",
    optional: true,
  },
  minCurrentPct: {
    label: "Minimum current",
    help: "The least current the kit keeps in the motor, as a percentage of its peak current.",
    kind: "number",
    unit: "%",
    range: "share",
    default: 10,
  },
  sensorlessMinRpm: {
    label: "Sensorless minimum speed",
    help: "Below this speed a sensorless kit cannot see the rotor and runs open loop in effect.",
    kind: "number",
    unit: "rpm",
    range: "speedRpm",
    default: 60,
  },
} as const satisfies Record<string, FieldSpec>;

export type KitFieldKey = keyof typeof KIT_FIELDS;
