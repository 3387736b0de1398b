import type { CurvePoint } from "./curves";
import { torqueConstant } from "./motor";
import { rpmToRadPerS } from "./units";
import type { ParsedMotor } from "./schema";

/*
 * Torque capability at speed and the max-speed search over it. They live in one module because
 * the search evaluates the capability about forty times per axis and loop.
 */

export const MAX_SEARCH_RPM = 6000;

/**
 * What the torque model needs about one motor on one drive once the hot resistance is known,
 * as plain numbers: the max-speed search evaluates it about forty times per axis, so what does
 * not depend on the speed is worked out once here (each the same expression as in the formula,
 * so the result is the same to the last bit).
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
  /** k1·vf: torque per ampere of per-phase current. */
  torquePerA: number;
  resistanceSquared: number;
  busVoltageSquared: number;
  /** false when P_fe is 0 at every speed, so there is no drag to subtract. */
  hasIronLoss: boolean;
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
  const k1 = torqueConstant(motor);
  const { vectorFactor, resistanceOhm, busVoltageV } = drive;
  const { hysteresisWPerHz, eddyWPerHz2 } = motor;
  return {
    k1,
    vectorFactor,
    currentLimitA: drive.currentLimitA,
    resistanceOhm,
    inductanceH: motor.phaseInductanceMh / 1000,
    rotorTeeth: motor.rotorTeeth,
    busVoltageV,
    hysteresisWPerHz,
    eddyWPerHz2,
    torquePerA: k1 * vectorFactor,
    resistanceSquared: resistanceOhm * resistanceOhm,
    busVoltageSquared: busVoltageV * busVoltageV,
    hasIronLoss: hysteresisWPerHz !== 0 || eddyWPerHz2 !== 0,
  };
}

/**
 * Per-phase current the bus can drive at ω_m, back-EMF in phase with the current:
 * (e + R·I)² + (ω_e·L·I)² = V², i.e. the positive root of a·I² + b·I + c = 0 when c < 0, else 0
 * (ENGINE.md §3).
 */
function availableAtA(m: TorqueModel, omegaM: number): number {
  const e = m.k1 * omegaM;
  const c = e * e - m.busVoltageSquared;
  if (c >= 0) return 0;
  const xl = m.rotorTeeth * omegaM * m.inductanceH;
  const a = m.resistanceSquared + xl * xl;
  const b = 2 * e * m.resistanceOhm;
  return (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
}

/** T(n) = k1·vf·min(I, I_avail(n)) − T_drag(n), floored at 0 (ENGINE.md §3). */
export function modelTorqueNm(m: TorqueModel, rpm: number): number {
  const omegaM = rpmToRadPerS(rpm);
  let torque = m.torquePerA * Math.min(m.currentLimitA, availableAtA(m, omegaM));
  if (rpm > 0 && m.hasIronLoss) {
    // T_drag = P_fe/ω_m with f_e = Nr·n/60 (same as dragTorqueNm, on the flat model).
    const fe = (m.rotorTeeth * rpm) / 60;
    torque -= (m.hysteresisWPerHz * fe + m.eddyWPerHz2 * fe * fe) / omegaM;
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
  // usableTorqueNm's factor, worked out once for the ~22 steps rather than at each.
  const share = 1 - requiredPct / 100;
  if (!covers(capability, 0, share, peakTorqueNm)) return 0;
  if (covers(capability, MAX_SEARCH_RPM, share, peakTorqueNm)) return MAX_SEARCH_RPM;
  let lo = 0;
  let hi = MAX_SEARCH_RPM;
  while (hi - lo > 0.01) {
    const mid = (lo + hi) / 2;
    if (covers(capability, mid, share, peakTorqueNm)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** usable(n) ≥ peak, with usable = T(n)·share as in usableTorqueNm. */
function covers(capability: Capability, rpm: number, share: number, peakTorqueNm: number): boolean {
  return capabilityNm(capability, rpm) * share >= peakTorqueNm;
}
