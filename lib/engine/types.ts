import type { ClosedLoopStatus, OpenLoopStatus } from "./margin";
import type { AxisWarning, MachineWarning } from "./warnings";

/** Output of docs/model.md. Physics are JSON numbers, money decimal strings. */

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
  /** docs/model.md (Torque margin and speed): what today's drive holds at standstill, k1·vf_hold·I_set·idle. */
  holdingCapabilityNm: number;
}

/** docs/model.md (Motion from the mechanism): the duty figures derived from the mechanism and the move, as used. */
export interface MotionResult {
  speedRpm: number;
  loadTorqueNm: number;
  peakTorqueNm: number;
  holdTorqueNm: number;
  meanMechPowerW: number;
  movePct: number;
  holdPct: number;
  reflectedInertiaKgM2: number;
  inertiaRatio: number | null;
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
  motion: MotionResult | null;
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
  /** "reached" within the horizon; "beyond-horizon" when the last flow is still positive; else "never". */
  paybackStatus: PaybackStatus;
  /** Value by source for years 1..N; the seven add up to cashFlows[t] exactly (docs/model.md (The business case)). */
  bySource: Record<ValueSource, string[]>;
}

export type PaybackStatus = "reached" | "beyond-horizon" | "never";

export const VALUE_SOURCES = [
  "energy",
  "cooling",
  "reliability",
  "maintenance",
  "throughput",
  "service",
  "tax",
] as const;
export type ValueSource = (typeof VALUE_SOURCES)[number];

export type SensitivityDriver =
  | "tariff"
  | "hoursPerYear"
  | "loadTorque"
  | "kitPrice"
  | "laborRate"
  | "stepLossEvents"
  | "discountRate"
  | "throughputGain"
  | "idleCurrent";

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
  /** docs/model.md (The business case), physics scenario: where NPV crosses 0; null when it never does. */
  breakEven: { tariffPerKWh: string | null; stepLossFactor: number | null };
}
