import type { AxisResult, LoopResult, ParsedAxis, ParsedCase } from "@/lib/engine";
import { torqueSpeedCurve } from "@/lib/engine";
import type { CurvePoint } from "@/lib/engine/curves";
import { INSULATION_CLASS_LIMIT_C } from "@/lib/engine/motor";

export const CURVE_POINTS = 25;

export interface StateRow {
  loop: "open" | "closed";
  state: "move" | "hold" | "off";
  currentA: number;
  copperLossW: number;
  ironLossW: number;
  inputPowerW: number;
}

export interface LoopThermal {
  windingTempC: number | null;
  resistanceHotOhm: number;
  cabinetHeatW: number;
  classLimitC: number;
}

export interface AxisDetail {
  id: string;
  label: string;
  machineName: string;
  quantity: number;
  speedRpm: number;
  loadTorqueNm: number;
  peakTorqueNm: number;
  ambientC: number;
  curves: { open: CurvePoint[]; closed: CurvePoint[] };
  usableTorqueNm: { open: number; closed: number };
  requiredPct: { open: number; closed: number };
  states: StateRow[];
  thermal: { open: LoopThermal; closed: LoopThermal };
}

function statesOf(loop: "open" | "closed", r: LoopResult): StateRow[] {
  // docs/model.md (Energy and cooling): the iron loss is a moving loss; holding and off draw none.
  return [
    {
      loop,
      state: "move",
      currentA: r.currentMoveA,
      copperLossW: r.copperLossMoveW,
      ironLossW: r.ironLossW,
      inputPowerW: r.inputPowerW.move,
    },
    {
      loop,
      state: "hold",
      currentA: r.currentHoldA,
      copperLossW: r.copperLossHoldW,
      ironLossW: 0,
      inputPowerW: r.inputPowerW.hold,
    },
    {
      loop,
      state: "off",
      currentA: 0,
      copperLossW: 0,
      ironLossW: 0,
      inputPowerW: r.inputPowerW.off,
    },
  ];
}

/** Per axis: torque–speed points of both loops (torqueSpeedCurve), and the engine's states and temperatures. */
export function axisDetail(input: ParsedCase, axis: ParsedAxis, result: AxisResult): AxisDetail {
  const machine = input.machines.find((m) => m.id === axis.machineId);
  const kitMotor = axis.retrofit.kit.motor ?? axis.motor;
  const thermal = (r: LoopResult, limit: number): LoopThermal => ({
    windingTempC: r.windingTempC,
    resistanceHotOhm: r.resistanceHotOhm,
    cabinetHeatW: r.cabinetHeatW,
    classLimitC: limit,
  });
  return {
    id: axis.id,
    label: axis.label,
    machineName: machine?.name ?? axis.machineId,
    quantity: axis.quantity,
    // With a mechanism (docs/model.md (Motion from the mechanism)) the duty figures are the engine's, not the input's.
    speedRpm: result.motion?.speedRpm ?? axis.duty.speedRpm ?? 0,
    loadTorqueNm: result.motion?.loadTorqueNm ?? axis.duty.loadTorqueNm ?? 0,
    peakTorqueNm: result.motion?.peakTorqueNm ?? axis.duty.peakTorqueNm ?? 0,
    ambientC: axis.duty.ambientC,
    curves: {
      open: torqueSpeedCurve(axis, "open", CURVE_POINTS),
      closed: torqueSpeedCurve(axis, "closed", CURVE_POINTS),
    },
    usableTorqueNm: {
      open: result.openLoop.usableTorqueNm,
      closed: result.closedLoop.usableTorqueNm,
    },
    requiredPct: {
      open: input.margins.openLoopRequiredPct,
      closed: input.margins.closedLoopRequiredPct,
    },
    states: [...statesOf("open", result.openLoop), ...statesOf("closed", result.closedLoop)],
    thermal: {
      open: thermal(result.openLoop, INSULATION_CLASS_LIMIT_C[axis.motor.insulationClass]),
      closed: thermal(result.closedLoop, INSULATION_CLASS_LIMIT_C[kitMotor.insulationClass]),
    },
  };
}
