import { capabilityNm } from "./capability";
import {
  closedLoopDemand,
  holdingCapabilityNm,
  kitEncoderW,
  kitMaxCurrentA,
  kitMotor,
  openLoopSettingA,
} from "./currents";
import { isBeyondCurve, monotoneCurve } from "./curves";
import { axisDuty, type AxisDuty } from "./duty";
import { finiteOrNull } from "./finite";
import type { AxisEconomics } from "./fleet";
import { capabilityOf, evaluateLoop, loopEnergy, type LoopOutcome, type LoopSpec } from "./loop";
import {
  headroomForGain,
  loadAngle,
  marginPct,
  marginStatus,
  speedHeadroomPct,
  type OpenLoopStatus,
} from "./margin";
import { copperFactor, dragTorqueNm, runVectorFactor, stepGeometry, torqueConstant } from "./motor";
import type { ParsedAxis, ParsedCase, ParsedMargins } from "./schema";
import { insulationLifeFactor } from "./thermal";
import type { AxisResult, Band, OpenLoopResult } from "./types";
import { warningSet } from "./warnings";

/** The case-wide settings the physics of one axis depends on. */
export interface AxisContext {
  margins: ParsedMargins;
  band: ParsedCase["band"];
  coolingCop: number | null;
  lifeHalvingK: number;
}

/** Everything per unit of one axis that does not involve money. */
export type AxisPhysics = Omit<AxisResult, "capex" | "totals"> & {
  undersized: boolean;
  /** Not undersized, and not a sensorless kit below its minimum speed (docs/model.md (The business case)). */
  avoidsEvents: boolean;
  /** Share of running hours at standstill, energized. */
  holdShare: number;
  /** The duty the physics used (typed, or derived from the motion). */
  duty: AxisDuty;
};

/** Factors applied to the axis inputs, for the sensitivity runs (docs/model.md (The business case)). */
export interface PhysicsScale {
  loadTorque: number;
  idleCurrent: number;
}

/** Relative tolerance so that a setting exactly at the rating (e.g. √2·I_rms) is not flagged. */
const RATING_TOLERANCE = 1e-9;

/** The idle current as a share of the setting, %, scaled and capped at 100 (the idle-current driver). */
const idlePctAt = (axis: ParsedAxis, factor: number): number =>
  factor === 1 ? axis.drive.idleCurrentPct : Math.min(100, axis.drive.idleCurrentPct * factor);

/** A capability with nothing besides the model: shared, as it never changes. */
const MODEL_ONLY: LoopSpec["shape"] = Object.freeze({});

/** Today's open-loop drive on the axis, as a loop to evaluate (docs/model.md (Torque at speed), docs/model.md (Currents at the operating point)). */
function openLoopSpec(
  axis: ParsedAxis,
  duty: AxisDuty,
  requiredPct: number,
  searchMaxSpeed: boolean,
  idleCurrentPct = axis.drive.idleCurrentPct,
): LoopSpec & { shortStatus: "step-loss" } {
  const { motor, drive } = axis;
  const setting = openLoopSettingA(drive);
  const curve = motor.pullOutCurve ? monotoneCurve(motor.pullOutCurve) : undefined;
  return {
    motor,
    busVoltageV: drive.busVoltageV,
    currentLimitA: runVectorFactor(drive.stepMode) * setting,
    copperFactor: copperFactor(drive.stepMode),
    moveA: setting,
    holdA: (setting * idleCurrentPct) / 100,
    moving: "chopper",
    torqueCurrentA:
      (duty.loadTorqueNm + dragTorqueNm(motor, duty.speedRpm)) / torqueConstant(motor),
    efficiencyPct: drive.efficiencyPct,
    fixedW: drive.standbyW,
    // A measured curve already holds whatever resonance the axis has; the dip shapes the model.
    shape: curve
      ? { curve }
      : drive.resonance
        ? {
            resonance: {
              fromRpm: drive.resonance.fromRpm,
              toRpm: drive.resonance.toRpm,
              derate: drive.resonance.deratePct / 100,
            },
          }
        : MODEL_ONLY,
    requiredPct,
    shortStatus: "step-loss",
    searchMaxSpeed,
  };
}

