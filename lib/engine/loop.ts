import {
  capabilityNm,
  maxSpeedRpm,
  motorVoltageDisc,
  torqueModel,
  usableTorqueNm,
  type Capability,
} from "./capability";
import { fieldWeakeningMagnitudeA, openLoopMovingMagnitudeA } from "./currents";
import type { AxisDuty } from "./duty";
import { marginPct, marginStatus } from "./margin";
import { ironLossW } from "./motor";
import type { ParsedMotor } from "./schema";
import {
  hotResistanceOhm,
  steadyWindingTempC,
  windingTemperature,
  type ThermalState,
} from "./thermal";
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
  /**
   * Pass 2, how the moving current meets the voltage disc at R₁: "chopper" (today's drive keeps
   * the share of I_lim it still reaches), "field-weakening" (the kit adds i_d to reach I_q), or
   * "at-limit" (a sensorless kit below its minimum speed, at I_max). Data rather than a closure,
   * so that a spec built per axis and sensitivity run allocates nothing more.
   */
  moving: "chopper" | "field-weakening" | "at-limit";
  /** The torque current the load asks of today's drive, A (the chopper rule reads it). */
  torqueCurrentA: number;
  /** Drive efficiency, %, and the power it draws in every state (standby, encoder), W. */
  efficiencyPct: number;
  fixedW: number;
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
  /** See LoopEnergy.voltageShort. */
  voltageShort: boolean;
}

/** A: the copper loss at 20 °C averaged over the running hours, W. */
const copperAt20W = (spec: LoopSpec, duty: AxisDuty, moveA: number): number =>
  spec.motor.phaseResistanceOhm *
  spec.copperFactor *
  (duty.move * moveA * moveA + duty.hold * spec.holdA * spec.holdA);

/** Pass 2: the moving current at the operating point, and whether the kit runs short of voltage. */
function movingAtSpeed(spec: LoopSpec, duty: AxisDuty, resistanceOhm: number) {
  const limitA = spec.currentLimitA;
  if (spec.moving === "at-limit") return { moveA: limitA, voltageShort: false };
  const disc = motorVoltageDisc(spec.motor, resistanceOhm, spec.busVoltageV, duty.speedRpm);
  if (spec.moving === "chopper") {
    // The chopper's setting, scaled by the share of I_lim it still reaches at speed.
    const moveA =
      limitA === 0
        ? 0
        : (spec.moveA * openLoopMovingMagnitudeA(limitA, spec.torqueCurrentA, disc)) / limitA;
    return { moveA, voltageShort: false };
  }
  const magnitude = fieldWeakeningMagnitudeA(spec.moveA, disc);
  if (Number.isNaN(magnitude)) return { moveA: Math.min(spec.moveA, limitA), voltageShort: true };
  return magnitude > limitA
    ? { moveA: limitA, voltageShort: true }
    : { moveA: magnitude, voltageShort: false };
}

/** The currents, temperature, losses and energy of one loop: what the business case needs. */
export interface LoopEnergy {
  moveA: number;
  /** Closed loop: no current within I_max reaches the torque current at speed (undersized). */
  voltageShort: boolean;
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
 * Thermal state, losses, power and energy of one loop (docs/model.md (Currents at the operating point to Energy and cooling)), in the two passes
 * of docs/model.md (Currents at the operating point): the pass-1 temperature sets the resistance at which the moving current is put at the
 * operating point, and the temperature is solved again with that current. The sensitivity runs
 * stop here; evaluateLoop adds the torque margin and the result.
 */
export function loopEnergy(spec: LoopSpec, duty: AxisDuty, coolingCop: number | null): LoopEnergy {
  const { motor } = spec;
  const ironW = ironLossW(motor, duty.speedRpm);
  const ironAveragedW = duty.move * ironW;
  const pass1C = steadyWindingTempC(
    motor,
    duty.ambientC,
    copperAt20W(spec, duty, spec.moveA),
    ironAveragedW,
  );
  const { moveA, voltageShort } = movingAtSpeed(spec, duty, hotResistanceOhm(motor, pass1C));
  const thermal = windingTemperature(motor, duty.ambientC, {
    copperAt20W: copperAt20W(spec, duty, moveA),
    ironW: ironAveragedW,
  });

  const r = thermal.resistanceHotOhm;
  const cf = spec.copperFactor;
  const copperMoveW = cf * moveA * moveA * r;
  const copperHoldW = cf * spec.holdA * spec.holdA * r;

  // docs/model.md (Energy and cooling): P_in = P_motor/η + standby in each state; the drive loss P_in − P_motor heats the cabinet.
  const motorMoveW = duty.mechanicalW + ironW + copperMoveW;
  const eta = spec.efficiencyPct / 100;
  const fixedW = spec.fixedW;
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
    voltageShort,
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

/** Energy (loopEnergy) plus the torque margin and max speed of docs/model.md (Torque margin and speed), as a LoopResult. */
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
    voltageShort: energy.voltageShort,
  };
}
