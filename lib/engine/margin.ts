import { capabilityNm, maxSpeedRpm, MAX_SEARCH_RPM, type Capability } from "./capability";
import { finiteOrNull } from "./finite";

/**
 * 100·(1 − peak/T), null when there is no torque at all — or so little (10^-300 N·m) that the
 * quotient overflows, which is no torque in all but name (finite.ts).
 */
export function marginPct(peakTorqueNm: number, torqueNm: number): number | null {
  return torqueNm === 0 ? null : finiteOrNull(100 * (1 - peakTorqueNm / torqueNm));
}

export type OpenLoopStatus = "ok" | "at-risk" | "step-loss";
export type ClosedLoopStatus = "ok" | "at-risk" | "undersized";

/** A null margin (no torque at speed) reads as the failing status. */
export function marginStatus(
  margin: number | null,
  requiredPct: number,
): "ok" | "at-risk" | "short" {
  if (margin === null || margin < 0) return "short";
  return margin >= requiredPct ? "ok" : "at-risk";
}

/**
 * Open-loop load angle: sin θ_e = T_load/T_po. Past 90° electrical (one full step) there is no
 * stable angle and the rotor slips by whole electrical cycles.
 */
export function loadAngle(
  loadTorqueNm: number,
  pullOutNm: number,
  rotorTeeth: number,
): { elecDeg: number | null; mechDeg: number | null } {
  if (pullOutNm === 0 || loadTorqueNm > pullOutNm) return { elecDeg: null, mechDeg: null };
  const elecDeg = (Math.asin(loadTorqueNm / pullOutNm) * 180) / Math.PI;
  return { elecDeg, mechDeg: elecDeg / rotorTeeth };
}

/**
 * How much faster the axis could run closed loop with its margin kept; null at standstill, and
 * at a speed so near it (10^-300 rpm) that the ratio overflows (finite.ts).
 */
export function speedHeadroomPct(maxSpeedRpmClosed: number, speedRpm: number): number | null {
  return speedRpm === 0 ? null : finiteOrNull(100 * (maxSpeedRpmClosed / speedRpm - 1));
}

/**
 * The closed-loop speed headroom as the throughput cap of docs/model.md (The business case) uses it, where only
 * min(gain, headroom) counts: a headroom surely at or above the machine's gain comes back as the
 * gain itself, after one torque evaluation instead of the ~24 of the docs/model.md (Torque margin and speed) bisection; any other
 * comes from the bisection, as speedHeadroomPct gives it.
 *
 * Why one evaluation decides it: the usable torque does not rise with speed, so if it covers the
 * peak at a probe speed x, the bisection keeps every midpoint up to x and ends above x − 0.01 rpm.
 * The probe lies 0.01 rpm and a relative 1e-9 above the speed the gain needs, and the torque must
 * clear the peak by a relative 1e-12, far beyond floating-point noise in either.
 */
export function headroomForGain(
  capability: Capability,
  requiredPct: number,
  op: { speedRpm: number; peakTorqueNm: number },
  gainPct: number,
): number | null {
  const { speedRpm, peakTorqueNm } = op;
  if (speedRpm === 0) return null;
  const probeRpm = speedRpm * (1 + gainPct / 100) * (1 + 1e-9) + 0.01;
  const usable = capabilityNm(capability, probeRpm) * (1 - requiredPct / 100);
  if (probeRpm <= MAX_SEARCH_RPM && usable >= peakTorqueNm * (1 + 1e-12)) return gainPct;
  return speedHeadroomPct(maxSpeedRpm(capability, requiredPct, peakTorqueNm), speedRpm);
}
