import type { CurvePoint } from "./curves";
import { torqueConstant } from "./motor";
import { rpmToRadPerS } from "./units";
import type { ParsedMotor } from "./schema";

/*
 * Torque capability at speed (docs/model.md (Torque at speed)) and the max-speed search over it. They live in
 * one module because the search evaluates the capability about forty times per axis and loop.
 */

export const MAX_SEARCH_RPM = 6000;

/**
 * What the torque model needs about one motor on one drive once the hot resistance is known,
 * as plain numbers: the max-speed search evaluates it about forty times per axis, so what does
 * not depend on the speed is worked out once here.
 */
export interface TorqueModel {
  k1: number;
  /** I_lim: the largest current-vector magnitude the drive holds, A (per-phase peak). */
  currentLimitA: number;
  resistanceOhm: number;
  inductanceH: number;
  rotorTeeth: number;
  busVoltageV: number;
  hysteresisWPerHz: number;
  eddyWPerHz2: number;
  /** false when P_fe is 0 at every speed, so there is no drag to subtract. */
  hasIronLoss: boolean;
}

export function torqueModel(
  motor: ParsedMotor,
  drive: { currentLimitA: number; resistanceOhm: number; busVoltageV: number },
): TorqueModel {
  const { hysteresisWPerHz, eddyWPerHz2 } = motor;
  return {
    k1: torqueConstant(motor),
    currentLimitA: drive.currentLimitA,
    resistanceOhm: drive.resistanceOhm,
    inductanceH: motor.phaseInductanceMh / 1000,
    rotorTeeth: motor.rotorTeeth,
    busVoltageV: drive.busVoltageV,
    hysteresisWPerHz,
    eddyWPerHz2,
    hasIronLoss: hysteresisWPerHz !== 0 || eddyWPerHz2 !== 0,
  };
}

/**
 * The voltage limit as a disc in the rotor-frame current plane (docs/model.md (Torque at speed)): with
 * v = (R + jX)·i + jE, |v| ≤ V holds inside the disc centred at c = −E·(X, R)/Z² with radius
 * ρ = V/Z, Z = √(R² + X²), X = ω_e·L, E = k1·ω_m.
 */
export interface VoltageDisc {
  cd: number;
  cq: number;
  rho: number;
  /** |c| = E/Z, computed directly to avoid cancellation. */
  d: number;
  e: number;
  z: number;
}

export function voltageDisc(m: TorqueModel, rpm: number): VoltageDisc {
  return discOf(m.k1, m.rotorTeeth, m.inductanceH, m.resistanceOhm, m.busVoltageV, rpm);
}

/** The voltage disc of a motor at a resistance and bus, without building its TorqueModel first. */
export function motorVoltageDisc(
  motor: ParsedMotor,
  resistanceOhm: number,
  busVoltageV: number,
  rpm: number,
): VoltageDisc {
  const inductanceH = motor.phaseInductanceMh / 1000;
  return discOf(
    torqueConstant(motor),
    motor.rotorTeeth,
    inductanceH,
    resistanceOhm,
    busVoltageV,
    rpm,
  );
}

function discOf(
  k1: number,
  rotorTeeth: number,
  inductanceH: number,
  r: number,
  v: number,
  rpm: number,
): VoltageDisc {
  const omegaM = rpmToRadPerS(rpm);
  const e = k1 * omegaM;
  const x = rotorTeeth * omegaM * inductanceH;
  const z2 = r * r + x * x;
  const z = Math.sqrt(z2);
  return { cd: (-e * x) / z2, cq: (-e * r) / z2, rho: v / z, d: e / z, e, z };
}

/**
 * The largest torque current i_q in both the current disc (radius I_lim about 0) and the voltage
 * disc, without iterating, so that another implementation gets the same figure (docs/model.md (Torque at speed)):
 * the top of the current disc, the top of the voltage disc, or a crossing of the two circles;
 * 0 when the discs do not meet.
 */
