import { closedLoopCurrents, kitEncoderW, kitMotor, openLoopCurrents } from "./currents";
import { monotoneCurve, isBeyondCurve } from "./curves";
import { averageOverDuty, coolingKWhPerYear, kWhPerYear, type DutyMix } from "./energy";
import type { AxisEconomics } from "./fleet";
import { evaluateLoop, type LoopOutcome, type OperatingPoint } from "./loop";
import { headroomForGain, loadAngle, speedHeadroomPct, type OpenLoopStatus } from "./margin";
import { stepGeometry } from "./motor";
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
};

/** Factors applied to the axis inputs, for the sensitivity runs (ENGINE.md §8). */
export interface PhysicsScale {
  loadTorque: number;
}

const NO_SCALE: PhysicsScale = { loadTorque: 1 };

/** Relative tolerance so that a setting exactly at the rating (e.g. √2·I_rms) is not flagged. */
const RATING_TOLERANCE = 1e-9;

export function operatingPoint(
  axis: ParsedAxis,
  coolingCop: number | null,
  scale: PhysicsScale = NO_SCALE,
): OperatingPoint {
  const duty: DutyMix = {
    hoursPerYear: axis.duty.hoursPerYear,
    move: axis.duty.movePct / 100,
    hold: axis.duty.holdPct / 100,
  };
  return {
    duty,
    speedRpm: axis.duty.speedRpm,
    loadTorqueNm: axis.duty.loadTorqueNm * scale.loadTorque,
    peakTorqueNm: axis.duty.peakTorqueNm,
    ambientC: axis.duty.ambientC,
    coolingCop,
  };
}

export function evaluateOpenLoop(axis: ParsedAxis, op: OperatingPoint, requiredPct: number) {
  const currents = openLoopCurrents(axis);
  const outcome: LoopOutcome<OpenLoopStatus> = evaluateLoop(
    {
      motor: axis.motor,
      currents,
      busVoltageV: axis.drive.busVoltageV,
      drive: { efficiencyPct: axis.drive.efficiencyPct, fixedW: axis.drive.standbyW },
      curve: axis.motor.pullOutCurve ? monotoneCurve(axis.motor.pullOutCurve) : undefined,
      requiredPct,
      shortStatus: "step-loss",
    },
    op,
  );
  return {
    result: outcome.result,
    thermal: outcome.thermal,
    capability: outcome.capability,
    short: outcome.short,
    currents,
  };
}

export function evaluateClosedLoop(
  axis: ParsedAxis,
  op: OperatingPoint,
  requiredPct: number,
  searchMaxSpeed = true,
) {
  const kit = axis.retrofit.kit;
  const currents = closedLoopCurrents(axis, op.loadTorqueNm);
  const outcome = evaluateLoop(
    {
      motor: kitMotor(axis),
      currents,
      busVoltageV: kit.busVoltageV ?? axis.drive.busVoltageV,
      drive: { efficiencyPct: kit.efficiencyPct, fixedW: kit.standbyW + kitEncoderW(kit) },
      requiredPct,
      shortStatus: "undersized",
      searchMaxSpeed,
    },
    op,
  );
  // §7: a moving or holding demand above I_max makes the kit undersized whatever the margin.
  if (currents.demandAboveLimit) outcome.result.status = "undersized";
  return { outcome, undersized: outcome.result.status === "undersized" };
}

