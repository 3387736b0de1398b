import { copperFactor, dragTorqueNm, torqueConstant, vectorFactor } from "./motor";
import type { ParsedAxis, ParsedKit, ParsedMotor } from "./schema";

export interface LoopCurrents {
  /** Per-phase peak (open loop) or torque current I_q (closed loop), A. */
  moveA: number;
  holdA: number;
  /** The ceiling the torque model uses: today's setting, or the kit's I_max. */
  limitA: number;
  vectorFactor: number;
  copperFactor: number;
  /** Closed loop only: a moving or holding demand above I_max (ENGINE.md §4). */
  demandAboveLimit: boolean;
}

/** Today's per-phase peak: an RMS setting in micro mode is √2·I_rms (ENGINE.md §3). */
export function openLoopSettingA(drive: ParsedAxis["drive"]): number {
  return drive.stepMode === "micro" && drive.currentConvention === "rms"
    ? Math.SQRT2 * drive.currentSettingA
    : drive.currentSettingA;
}

/** Open loop: the setting while moving, the idle share at standstill — whatever the load. */
export function openLoopCurrents(axis: ParsedAxis): LoopCurrents {
  const setting = openLoopSettingA(axis.drive);
  return {
    moveA: setting,
    holdA: (setting * axis.drive.idleCurrentPct) / 100,
    limitA: setting,
    vectorFactor: vectorFactor(axis.drive.stepMode),
    copperFactor: copperFactor(axis.drive.stepMode),
    demandAboveLimit: false,
  };
}

export const kitMotor = (axis: ParsedAxis): ParsedMotor => axis.retrofit.kit.motor ?? axis.motor;

export function kitMaxCurrentA(kit: ParsedKit, motor: ParsedMotor): number {
  return kit.maxCurrentPeakA ?? Math.SQRT2 * motor.ratedCurrentA;
}

/**
 * ENGINE.md §2: encoderW defaults to 0.5 W, and to 0 for a sensorless kit, which has no encoder
 * to feed. A value given is used as given, like every other default of §2.
 */
export function kitEncoderW(kit: ParsedKit): number {
  return kit.encoderW ?? (kit.sensing === "sensorless" ? 0 : 0.5);
}

/** Closed loop (FOC, I_d = 0): the torque current the load asks for, between I_min and I_max. */
export function closedLoopCurrents(axis: ParsedAxis, loadTorqueNm: number): LoopCurrents {
  const kit = axis.retrofit.kit;
  const motor = kitMotor(axis);
  const k1 = torqueConstant(motor);
  const maxA = kitMaxCurrentA(kit, motor);
  const minA = (kit.minCurrentPct * maxA) / 100;
  const { speedRpm, holdTorqueNm } = axis.duty;

  const moveDemandA = (loadTorqueNm + dragTorqueNm(motor, speedRpm)) / k1;
  const holdDemandA = holdTorqueNm / k1;
  let moveA = Math.min(Math.max(moveDemandA, minA), maxA);
  let holdA = Math.min(Math.max(holdDemandA, minA), maxA);

  if (kit.sensing === "sensorless") {
    // No back-EMF to estimate the rotor position from: hold at the idle share, run slow at I_max.
    holdA = Math.min(Math.max(holdA, (axis.drive.idleCurrentPct * maxA) / 100), maxA);
    if (speedRpm < kit.sensorlessMinRpm) moveA = maxA;
  }

  return {
    moveA,
    holdA,
    limitA: maxA,
    vectorFactor: 1,
    copperFactor: 1,
    demandAboveLimit: moveDemandA > maxA || holdDemandA > maxA,
  };
}
