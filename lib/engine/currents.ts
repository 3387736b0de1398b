import type { VoltageDisc } from "./capability";
import type { AxisDuty } from "./duty";
import { dragTorqueNm, holdVectorFactor, torqueConstant } from "./motor";
import type { ParsedAxis, ParsedKit, ParsedMotor } from "./schema";

/*
 * The currents of each state (docs/model.md (Currents at the operating point)). Pass 1 ignores the voltage limit while moving;
 * pass 2 puts the moving current at the operating point with the pass-1 hot resistance.
 */

/** Today's per-phase peak: an RMS setting in micro mode is √2·I_rms (docs/model.md (Torque at speed)). */
export function openLoopSettingA(drive: ParsedAxis["drive"]): number {
  return drive.stepMode === "micro" && drive.currentConvention === "rms"
    ? Math.SQRT2 * drive.currentSettingA
    : drive.currentSettingA;
}

/**
 * Today's holding current per phase: the idle share of the setting. The idle-current driver of
 * the sensitivity passes its scaled share as idleCurrentPct.
 */
export const openLoopHoldA = (
  axis: ParsedAxis,
  idleCurrentPct = axis.drive.idleCurrentPct,
): number => (openLoopSettingA(axis.drive) * idleCurrentPct) / 100;

/** What today's drive holds at standstill: k1·vf_hold·I_set·idle (docs/model.md (Torque margin and speed)). */
export const holdingCapabilityNm = (
  axis: ParsedAxis,
  idleCurrentPct = axis.drive.idleCurrentPct,
): number =>
  torqueConstant(axis.motor) *
  holdVectorFactor(axis.drive.stepMode) *
  openLoopHoldA(axis, idleCurrentPct);

/** Is the point (d, q) of the current plane inside the voltage disc? */
const inDisc = (disc: VoltageDisc, d: number, q: number): boolean =>
  (d - disc.cd) * (d - disc.cd) + (q - disc.cq) * (q - disc.cq) <= disc.rho * disc.rho;

/**
 * Open loop, pass 2: the current-vector magnitude the chopper reaches while moving. It holds its
 * setting I_lim as long as the bus allows; short of voltage it draws less (docs/model.md (Currents at the operating point)).
 */
export function openLoopMovingMagnitudeA(
  currentLimitA: number,
  torqueCurrentA: number,
  disc: VoltageDisc,
): number {
  const iq = Math.min(currentLimitA, torqueCurrentA);
  const id = Math.sqrt(Math.max(0, currentLimitA * currentLimitA - iq * iq));
  if (inDisc(disc, id, iq)) return currentLimitA;
  const w2 = disc.rho * disc.rho - (iq - disc.cq) * (iq - disc.cq);
  // Out of the disc at this torque current: the axis loses steps anyway; keep the setting.
  if (w2 < 0) return currentLimitA;
  return Math.min(currentLimitA, Math.hypot(disc.cd + Math.sqrt(w2), iq));
}

export const kitMotor = (axis: ParsedAxis): ParsedMotor => axis.retrofit.kit.motor ?? axis.motor;

export function kitMaxCurrentA(kit: ParsedKit, motor: ParsedMotor): number {
  return kit.maxCurrentPeakA ?? Math.SQRT2 * motor.ratedCurrentA;
}

/**
 * encoderW defaults to 0.5 W, and to 0 for a sensorless kit, which has no encoder to feed. A
 * value given is used as given, like every other default.
 */
export function kitEncoderW(kit: ParsedKit): number {
  return kit.encoderW ?? (kit.sensing === "sensorless" ? 0 : 0.5);
}

export interface ClosedLoopDemand {
  /** Moving torque current I_q (or I_max for a sensorless kit below its minimum speed), A. */
  moveA: number;
  holdA: number;
  maxA: number;
  /** A moving or holding demand above I_max: the kit is undersized (docs/model.md (Currents at the operating point)). */
  demandAboveLimit: boolean;
  /** A sensorless kit below its minimum speed runs open loop in all but name. */
  lowSpeedSensorless: boolean;
}

/** Closed loop, pass 1: the torque current the load asks for, between I_min and I_max. */
export function closedLoopDemand(
  axis: ParsedAxis,
  duty: AxisDuty,
  idleCurrentPct = axis.drive.idleCurrentPct,
): ClosedLoopDemand {
  const kit = axis.retrofit.kit;
  const motor = kitMotor(axis);
  const k1 = torqueConstant(motor);
  const maxA = kitMaxCurrentA(kit, motor);
  const minA = (kit.minCurrentPct * maxA) / 100;

  const moveDemandA = (duty.loadTorqueNm + dragTorqueNm(motor, duty.speedRpm)) / k1;
  const holdDemandA = duty.holdTorqueNm / k1;
  let moveA = Math.min(Math.max(moveDemandA, minA), maxA);
  let holdA = Math.min(Math.max(holdDemandA, minA), maxA);
  let lowSpeedSensorless = false;

  if (kit.sensing === "sensorless") {
    // No back-EMF at rest to estimate the position from: it holds with the torque today's drive
    // holds with. The cap alone does not make the kit undersized.
    const todayHoldNm = holdingCapabilityNm(axis, idleCurrentPct);
    holdA = Math.min(Math.max(holdA, todayHoldNm / k1), maxA);
    if (duty.speedRpm < kit.sensorlessMinRpm) {
      moveA = maxA;
      lowSpeedSensorless = true;
    }
  }

  return {
    moveA,
    holdA,
    maxA,
    demandAboveLimit: moveDemandA > maxA || holdDemandA > maxA,
    lowSpeedSensorless,
  };
}

/**
 * Closed loop, pass 2: the magnitude of the least field-weakening current i_d with I_q at the
 * operating speed (docs/model.md (Currents at the operating point)); NaN when no i_d reaches I_q
 * there. A plain number: loopEnergy calls it for every axis in every sensitivity run.
 */
export function fieldWeakeningMagnitudeA(iq: number, disc: VoltageDisc): number {
  const w2 = disc.rho * disc.rho - (iq - disc.cq) * (iq - disc.cq);
  if (w2 < 0) return NaN;
  return Math.hypot(Math.min(0, disc.cd + Math.sqrt(w2)), iq);
}