export function largestTorqueCurrentA(m: TorqueModel, rpm: number): number {
  // The voltage disc of voltageDisc, inlined: the max-speed search calls this ~40 times per
  // axis and loop, and an object per call made the garbage collector the engine's main cost.
  const omegaM = rpmToRadPerS(rpm);
  const e = m.k1 * omegaM;
  const x = m.rotorTeeth * omegaM * m.inductanceH;
  const r = m.resistanceOhm;
  const z2 = r * r + x * x;
  const z = Math.sqrt(z2);
  const cd = (-e * x) / z2;
  const cq = (-e * r) / z2;
  const v = m.busVoltageV;
  const rho = v / z;
  const d = e / z;
  const iLim = m.currentLimitA;
  let best = -Infinity;
  // (a) full current on the q axis, when the bus can drive it.
  if (cd * cd + (iLim - cq) * (iLim - cq) <= rho * rho) best = iLim;
  // (b) the top of the voltage disc, when the drive's current limit allows it.
  const top = cq + rho;
  if (cd * cd + top * top <= iLim * iLim && top > best) best = top;
  // (c) where the two circles cross.
  if (d > 0 && Math.abs(iLim - rho) <= d && d <= iLim + rho) {
    const along = (((e - v) * (e + v)) / z2 + iLim * iLim) / (2 * d);
    const h = Math.sqrt(Math.max(0, iLim * iLim - along * along));
    const ud = cd / d;
    const uq = cq / d;
    const upper = along * uq + (h * ud >= 0 ? h * ud : -h * ud);
    if (upper > best) best = upper;
  }
  return best === -Infinity ? 0 : best;
}

/**
 * Motor torque at speed n: k1 times the largest torque current the two discs allow (none when
 * it is negative), less the iron-loss drag, and never below zero (docs/model.md (Torque at speed)).
 */
export function modelTorqueNm(m: TorqueModel, rpm: number): number {
  let torque = m.k1 * Math.max(0, largestTorqueCurrentA(m, rpm));
  if (rpm > 0 && m.hasIronLoss) {
    // T_drag = P_fe/ω_m with f_e = Nr·n/60 (same as dragTorqueNm, on the flat model).
    const fe = (m.rotorTeeth * rpm) / 60;
    // fe/ω_m = N_r/2π at every speed, so T_drag = (k_h + k_e·f_e)·N_r/2π: written without the
    // division by ω_m, a speed of 1e-320 rpm (subnormal, ω_m inexact or 0) gives the same drag
    // as 1e-6 rpm instead of a 0/0 or a drag off by a tenth of a percent.
    torque -= ((m.hysteresisWPerHz + m.eddyWPerHz2 * fe) * m.rotorTeeth) / (2 * Math.PI);
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

/** An open-loop mid-band dip: from fromRpm on, the torque keeps at most (1 − derate) of T_m. */
export interface ResonanceDip {
  fromRpm: number;
  toRpm: number;
  /** deratePct/100 */
  derate: number;
}

/**
 * A loop's torque capability: the model of docs/model.md (Torque at speed), a datasheet curve replacing it
 * (open loop), a resonance dip on the open-loop model, or the datasheet curve as a floor under
 * the closed-loop model when the kit keeps the motor and the bus.
 */
export interface Capability {
  model: TorqueModel;
  /** Monotone datasheet pull-out curve; open loop only. */
  curve?: readonly CurvePoint[];
  resonance?: ResonanceDip;
  /** Closed loop: max(model, floor.curve(n)·floor.scale). */
  floor?: { curve: readonly CurvePoint[]; scale: number };
}

/** Torque capability at speed (a plain function rather than a closure: it runs ~40 times per axis). */
export function capabilityNm(capability: Capability, rpm: number): number {
  if (capability.curve) return interpolateCurve(capability.curve, rpm);
  const m = capability.model;
  let torque = modelTorqueNm(m, rpm);
  const dip = capability.resonance;
  // Every move to a speed past the band crosses it, so the dip limits every speed beyond it and
  // the capability stays non-increasing (the bisection below stays exact).
  if (dip !== undefined && dip.derate > 0 && rpm >= dip.fromRpm) {
    const inBand = rpm <= dip.toRpm ? torque : modelTorqueNm(m, dip.toRpm);
    torque = Math.min(torque, (1 - dip.derate) * inBand);
  }
  const floor = capability.floor;
  if (floor !== undefined)
    torque = Math.max(torque, interpolateCurve(floor.curve, rpm) * floor.scale);
  return torque;
}

export const usableTorqueNm = (torqueNm: number, requiredPct: number): number =>
  torqueNm * (1 - requiredPct / 100);

/**
 * Highest speed at which the usable torque still covers the peak, by exactly the bisection of
 * docs/model.md (Torque margin and speed), so that another implementation gets the same figure.
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