export function evaluateOpenLoop(
  axis: ParsedAxis,
  duty: AxisDuty,
  requiredPct: number,
  coolingCop: number | null,
  searchMaxSpeed = true,
) {
  const spec = openLoopSpec(axis, duty, requiredPct, searchMaxSpeed);
  const outcome: LoopOutcome<OpenLoopStatus> = evaluateLoop(spec, duty, coolingCop);
  return outcome;
}

/** The proposed kit on the axis, as a loop to evaluate, with what decides "undersized". */
function closedLoopSpec(
  axis: ParsedAxis,
  duty: AxisDuty,
  margins: ParsedMargins,
  searchMaxSpeed: boolean,
  idleCurrentPct = axis.drive.idleCurrentPct,
) {
  const kit = axis.retrofit.kit;
  const motor = kitMotor(axis);
  const demand = closedLoopDemand(axis, duty, idleCurrentPct);
  const maxA = kitMaxCurrentA(kit, motor);
  const busVoltageV = kit.busVoltageV ?? axis.drive.busVoltageV;

  // The motor and bus of today with a measured curve: what it did open loop at today's current
  // it does closed loop too, scaled by the kit's current against today's.
  const keepsMotorAndBus = kit.motor === undefined && busVoltageV === axis.drive.busVoltageV;
  const curve = axis.motor.pullOutCurve;
  const todayLimitA = runVectorFactor(axis.drive.stepMode) * openLoopSettingA(axis.drive);
  const floor =
    keepsMotorAndBus && curve
      ? {
          curve: monotoneCurve(curve),
          scale: todayLimitA > 0 ? Math.min(1, maxA / todayLimitA) : 1,
        }
      : undefined;

  const spec: LoopSpec & { shortStatus: "undersized" } = {
    motor,
    busVoltageV,
    currentLimitA: maxA,
    copperFactor: 1,
    moveA: demand.moveA,
    holdA: demand.holdA,
    moving: demand.lowSpeedSensorless ? "at-limit" : "field-weakening",
    torqueCurrentA: demand.moveA,
    efficiencyPct: kit.efficiencyPct,
    fixedW: kit.standbyW + kitEncoderW(kit),
    shape: floor ? { floor } : MODEL_ONLY,
    // Below its minimum speed a sensorless kit is open loop in effect, and needs its margin.
    requiredPct: demand.lowSpeedSensorless
      ? margins.openLoopRequiredPct
      : margins.closedLoopRequiredPct,
    shortStatus: "undersized",
    searchMaxSpeed,
  };
  return { spec, demand };
}

export function evaluateClosedLoop(
  axis: ParsedAxis,
  duty: AxisDuty,
  margins: ParsedMargins,
  coolingCop: number | null,
  searchMaxSpeed = true,
) {
  const { spec, demand } = closedLoopSpec(axis, duty, margins, searchMaxSpeed);
  const outcome = evaluateLoop(spec, duty, coolingCop);
  // A moving or holding demand above I_max, or a torque current the bus cannot drive at speed,
  // makes the kit undersized whatever the margin.
  if (demand.demandAboveLimit || outcome.voltageShort) outcome.result.status = "undersized";
  return {
    outcome,
    undersized: outcome.result.status === "undersized",
    lowSpeedSensorless: demand.lowSpeedSensorless,
  };
}

