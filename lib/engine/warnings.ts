/** Axis warning codes of docs/model.md, in the order they are reported. */
export const AXIS_WARNINGS = [
  // No steady winding temperature, today or after the retrofit.
  "OL_THERMAL_RUNAWAY",
  "CL_THERMAL_RUNAWAY",
  // A winding hotter than its insulation class allows.
  "OL_WINDING_OVER_CLASS",
  "CL_WINDING_OVER_CLASS",
  // Whether the operating point, the kit and the energy claim hold up.
  "SPEED_BEYOND_CURVE",
  "CL_KIT_UNDERSIZED",
  "SAVING_OUTSIDE_BAND",
  "CURRENT_ABOVE_RATING",
  // A load held at standstill: these carry the brake and safe-stop caution.
  "HOLDING_LOAD",
  "OL_HOLD_SLIPS",
  // Kits without an encoder, which see nothing at low speed or at rest.
  "SENSORLESS_LOW_SPEED",
  "SENSORLESS_HOLDING_LOAD",
  // Inertia of the load against the rotor's.
  "INERTIA_RATIO_HIGH",
  "MOTOR_INERTIA_UNKNOWN",
] as const;

export type AxisWarning = (typeof AXIS_WARNINGS)[number];

export const MACHINE_WARNINGS = ["THROUGHPUT_CAPPED"] as const;
export type MachineWarning = (typeof MACHINE_WARNINGS)[number];

/** A warning set from one flag per code, in the order of AXIS_WARNINGS: each code at most once. */
type FlagPerCode<T extends readonly unknown[]> = { readonly [K in keyof T]: boolean };

export function warningSet(flags: FlagPerCode<typeof AXIS_WARNINGS>): AxisWarning[] {
  const set: AxisWarning[] = [];
  for (let i = 0; i < AXIS_WARNINGS.length; i++) if (flags[i]) set.push(AXIS_WARNINGS[i]);
  return set;
}
