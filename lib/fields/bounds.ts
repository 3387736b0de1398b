/**
 * One set of bounds per input field, named by the field registry (lib/fields/*.ts),
 * from which the engine's schema, the forms, the import columns and so the API take them: a value outside
 * them is not a stepper axis or a retrofit case, and inside them the engine's arithmetic stays
 * finite (evaluate.ts still checks its result). Each bound is physical or commercial, with room:
 * - hybrid steppers and their drives: NEMA 8–42 frames hold up to ~50 N·m at up to ~10 A per
 *   phase, with windings of 0.1–100 Ω and 0.1–300 mH, on buses up to ~350 V DC; so 100 N·m,
 *   100 A, 1000 Ω, 1000 mH, 1000 V. Duty torques at the motor shaft stay below 1000 N·m.
 * - speeds: beyond 60,000 rpm no stepper or mechanism in scope turns.
 * - time: a year has at most 8784 hours (leap year), 527,040 minutes.
 * - ambient: IEC 60204-1 machinery works at +5…+40 °C; −40…+80 °C covers cold stores and hot
 *   enclosures, and nothing outside it runs a motor.
 * - money: 10^12 in the case's currency is above any retrofit budget; quantity 100,000 axes per
 *   row is the case's own axis limit.
 * - percentages that are shares stay 0–100 (pct()); rates of change (escalation, discount,
 *   inflation) lie within ±100 % a year.
 * - lower ends: the smallest datasheet figures (NEMA 8: ~0.2 A, ~1 Ω, ~0.5 mH) with a factor
 *   of ten or more below them, so that a winding never computes as 0/0; a drive sets some
 *   current (0.01 A) and some bus voltage (1 V).
 * - no "greater than 0" where the engine divides by the field: such a bound admits 5·10^-324,
 *   and a quotient by it is Infinity. Instead a physical floor with room: thermal resistance
 *   0.01 K/W, rated rise 1 K, a kit's peak current 0.01 A, a cooler's COP 0.1 (thermoelectric
 *   coolers reach ~0.3), a life-halving interval 2 K (IEC 60216 materials lie near 6–12 K),
 *   pulley radius and screw lead 0.1 mm, gear ratio 0.01, stroke 0.001 mm or °, a move of 1 ms,
 *   efficiencies from 1 %, an acceleration share from 1 % of the move.
 * - the discount rate lies within −20…+100 % a year: the sensitivity scales it by up to
 *   (1 ± 100 %), and at −50 % doubled the discount factor 1/(1 + r)^t divides by zero.
 * `minExclusive` makes min a "greater than". `unit` is how the message names the bound.
 */
export interface FieldBound {
  readonly min: number;
  readonly minExclusive?: boolean;
  readonly max: number;
  readonly unit: string;
}

export const FIELD_BOUNDS = {
  quantity: { min: 1, max: 100_000, unit: "" },
  rotorTeeth: { min: 1, max: 500, unit: "" },
  holdingTorqueNm: { min: 0.001, max: 100, unit: "N·m" },
  ratedCurrentA: { min: 0.01, max: 100, unit: "A" },
  phaseResistanceOhm: { min: 0.01, max: 1000, unit: "Ω" },
  phaseInductanceMh: { min: 0.01, max: 1000, unit: "mH" },
  thermalResistanceKPerW: { min: 0.01, max: 100, unit: "K/W" },
  ratedTempRiseK: { min: 1, max: 250, unit: "K" },
  hysteresisWPerHz: { min: 0, max: 10, unit: "W/Hz" },
  eddyWPerHz2: { min: 0, max: 1, unit: "W/Hz²" },
  busVoltageV: { min: 1, max: 1000, unit: "V" },
  currentSettingA: { min: 0.01, max: 100, unit: "A" },
  maxCurrentPeakA: { min: 0.01, max: 100, unit: "A" },
  microsteps: { min: 1, max: 512, unit: "" },
  standbyW: { min: 0, max: 1000, unit: "W" },
  hoursPerYear: { min: 0, max: 8784, unit: "h (the hours of a leap year)" },
  speedRpm: { min: 0, max: 60_000, unit: "rpm" },
  dutyTorqueNm: { min: 0, max: 1000, unit: "N·m" },
  ambientC: { min: -40, max: 80, unit: "°C" },
  stepLossEventsPerYear: { min: 0, max: 1_000_000, unit: "a year" },
  installHours: { min: 0, max: 10_000, unit: "h" },
  downtimeHours: { min: 0, max: 8784, unit: "h" },
  // The engine caps the gain at the machine's headroom; 10,000 % only refuses typos.
  throughputGainPct: { min: 0, max: 10_000, unit: "%" },
  ratePct: { min: -100, minExclusive: true, max: 100, unit: "%" },
  discountRatePct: { min: -20, max: 100, unit: "%" },
  efficiencyPct: { min: 1, max: 100, unit: "%" },
  accelSharePct: { min: 1, max: 50, unit: "%" },
  gridKgCo2PerKWh: { min: 0, max: 10, unit: "kg/kWh" },
  coolingCop: { min: 0.1, max: 100, unit: "" },
  lifeHalvingK: { min: 2, max: 100, unit: "K" },
  bandPct: { min: -100, max: 100, unit: "%" },
  radiusMm: { min: 0.1, max: 10_000, unit: "mm" },
  leadMm: { min: 0.1, max: 10_000, unit: "mm" },
  gearRatio: { min: 0.01, max: 1000, unit: "" },
  massKg: { min: 0, max: 100_000, unit: "kg" },
  inertiaKgM2: { min: 0, max: 1000, unit: "kg·m²" },
  // A rotor's inertia when known (0 = unknown): a NEMA 8 rotor has ~2·10^-7 kg·m², so 10^-9
  // leaves room, and the inertia ratio load/rotor cannot overflow on a vanishing rotor.
  rotorInertiaKgM2: { min: 1e-9, max: 1000, unit: "kg·m²" },
  // 90° is a vertical axis; beyond it the travel would run back over itself.
  inclineDeg: { min: 0, max: 90, unit: "°" },
  frictionCoeff: { min: 0, max: 10, unit: "" },
  externalForceN: { min: 0, max: 1_000_000, unit: "N" },
  stroke: { min: 0.001, max: 1_000_000, unit: "" },
  moveTimeS: { min: 0.001, max: 3600, unit: "s" },
  dwellTimeS: { min: 0, max: 86_400, unit: "s" },
  maxInertiaRatio: { min: 0, minExclusive: true, max: 10_000, unit: "" },
  downtimeMinutes: { min: 0, max: 527_040, unit: "min" },
  scrapParts: { min: 0, max: 1_000_000_000, unit: "" },
  restartLaborHours: { min: 0, max: 8784, unit: "h" },
} as const satisfies Record<string, FieldBound>;

export type BoundedField = keyof typeof FIELD_BOUNDS;

/** The largest amount of money any field takes, in the case's currency. */
export const MONEY_MAX = "1000000000000";
