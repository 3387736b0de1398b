import { derivedMotion } from "./motion";
import type { ParsedAxis } from "./schema";
import type { MotionResult } from "./types";
import { rpmToRadPerS } from "./units";

/**
 * The duty of one axis as the physics uses it: typed by the engineer, or derived from the
 * mechanism and the move (docs/model.md (Motion from the mechanism)), which then replaces the typed figures.
 */
export interface AxisDuty {
  hoursPerYear: number;
  /** Shares of running hours: moving and holding; the rest the motor is de-energized. */
  move: number;
  hold: number;
  speedRpm: number;
  loadTorqueNm: number;
  peakTorqueNm: number;
  holdTorqueNm: number;
  ambientC: number;
  /** Mean mechanical power while moving, W: load·ω typed, or the positive work of the move. */
  mechanicalW: number;
  motion: MotionResult | null;
}

/**
 * loadFactor scales the load (the load-torque sensitivity): the three torques typed, or the
 * mass and the process force or torque of a mechanism.
 */
export function axisDuty(axis: ParsedAxis, loadFactor = 1): AxisDuty {
  const duty = axis.duty;
  if (duty.motion !== undefined) {
    const motion = derivedMotion(duty.motion, loadFactor);
    return {
      hoursPerYear: duty.hoursPerYear,
      move: motion.movePct / 100,
      hold: motion.holdPct / 100,
      speedRpm: motion.speedRpm,
      loadTorqueNm: motion.loadTorqueNm,
      peakTorqueNm: motion.peakTorqueNm,
      holdTorqueNm: motion.holdTorqueNm,
      ambientC: duty.ambientC,
      mechanicalW: motion.meanMechPowerW,
      motion,
    };
  }
  // The schema requires these when there is no motion.
  const speedRpm = duty.speedRpm as number;
  const loadTorqueNm = (duty.loadTorqueNm as number) * loadFactor;
  return {
    hoursPerYear: duty.hoursPerYear,
    move: (duty.movePct as number) / 100,
    hold: (duty.holdPct as number) / 100,
    speedRpm,
    loadTorqueNm,
    peakTorqueNm: (duty.peakTorqueNm as number) * loadFactor,
    holdTorqueNm: duty.holdTorqueNm * loadFactor,
    ambientC: duty.ambientC,
    mechanicalW: loadTorqueNm * rpmToRadPerS(speedRpm),
    motion: null,
  };
}
