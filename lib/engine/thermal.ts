import { COPPER_ALPHA_PER_K, INSULATION_CLASS_LIMIT_C, resistanceAt } from "./motor";
import type { ParsedMotor } from "./schema";

/**
 * R_th from the datasheet's rated rise, two phases on at rated current in 20 °C ambient, with
 * the winding hot (common practice). Calibrated at the hot resistance, the steady state below
 * reproduces the datasheet rise exactly (docs/model.md (Winding temperature)); the cold resistance would overshoot
 * it by about half.
 */
export function thermalResistanceKPerW(motor: ParsedMotor): number {
  if (motor.thermalResistanceKPerW !== undefined) return motor.thermalResistanceKPerW;
  const rise = motor.ratedTempRiseK;
  return (
    rise /
    (2 *
      motor.ratedCurrentA *
      motor.ratedCurrentA *
      motor.phaseResistanceOhm *
      (1 + COPPER_ALPHA_PER_K * rise))
  );
}

export interface ThermalLoad {
  /** A: copper loss at 20 °C averaged over running hours, W (R20 · Σ duty·cf·I²). */
  copperAt20W: number;
  /** B: iron loss averaged over running hours, W. */
  ironW: number;
}

export interface ThermalState {
  /** null under thermal runaway. */
  windingTempC: number | null;
  /** R(T_w), or R at the insulation class limit under runaway (docs/model.md). */
  resistanceHotOhm: number;
  runaway: boolean;
  overClass: boolean;
}

/**
 * Steady winding temperature over the duty mix (docs/model.md (Winding temperature)): T = T_amb + R_th·(A·(1 + α(T − 20)) + B)
 * solved for T; a denominator ≤ 0 means the copper loss grows faster with temperature than the
 * motor can shed it, and the answer is NaN (thermal runaway). A plain number, so that the first
 * pass of the moving current does not build a ThermalState it only reads the resistance of.
 */
export function steadyWindingTempC(
  motor: ParsedMotor,
  ambientC: number,
  copperAt20W: number,
  ironW: number,
): number {
  const rth = thermalResistanceKPerW(motor);
  const alpha = COPPER_ALPHA_PER_K;
  const denominator = 1 - rth * copperAt20W * alpha;
  if (denominator <= 0) return NaN;
  return (ambientC + rth * (copperAt20W * (1 - 20 * alpha) + ironW)) / denominator;
}

/** R(T_w), or R at the insulation class limit under runaway (tempC NaN). */
export function hotResistanceOhm(motor: ParsedMotor, tempC: number): number {
  const at = Number.isNaN(tempC) ? INSULATION_CLASS_LIMIT_C[motor.insulationClass] : tempC;
  return resistanceAt(motor.phaseResistanceOhm, at);
}

/** The steady state of steadyWindingTempC with what the result and the warnings read of it. */
export function windingTemperature(
  motor: ParsedMotor,
  ambientC: number,
  load: ThermalLoad,
): ThermalState {
  const tempC = steadyWindingTempC(motor, ambientC, load.copperAt20W, load.ironW);
  const runaway = Number.isNaN(tempC);
  return {
    windingTempC: runaway ? null : tempC,
    resistanceHotOhm: hotResistanceOhm(motor, tempC),
    runaway,
    overClass: !runaway && tempC > INSULATION_CLASS_LIMIT_C[motor.insulationClass],
  };
}

/**
 * The freezing (melting) point of copper, a defining fixed point of ITS-90: 1084.62 °C. A
 * steady state above it is the model's arithmetic, not a winding that could exist.
 */
export const COPPER_MELTING_C = 1084.62;

/**
 * Insulation life factor 2^(ΔT/halving), null when either temperature is unknown (runaway) or
 * above the melting point of copper. The halving rule extrapolates the aging of an insulation
 * that is still a winding's insulation; past the point where the copper itself would melt, a
 * factor of "2^200 times the life" would read as a result when it is no statement at all, so
 * it is reported as not meaningful (docs/model.md (Winding temperature)). This also keeps it
 * finite: the drop is then at most 1084.62 − (−40) K, and with a halving interval of at least
 * 2 K (FIELD_BOUNDS.lifeHalvingK) the factor stays below 2^563.
 */
export function insulationLifeFactor(
  openC: number | null,
  closedC: number | null,
  lifeHalvingK: number,
): number | null {
  if (openC === null || closedC === null) return null;
  if (openC > COPPER_MELTING_C || closedC > COPPER_MELTING_C) return null;
  return Math.pow(2, (openC - closedC) / lifeHalvingK);
}
