/** 100·(1 − peak/T), null when there is no torque at all. */
export function marginPct(peakTorqueNm: number, torqueNm: number): number | null {
  return torqueNm === 0 ? null : 100 * (1 - peakTorqueNm / torqueNm);
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

/** How much faster the axis could run closed loop with its margin kept; null at standstill. */
export function speedHeadroomPct(maxSpeedRpmClosed: number, speedRpm: number): number | null {
  return speedRpm === 0 ? null : 100 * (maxSpeedRpmClosed / speedRpm - 1);
}
