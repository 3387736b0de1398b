import type { Mechanism, ParsedMotion } from "./schema";
import { STANDARD_GRAVITY } from "./units";
import type { MotionResult } from "./types";

/*
 * From the mechanism and the move to the duty figures (docs/model.md (Motion from the mechanism)): a trapezoidal move
 * there (and back, when returnMove), each phase at constant torque, then RMS, peak, mean
 * mechanical power, holding load and the shares of the running hours.
 */

/** Mechanism efficiency when none is given, % (common practice: belt 95, screw and rack 90). */
export const DEFAULT_MECHANISM_EFFICIENCY_PCT: Record<Mechanism, number> = {
  belt: 95,
  rack: 90,
  screw: 90,
  rotary: 100,
};

/** The effect of a factor on the load figures (the load-torque sensitivity): mass and forces. */
export function derivedMotion(motion: ParsedMotion, loadFactor = 1): MotionResult {
  const rotary = motion.mechanism === "rotary";
  // m/rad of mechanism-shaft turn: pulley or pinion radius, or the screw lead per radian.
  const k =
    motion.mechanism === "screw"
      ? (motion.leadMm as number) / 1000 / (2 * Math.PI)
      : rotary
        ? 0
        : (motion.radiusMm as number) / 1000;
  const gear = motion.gearRatio;
  const mechanismEff =
    (motion.efficiencyPct ?? DEFAULT_MECHANISM_EFFICIENCY_PCT[motion.mechanism]) / 100;
  const gearEff = motion.gearEfficiencyPct / 100;
  const eta = mechanismEff * gearEff;
  // Back-driving: the load drives the motor. A screw's is about 2 − 1/η (textbook
  // approximation, from memory); at or below 0 it is self-locking.
  const etaBack = motion.mechanism === "screw" ? (2 - 1 / mechanismEff) * gearEff : eta;
  const selfLocking = etaBack <= 0;

  const mass = motion.massKg * loadFactor;
  const incline = (motion.inclineDeg * Math.PI) / 180;
  const sin = Math.sin(incline);
  const cos = Math.cos(incline);

  const theta = rotary ? (gear * motion.stroke * Math.PI) / 180 : (gear * motion.stroke) / 1000 / k;
  const moveTime = motion.moveTimeS;
  const tA = (motion.accelSharePct / 100) * moveTime;
  const tC = moveTime - 2 * tA;
  const omegaPeak = theta / (moveTime - tA);
  const alpha = omegaPeak / tA;

  const reflected = rotary
    ? motion.loadInertiaKgM2 / (gear * gear)
    : (motion.loadInertiaKgM2 + mass * k * k) / (gear * gear);
  // The rotor's own inertia plus the load's through the drive train; the efficiency is applied
  // while decelerating too, which errs on the safe side.
  const inertia = motion.motorInertiaKgM2 + reflected / eta;

  const atMotor = (shaftTorque: number): number =>
    shaftTorque >= 0 ? shaftTorque / eta : shaftTorque * etaBack;
  const loadTorque = (direction: 1 | -1): number => {
    if (rotary) return atMotor((motion.externalTorqueNm * loadFactor) / gear);
    const force =
      mass * STANDARD_GRAVITY * (direction * sin + motion.frictionCoeff * cos) +
      motion.externalForceN * loadFactor;
    return atMotor((force * k) / gear);
  };

  const moves: number[] = motion.returnMove ? [loadTorque(1), loadTorque(-1)] : [loadTorque(1)];
  const inertiaTorque = inertia * alpha;
  let sumSquares = 0;
  let peak = 0;
  let positiveWork = 0;
  for (const tl of moves) {
    const phases: [torque: number, time: number, turn: number][] = [
      [tl + inertiaTorque, tA, (omegaPeak * tA) / 2],
      [tl, tC, omegaPeak * tC],
      [tl - inertiaTorque, tA, (omegaPeak * tA) / 2],
    ];
    for (const [torque, time, turn] of phases) {
      sumSquares += torque * torque * time;
      peak = Math.max(peak, Math.abs(torque));
      // Negative work is burnt in the drive, not recovered (common practice for small drives).
      positiveWork += Math.max(0, torque * turn);
    }
  }
  const movingTime = moveTime * moves.length;
  const dwellTime = motion.dwellTimeS * moves.length;
  const cycle = movingTime + dwellTime;
  const holdTorque = rotary || selfLocking ? 0 : (mass * STANDARD_GRAVITY * sin * k) / gear;

  return {
    speedRpm: (omegaPeak * 60) / (2 * Math.PI),
    loadTorqueNm: Math.sqrt(sumSquares / movingTime),
    peakTorqueNm: peak,
    holdTorqueNm: holdTorque,
    meanMechPowerW: positiveWork / movingTime,
    movePct: (motion.energizedPct * movingTime) / cycle,
    holdPct: (motion.energizedPct * dwellTime) / cycle,
    reflectedInertiaKgM2: reflected,
    inertiaRatio: motion.motorInertiaKgM2 === 0 ? null : reflected / motion.motorInertiaKgM2,
  };
}
