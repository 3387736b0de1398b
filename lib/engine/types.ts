import type { ClosedLoopStatus, OpenLoopStatus } from "./margin";
import type { AxisWarning, MachineWarning } from "./warnings";

/** Output of ENGINE.md §9. Physics are JSON numbers, money decimal strings. */

export interface LoopResult<S extends string = string> {
  currentMoveA: number;
  currentHoldA: number;
  resistanceHotOhm: number;
  windingTempC: number | null;
  copperLossMoveW: number;
  copperLossHoldW: number;
  ironLossW: number;
  inputPowerW: { move: number; hold: number; off: number };
  energyKWhPerYear: number;
  cabinetHeatW: number;
  coolingKWhPerYear: number;
  torqueAtSpeedNm: number;
  marginPct: number | null;
  status: S;
  usableTorqueNm: number;
  maxSpeedRpm: number;
}

export interface OpenLoopResult extends LoopResult<OpenLoopStatus> {
  loadAngleElecDeg: number | null;
  loadAngleMechDeg: number | null;
}

export type ClosedLoopResult = LoopResult<ClosedLoopStatus>;

export type Band = "below" | "within" | "above";

export interface AxisResult {
  id: string;
  machineId: string;
  quantity: number;
  warnings: AxisWarning[];
  geometry: {
    stepAngleDeg: number;
    stepsPerRev: number;
    resolutionDeg: number;
    electricalCycleDeg: number;
  };
  openLoop: OpenLoopResult;
  closedLoop: ClosedLoopResult;
  savings: {
    energyKWhPerYear: number;
    energyPct: number | null;
    band: Band;
    coolingKWhPerYear: number;
    tempDropK: number | null;
    insulationLifeFactor: number | null;
    torqueFreedNm: number;
    torqueFreedPct: number | null;
    speedHeadroomPct: number | null;
    stepLossEventsAvoided: number;
  };
  capex: string;
  totals: { capex: string; energySavedKWhPerYear: number; coolingSavedKWhPerYear: number };
}

export interface MachineResult {
  id: string;
  throughputGainPct: number;
  throughputPerYear: string;
  warnings: MachineWarning[];
}

export interface Scenario {
  cashFlows: string[];
  npv: string;
  irr: number | null;
  paybackYears: number | null;
  discountedPaybackYears: number | null;
  roiPct: number | null;
}

export type SensitivityDriver =
  | "tariff"
  | "hoursPerYear"
  | "loadTorque"
  | "kitPrice"
  | "laborRate"
  | "stepLossEvents"
  | "discountRate";

export interface SensitivityRow {
  driver: SensitivityDriver;
  low: { npv: string; paybackYears: number | null };
  high: { npv: string; paybackYears: number | null };
}

export interface CaseResult {
  engineVersion: string;
  currency: string;
  axes: AxisResult[];
  machines: MachineResult[];
  totals: {
    capex: string;
    energyOpenLoopKWhPerYear: number;
    energyClosedLoopKWhPerYear: number;
    energySavedKWhPerYear: number;
    coolingSavedKWhPerYear: number;
    reliabilityPerYear: string;
    maintenancePerYear: string;
    throughputPerYear: string;
    co2TonnesPerYear: number;
  };
  scenarios: { physics: Scenario; bandLow: Scenario; bandHigh: Scenario };
  sensitivity: SensitivityRow[];
}
