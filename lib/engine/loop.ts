import {
  capabilityNm,
  maxSpeedRpm,
  torqueModel,
  usableTorqueNm,
  type Capability,
} from "./capability";
import type { LoopCurrents } from "./currents";
import type { CurvePoint } from "./curves";
import { coolingKWhPerYear, kWhPerYear, type DriveLosses, type DutyMix } from "./energy";
import { marginPct, marginStatus } from "./margin";
import { ironLossW } from "./motor";
import type { ParsedMotor } from "./schema";
import { windingTemperature, type ThermalState } from "./thermal";
import type { LoopResult } from "./types";

/** One loop — today's open-loop drive or the proposed kit — on one axis. */
export interface LoopSpec {
  motor: ParsedMotor;
  currents: LoopCurrents;
  busVoltageV: number;
  drive: DriveLosses;
  /** The datasheet pull-out curve, made monotone; open loop only. */
  curve?: CurvePoint[];
  requiredPct: number;
  /** How this loop names a negative margin: "step-loss" open loop, "undersized" closed loop. */
  shortStatus: "step-loss" | "undersized";
  /**
   * false skips the max-speed search (maxSpeedRpm is then NaN): a sensitivity run on an axis
   * whose machine puts no value on throughput does not need it. Never false for a CaseResult.
   */
  searchMaxSpeed?: boolean;
}

export interface OperatingPoint {
  duty: DutyMix;
  speedRpm: number;
  loadTorqueNm: number;
  peakTorqueNm: number;
  ambientC: number;
  coolingCop: number | null;
}

export interface LoopOutcome<S extends string> {
  result: LoopResult<S>;
  thermal: ThermalState;
  capability: Capability;
  /** Margin negative, or no torque at speed. */
  short: boolean;
}

/** Thermal state, losses, power, energy and torque margin of one loop (ENGINE.md §5–§7). */
export function evaluateLoop<S extends LoopSpec["shortStatus"]>(
  spec: LoopSpec & { shortStatus: S },
  op: OperatingPoint,
): LoopOutcome<"ok" | "at-risk" | S> {
  const { motor, currents } = spec;
  const { duty, speedRpm } = op;
  const cf = currents.copperFactor;
  const moveA2 = currents.moveA * currents.moveA;
  const holdA2 = currents.holdA * currents.holdA;
  const ironW = ironLossW(motor, speedRpm);

  const thermal = windingTemperature(motor, op.ambientC, {
    copperAt20W: motor.phaseResistanceOhm * cf * (duty.move * moveA2 + duty.hold * holdA2),
    ironW: duty.move * ironW,
  });
  const r = thermal.resistanceHotOhm;
  const copperMoveW = cf * moveA2 * r;
  const copperHoldW = cf * holdA2 * r;
  const mechanicalW = op.loadTorqueNm * ((2 * Math.PI * speedRpm) / 60);

  // §6: P_in = P_motor/η + standby in each state; the drive loss P_in − P_motor heats the cabinet.
  const motorMoveW = mechanicalW + ironW + copperMoveW;
  const eta = spec.drive.efficiencyPct / 100;
  const fixedW = spec.drive.fixedW;
  const inputPowerW = {
    move: motorMoveW / eta + fixedW,
    hold: copperHoldW / eta + fixedW,
    off: fixedW,
  };
  const off = 1 - duty.move - duty.hold;
  const averageInputW =
    duty.move * inputPowerW.move + duty.hold * inputPowerW.hold + off * inputPowerW.off;
  const cabinetHeatW =
    duty.move * (inputPowerW.move - motorMoveW) +
    duty.hold * (inputPowerW.hold - copperHoldW) +
    off * inputPowerW.off;

  const capability: Capability = {
    model: torqueModel(motor, {
      vectorFactor: currents.vectorFactor,
      currentLimitA: currents.limitA,
      resistanceOhm: r,
      busVoltageV: spec.busVoltageV,
    }),
    curve: spec.curve,
  };
  const torqueNm = capabilityNm(capability, speedRpm);
  const margin = marginPct(op.peakTorqueNm, torqueNm);
  const byMargin = marginStatus(margin, spec.requiredPct);

  return {
    result: {
      currentMoveA: currents.moveA,
      currentHoldA: currents.holdA,
      resistanceHotOhm: r,
      windingTempC: thermal.windingTempC,
      copperLossMoveW: copperMoveW,
      copperLossHoldW: copperHoldW,
      ironLossW: ironW,
      inputPowerW,
      energyKWhPerYear: kWhPerYear(averageInputW, duty),
      cabinetHeatW,
      coolingKWhPerYear: coolingKWhPerYear(cabinetHeatW, duty, op.coolingCop),
      torqueAtSpeedNm: torqueNm,
      marginPct: margin,
      status: byMargin === "short" ? spec.shortStatus : byMargin,
      usableTorqueNm: usableTorqueNm(torqueNm, spec.requiredPct),
      maxSpeedRpm:
        spec.searchMaxSpeed === false
          ? NaN
          : maxSpeedRpm(capability, spec.requiredPct, op.peakTorqueNm),
    },
    thermal,
    capability,
    short: byMargin === "short",
  };
}