/** The physics of ENGINE.md §3–§7 for one unit of one axis. */
export function evaluateAxisPhysics(
  axis: ParsedAxis,
  ctx: AxisContext,
  scale: PhysicsScale = NO_SCALE,
): AxisPhysics {
  const op = operatingPoint(axis, ctx.coolingCop, scale);
  const { margins } = ctx;
  const open = evaluateOpenLoop(axis, op, margins.openLoopRequiredPct);
  const closed = evaluateClosedLoop(axis, op, margins.closedLoopRequiredPct);
  const ol = open.result;
  const cl = closed.outcome.result;

  const angle = loadAngle(op.loadTorqueNm, ol.torqueAtSpeedNm, axis.motor.rotorTeeth);

  const energySaved = ol.energyKWhPerYear - cl.energyKWhPerYear;
  const energyPct = ol.energyKWhPerYear > 0 ? (100 * energySaved) / ol.energyKWhPerYear : null;
  const band: Band =
    energyPct === null || energyPct < ctx.band.lowPct
      ? "below"
      : energyPct > ctx.band.highPct
        ? "above"
        : "within";
  const torqueFreedNm = cl.usableTorqueNm - ol.usableTorqueNm;
  const tempDropK =
    ol.windingTempC === null || cl.windingTempC === null ? null : ol.windingTempC - cl.windingTempC;

  // Today's setting against the rating, both as I²·R20 dissipation (ENGINE.md §9).
  const setting = open.currents;
  const aboveRating =
    setting.copperFactor * setting.moveA ** 2 >
    2 * axis.motor.ratedCurrentA ** 2 * (1 + RATING_TOLERANCE);
  const curve = axis.motor.pullOutCurve;

  // Added in place: copying the loop result with a spread cost more than the physics.
  const openLoopResult = ol as OpenLoopResult;
  openLoopResult.loadAngleElecDeg = angle.elecDeg;
  openLoopResult.loadAngleMechDeg = angle.mechDeg;

  return {
    id: axis.id,
    machineId: axis.machineId,
    quantity: axis.quantity,
    warnings: warningSet([
      open.thermal.runaway,
      closed.outcome.thermal.runaway,
      open.thermal.overClass,
      closed.outcome.thermal.overClass,
      curve !== undefined && isBeyondCurve(curve, op.speedRpm),
      closed.undersized,
      band !== "within",
      aboveRating,
      axis.duty.holdTorqueNm > 0,
    ]),
    geometry: stepGeometry(axis.motor.rotorTeeth, axis.drive.stepMode, axis.drive.microsteps),
    openLoop: openLoopResult,
    closedLoop: cl,
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
      torqueFreedPct: ol.usableTorqueNm === 0 ? null : (100 * torqueFreedNm) / ol.usableTorqueNm,
      speedHeadroomPct: speedHeadroomPct(cl.maxSpeedRpm, op.speedRpm),
      stepLossEventsAvoided: closed.undersized
        ? 0
        : (axis.reliability.stepLossEventsPerYear * axis.reliability.avoidedPct) / 100,
    },
    undersized: closed.undersized,
  };
}

export function economicsOf(physics: AxisPhysics): AxisEconomics {
  return {
    energyOpenLoopKWh: physics.openLoop.energyKWhPerYear,
    energyClosedLoopKWh: physics.closedLoop.energyKWhPerYear,
    coolingOpenLoopKWh: physics.openLoop.coolingKWhPerYear,
    coolingClosedLoopKWh: physics.closedLoop.coolingKWhPerYear,
    undersized: physics.undersized,
    speedHeadroomPct: physics.savings.speedHeadroomPct,
  };
}

/**
 * The economics of one axis with its load torque scaled, for the sensitivity of §8. Open loop,
 * currents, temperature and torque do not depend on the load (§4); only the mechanical power
 * does, and input power and drive loss are linear in it, so the open loop is shifted by the
 * extra power and only the closed loop is solved again.
 */
export function economicsAtLoad(
  axis: ParsedAxis,
  base: AxisPhysics,
  ctx: AxisContext,
  loadFactor: number,
  valuedGainPct: number | undefined,
): AxisEconomics {
  const op = operatingPoint(axis, ctx.coolingCop, { loadTorque: loadFactor });
  const requiredPct = ctx.margins.closedLoopRequiredPct;
  const { outcome } = evaluateClosedLoop(axis, op, requiredPct, false);
  const closed = outcome.result;

  const eta = axis.drive.efficiencyPct / 100;
  const extraMechanicalW =
    (op.loadTorqueNm - axis.duty.loadTorqueNm) * ((2 * Math.PI * op.speedRpm) / 60);
  const extraInputW = averageOverDuty({ move: extraMechanicalW / eta, hold: 0, off: 0 }, op.duty);
  const extraDriveLossW = averageOverDuty(
    { move: extraMechanicalW / eta - extraMechanicalW, hold: 0, off: 0 },
    op.duty,
  );

  return {
    energyOpenLoopKWh: base.openLoop.energyKWhPerYear + kWhPerYear(extraInputW, op.duty),
    energyClosedLoopKWh: closed.energyKWhPerYear,
    coolingOpenLoopKWh:
      base.openLoop.coolingKWhPerYear + coolingKWhPerYear(extraDriveLossW, op.duty, ctx.coolingCop),
    coolingClosedLoopKWh: closed.coolingKWhPerYear,
    undersized: closed.status === "undersized",
    // The headroom only feeds the throughput cap; without a value on throughput it cannot matter.
    speedHeadroomPct:
      valuedGainPct === undefined
        ? null
        : headroomForGain(outcome.capability, requiredPct, op, valuedGainPct),
  };
}