/** The physics of docs/model.md (Torque at speed to Torque margin and speed) for one unit of one axis. */
export function evaluateAxisPhysics(
  axis: ParsedAxis,
  ctx: AxisContext,
  searchMaxSpeed = true,
): AxisPhysics {
  const duty = axisDuty(axis);
  const { margins, coolingCop } = ctx;
  const open = evaluateOpenLoop(
    axis,
    duty,
    margins.openLoopRequiredPct,
    coolingCop,
    searchMaxSpeed,
  );
  const closed = evaluateClosedLoop(axis, duty, margins, coolingCop, searchMaxSpeed);
  const ol = open.result;
  const cl = closed.outcome.result;

  const angle = loadAngle(duty.loadTorqueNm, ol.torqueAtSpeedNm, axis.motor.rotorTeeth);
  const holdingNm = holdingCapabilityNm(axis);

  const energySaved = ol.energyKWhPerYear - cl.energyKWhPerYear;
  // finiteOrNull: an energy of 10^-300 kWh is none (finite.ts).
  const energyPct =
    ol.energyKWhPerYear > 0 ? finiteOrNull((100 * energySaved) / ol.energyKWhPerYear) : null;
  const band: Band =
    energyPct === null || energyPct < ctx.band.lowPct
      ? "below"
      : energyPct > ctx.band.highPct
        ? "above"
        : "within";
  const torqueFreedNm = cl.usableTorqueNm - ol.usableTorqueNm;
  const tempDropK =
    ol.windingTempC === null || cl.windingTempC === null ? null : ol.windingTempC - cl.windingTempC;

  // Today's setting against the rating, both as I²·R20 dissipation at 20 °C.
  const setting = openLoopSettingA(axis.drive);
  const aboveRating =
    copperFactor(axis.drive.stepMode) * setting * setting >
    2 * axis.motor.ratedCurrentA ** 2 * (1 + RATING_TOLERANCE);
  const curve = axis.motor.pullOutCurve;
  const sensorless = axis.retrofit.kit.sensing === "sensorless";
  const motion = duty.motion;
  const motionSpec = axis.duty.motion;
  const avoidsEvents = !closed.undersized && !closed.lowSpeedSensorless;

  // One literal with every key: adding keys to the loop result afterwards changed its hidden
  // class on every axis, and a spread copy cost more than the physics.
  const openLoopResult: OpenLoopResult = {
    currentMoveA: ol.currentMoveA,
    currentHoldA: ol.currentHoldA,
    resistanceHotOhm: ol.resistanceHotOhm,
    windingTempC: ol.windingTempC,
    copperLossMoveW: ol.copperLossMoveW,
    copperLossHoldW: ol.copperLossHoldW,
    ironLossW: ol.ironLossW,
    inputPowerW: ol.inputPowerW,
    energyKWhPerYear: ol.energyKWhPerYear,
    cabinetHeatW: ol.cabinetHeatW,
    coolingKWhPerYear: ol.coolingKWhPerYear,
    torqueAtSpeedNm: ol.torqueAtSpeedNm,
    marginPct: ol.marginPct,
    status: ol.status,
    usableTorqueNm: ol.usableTorqueNm,
    maxSpeedRpm: ol.maxSpeedRpm,
    loadAngleElecDeg: angle.elecDeg,
    loadAngleMechDeg: angle.mechDeg,
    holdingCapabilityNm: holdingNm,
  };

  return {
    id: axis.id,
    machineId: axis.machineId,
    quantity: axis.quantity,
    warnings: warningSet([
      open.thermal.runaway,
      closed.outcome.thermal.runaway,
      open.thermal.overClass,
      closed.outcome.thermal.overClass,
      curve !== undefined && isBeyondCurve(curve, duty.speedRpm),
      closed.undersized,
      band !== "within",
      aboveRating,
      duty.holdTorqueNm > 0,
      duty.holdTorqueNm > 0 && duty.holdTorqueNm > holdingNm,
      closed.lowSpeedSensorless,
      sensorless && duty.holdTorqueNm > 0,
      motion !== null &&
        motion.inertiaRatio !== null &&
        motion.inertiaRatio > (motionSpec?.maxInertiaRatio ?? Infinity),
      motion !== null && motion.inertiaRatio === null,
    ]),
    geometry: stepGeometry(axis.motor.rotorTeeth, axis.drive.stepMode, axis.drive.microsteps),
    openLoop: openLoopResult,
    closedLoop: cl,
    motion,
    savings: {
      energyKWhPerYear: energySaved,
      energyPct,
      band,
      coolingKWhPerYear: ol.coolingKWhPerYear - cl.coolingKWhPerYear,
      tempDropK,
      insulationLifeFactor: insulationLifeFactor(
        ol.windingTempC,
        cl.windingTempC,
        ctx.lifeHalvingK,
      ),
      torqueFreedNm,
      torqueFreedPct:
        ol.usableTorqueNm === 0 ? null : finiteOrNull((100 * torqueFreedNm) / ol.usableTorqueNm),
      speedHeadroomPct: searchMaxSpeed ? speedHeadroomPct(cl.maxSpeedRpm, duty.speedRpm) : null,
      stepLossEventsAvoided: avoidsEvents
        ? (axis.reliability.stepLossEventsPerYear * axis.reliability.avoidedPct) / 100
        : 0,
    },
    undersized: closed.undersized,
    avoidsEvents,
    holdShare: duty.hold,
    duty,
  };
}

