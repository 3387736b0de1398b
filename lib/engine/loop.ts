import {
  capabilityNm,
  maxSpeedRpm,
  torqueModel,
  usableTorqueNm,
  voltageDisc,
  type Capability,
  type VoltageDisc,
} from "./capability";
import type { AxisDuty } from "./duty";
import type { DriveLosses } from "./energy";
import { marginPct, marginStatus } from "./margin";
import { ironLossW } from "./motor";
import type { ParsedMotor } from "./schema";
import { windingTemperature, type ThermalState } from "./thermal";
import type { LoopResult } from "./types";

/** One loop — today's open-loop drive or the proposed kit — on one axis. */
export interface LoopSpec {
  motor: ParsedMotor;
  busVoltageV: number;
  /** I_lim of the torque model: vf_run·I_set open loop, I_max closed loop. */
  currentLimitA: number;
  /** Copper loss per I²·R of the reported current (step-mode table; 1 closed loop). */
  copperFactor: number;
  /** Pass 1 (voltage ignored): moving and holding currents. */
  moveA: number;
  holdA: number;
  /** Pass 2: the moving current at the operating point, given the voltage disc at R₁. */
  movingAtSpeed: (disc: VoltageDisc) => number;
  drive: DriveLosses;
  /** What bounds or shapes the capability besides the model (curve, resonance, floor). */
  shape: Omit<Capability, "model">;
  requiredPct: number;
  /** How this loop names a negative margin: "step-loss" open loop, "undersized" closed loop. */
  shortStatus: "step-loss" | "undersized";
  /**
   * false skips the max-speed search (maxSpeedRpm is then NaN): a sensitivity run on an axis
   * whose machine puts no value on throughput does not need it. Never false for a CaseResult.
   */
  searchMaxSpeed?: boolean;
}

export interface LoopOutcome<S extends string> {
  result: LoopResult<S>;
  thermal: ThermalState;
  capability: Capability;
  /** Margin negative, or no torque at speed. */
  short: boolean;
}

function thermalOf(
  spec: LoopSpec,
  duty: AxisDuty,
  moveA: number,
  holdA: number,
  ironW: number,
): ThermalState {
  const { motor } = spec;
  return windingTemperature(motor, duty.ambientC, {
    copperAt20W:
      motor.phaseResistanceOhm *
      spec.copperFactor *
      (duty.move * moveA * moveA + duty.hold * holdA * holdA),
    ironW: duty.move * ironW,
  });
}

/** The currents, temperature, losses and energy of one loop: what the business case needs. */
export interface LoopEnergy {
  moveA: number;
  thermal: ThermalState;
  copperMoveW: number;
  copperHoldW: number;
  ironW: number;
  inputPowerW: { move: number; hold: number; off: number };
  energyKWhPerYear: number;
  cabinetHeatW: number;
  coolingKWhPerYear: number;
}

/**
 * Thermal state, losses, power and energy of one loop (docs/model.md (Currents at the operating point)–§6), in the two passes
 * of §4: the pass-1 temperature sets the resistance at which the moving current is put at the
 * operating point, and the temperature is solved again with that current. The sensitivity runs
 * stop here; evaluateLoop adds the torque margin and the result.
 */
export function loopEnergy(spec: LoopSpec, duty: AxisDuty, coolingCop: number | null): LoopEnergy {
  const { motor } = spec;
  const ironW = ironLossW(motor, duty.speedRpm);
  const pass1 = thermalOf(spec, duty, spec.moveA, spec.holdA, ironW);
  const moveA = spec.movingAtSpeed(
    voltageDisc(modelOf(spec, pass1.resistanceHotOhm), duty.speedRpm),
  );
  const thermal = thermalOf(spec, duty, moveA, spec.holdA, ironW);

  const r = thermal.resistanceHotOhm;
  const cf = spec.copperFactor;
  const copperMoveW = cf * moveA * moveA * r;
  const copperHoldW = cf * spec.holdA * spec.holdA * r;

  // §6: P_in = P_motor/η + standby in each state; the drive loss P_in − P_motor heats the cabinet.
  const motorMoveW = duty.mechanicalW + ironW + copperMoveW;
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
  const hours = duty.hoursPerYear;
  return {
    moveA,
    thermal,
    copperMoveW,
    copperHoldW,
    ironW,
    inputPowerW,
    energyKWhPerYear: (hours * averageInputW) / 1000,
    cabinetHeatW,
    coolingKWhPerYear: coolingCop === null ? 0 : (hours * cabinetHeatW) / 1000 / coolingCop,
  };
}

const modelOf = (spec: LoopSpec, resistanceOhm: number) =>
  torqueModel(spec.motor, {
    currentLimitA: spec.currentLimitA,
    resistanceOhm,
    busVoltageV: spec.busVoltageV,
  });

/** The loop's capability at its hot resistance (same four keys always: monomorphic reads). */
export const capabilityOf = (spec: LoopSpec, resistanceOhm: number): Capability => ({
  model: modelOf(spec, resistanceOhm),
  curve: spec.shape.curve,
  resonance: spec.shape.resonance,
  floor: spec.shape.floor,
});

/** Energy (loopEnergy) plus the torque margin and max speed of §7, as a LoopResult. */
export function evaluateLoop<S extends LoopSpec["shortStatus"]>(
  spec: LoopSpec & { shortStatus: S },
  duty: AxisDuty,
  coolingCop: number | null,
): LoopOutcome<"ok" | "at-risk" | S> {
  const { speedRpm } = duty;
  const energy = loopEnergy(spec, duty, coolingCop);
  const { thermal, moveA, copperMoveW, copperHoldW, ironW, inputPowerW, cabinetHeatW } = energy;
  const r = thermal.resistanceHotOhm;
  const capability = capabilityOf(spec, r);
  const torqueNm = capabilityNm(capability, speedRpm);
  const margin = marginPct(duty.peakTorqueNm, torqueNm);
  const byMargin = marginStatus(margin, spec.requiredPct);

  return {
    result: {
      currentMoveA: moveA,
      currentHoldA: spec.holdA,
      resistanceHotOhm: r,
      windingTempC: thermal.windingTempC,
      copperLossMoveW: copperMoveW,
      copperLossHoldW: copperHoldW,
      ironLossW: ironW,
      inputPowerW,
      energyKWhPerYear: energy.energyKWhPerYear,
      cabinetHeatW,
      coolingKWhPerYear: energy.coolingKWhPerYear,
      torqueAtSpeedNm: torqueNm,
      marginPct: margin,
      status: byMargin === "short" ? spec.shortStatus : byMargin,
      usableTorqueNm: usableTorqueNm(torqueNm, spec.requiredPct),
      maxSpeedRpm:
        spec.searchMaxSpeed === false
          ? NaN
          : maxSpeedRpm(capability, spec.requiredPct, duty.peakTorqueNm),
    },
    thermal,
    capability,
    short: byMargin === "short",
  };
}
