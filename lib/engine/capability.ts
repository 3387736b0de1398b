import type { CurvePoint } from "./curves";
import { torqueConstant } from "./motor";
import type { ParsedMotor } from "./schema";

/*
 * Torque capability at speed and the max-speed search over it. They live in one module because
 * the search evaluates the capability about forty times per axis and loop.
 */

export const MAX_SEARCH_RPM = 6000;

/**
 * Per-phase current the bus can drive at speed, back-EMF in phase with the current:
 * (e + R·I)² + (ω_e·L·I)² = V² (ENGINE.md §3).
 */
export function availableCurrentA(
  k1: number,
  resistanceOhm: number,
  inductanceH: number,
  rotorTeeth: number,
  busVoltageV: number,
  rpm: number,
): number {
  const omegaM = (2 * Math.PI * rpm) / 60;
  const e = k1 * omegaM;
  const xl = rotorTeeth * omegaM * inductanceH;
  const a = resistanceOhm * resistanceOhm + xl * xl;
  const b = 2 * e * resistanceOhm;
  const c = e * e - busVoltageV * busVoltageV;
  if (c >= 0) return 0;
  return (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
}

/**
 * What the torque model needs about one motor on one drive once the hot resistance is known,
 * as plain numbers: the max-speed search evaluates it about forty times per axis.
 */
export interface TorqueModel {
  k1: number;
  vectorFactor: number;
  currentLimitA: number;
  resistanceOhm: number;
  inductanceH: number;
  rotorTeeth: number;
  busVoltageV: number;
  hysteresisWPerHz: number;
  eddyWPerHz2: number;
}

export function torqueModel(
  motor: ParsedMotor,
  drive: {
    vectorFactor: number;
    currentLimitA: number;
    resistanceOhm: number;
    busVoltageV: number;
  },
): TorqueModel {
  return {
    k1: torqueConstant(motor),
    vectorFactor: drive.vectorFactor,
    currentLimitA: drive.currentLimitA,
    resistanceOhm: drive.resistanceOhm,
    inductanceH: motor.phaseInductanceMh / 1000,
    rotorTeeth: motor.rotorTeeth,
    busVoltageV: drive.busVoltageV,
    hysteresisWPerHz: motor.hysteresisWPerHz,
    eddyWPerHz2: motor.eddyWPerHz2,
  };
}

/** T(n) = k1·vf·min(I, I_avail(n)) − T_drag(n), floored at 0 (ENGINE.md §3). */
export function modelTorqueNm(m: TorqueModel, rpm: number): number {
  const available = availableCurrentA(
    m.k1,
    m.resistanceOhm,
    m.inductanceH,
    m.rotorTeeth,
    m.busVoltageV,
    rpm,
  );
  let torque = m.k1 * m.vectorFactor * Math.min(m.currentLimitA, available);
  if (rpm > 0) {
    // T_drag = P_fe/ω_m with f_e = Nr·n/60 (same as dragTorqueNm, on the flat model).
    const fe = (m.rotorTeeth * rpm) / 60;
    torque -= (m.hysteresisWPerHz * fe + m.eddyWPerHz2 * fe * fe) / ((2 * Math.PI * rpm) / 60);
  }
  return torque > 0 ? torque : 0;
}

/** Linear interpolation with the ends held flat outside the points. */
export function interpolateCurve(curve: readonly CurvePoint[], rpm: number): number {
  const last = curve.length - 1;
  if (rpm <= curve[0].rpm) return curve[0].torqueNm;
  if (rpm >= curve[last].rpm) return curve[last].torqueNm;
  let lo = 0;
  let hi = last;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (curve[mid].rpm <= rpm) lo = mid;
    else hi = mid;
  }
  const a = curve[lo];
  const b = curve[hi];
  return a.torqueNm + ((b.torqueNm - a.torqueNm) * (rpm - a.rpm)) / (b.rpm - a.rpm);
}

/** A loop's torque capability: the model of ENGINE.md §3, or a datasheet curve replacing it. */
export interface Capability {
  model: TorqueModel;
  /** Monotone datasheet pull-out curve; open loop only. */
  curve?: readonly CurvePoint[];
}

/** Torque capability at speed (a plain function rather than a closure: it runs ~40 times per axis). */
export function capabilityNm(capability: Capability, rpm: number): number {
  return capability.curve
    ? interpolateCurve(capability.curve, rpm)
    : modelTorqueNm(capability.model, rpm);
}

export const usableTorqueNm = (torqueNm: number, requiredPct: number): number =>
  torqueNm * (1 - requiredPct / 100);

/**
 * Highest speed at which the usable torque still covers the peak, by exactly the bisection of
 * ENGINE.md §7, so that every implementation returns the same number.
 */
export function maxSpeedRpm(
  capability: Capability,
  requiredPct: number,
  peakTorqueNm: number,
): number {
  if (!covers(capability, 0, requiredPct, peakTorqueNm)) return 0;
  if (covers(capability, MAX_SEARCH_RPM, requiredPct, peakTorqueNm)) return MAX_SEARCH_RPM;
  let lo = 0;
  let hi = MAX_SEARCH_RPM;
  while (hi - lo > 0.01) {
    const mid = (lo + hi) / 2;
    if (covers(capability, mid, requiredPct, peakTorqueNm)) lo = mid;
    else hi = mid;
  }
  return lo;
}

function covers(
  capability: Capability,
  rpm: number,
  requiredPct: number,
  peakTorqueNm: number,
): boolean {
  return usableTorqueNm(capabilityNm(capability, rpm), requiredPct) >= peakTorqueNm;
}