export function economicsOf(physics: AxisPhysics): AxisEconomics {
  return {
    energyOpenLoopKWh: physics.openLoop.energyKWhPerYear,
    energyClosedLoopKWh: physics.closedLoop.energyKWhPerYear,
    coolingOpenLoopKWh: physics.openLoop.coolingKWhPerYear,
    coolingClosedLoopKWh: physics.closedLoop.coolingKWhPerYear,
    undersized: physics.undersized,
    avoidsEvents: physics.avoidsEvents,
    speedHeadroomPct: physics.savings.speedHeadroomPct,
  };
}

/**
 * The economics of one axis with its load and/or idle current scaled, for the sensitivity of
 * docs/model.md (The business case): the same currents, temperatures and energies as evaluateAxisPhysics (the
 * same loopEnergy), without the figures only the result shows. The idle current matters only
 * through the hours at standstill, so an axis that never holds keeps its base economics, and
 * with an encoder kit only today's drive changes. The max-speed search is left out; the
 * headroom matters only to a machine that values a throughput gain.
 */
export function economicsAtScale(
  axis: ParsedAxis,
  base: AxisPhysics,
  ctx: AxisContext,
  scale: PhysicsScale,
  valuedGainPct: number | undefined,
): AxisEconomics {
  const idleOnly = scale.loadTorque === 1;
  if (idleOnly && (scale.idleCurrent === 1 || base.holdShare === 0)) return economicsOf(base);
  const idlePct = idlePctAt(axis, scale.idleCurrent);
  const duty = idleOnly ? base.duty : axisDuty(axis, scale.loadTorque);
  const { margins, coolingCop } = ctx;
  const open = loopEnergy(
    openLoopSpec(axis, duty, margins.openLoopRequiredPct, false, idlePct),
    duty,
    coolingCop,
  );
  if (idleOnly && axis.retrofit.kit.sensing === "encoder")
    return {
      ...economicsOf(base),
      energyOpenLoopKWh: open.energyKWhPerYear,
      coolingOpenLoopKWh: open.coolingKWhPerYear,
    };

  const { spec, demand } = closedLoopSpec(axis, duty, margins, false, idlePct);
  const closed = loopEnergy(spec, duty, coolingCop);
  const capability = capabilityOf(spec, closed.thermal.resistanceHotOhm);
  const short =
    marginStatus(
      marginPct(duty.peakTorqueNm, capabilityNm(capability, duty.speedRpm)),
      spec.requiredPct,
    ) === "short";
  const undersized = short || demand.demandAboveLimit || closed.voltageShort;
  return {
    energyOpenLoopKWh: open.energyKWhPerYear,
    energyClosedLoopKWh: closed.energyKWhPerYear,
    coolingOpenLoopKWh: open.coolingKWhPerYear,
    coolingClosedLoopKWh: closed.coolingKWhPerYear,
    undersized,
    avoidsEvents: !undersized && !demand.lowSpeedSensorless,
    speedHeadroomPct:
      valuedGainPct === undefined || undersized
        ? null
        : headroomForGain(capability, spec.requiredPct, duty, valuedGainPct),
  };
}
