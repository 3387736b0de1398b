import type { Axis } from "@/db/schema";

type Row = Axis & { machineName: string };

// The columns the axes table can show; `sort` names the server-side sort key where there is one.
export const AXIS_COLUMNS: {
  key: string;
  label: string;
  sort?: string;
  numeric?: boolean;
  value: (r: Row) => string;
}[] = [
  { key: "machine", label: "Machine", sort: "machine", value: (r) => r.machineName },
  {
    key: "quantity",
    label: "Qty",
    sort: "quantity",
    numeric: true,
    value: (r) => String(r.quantity),
  },
  {
    key: "holdingTorque",
    label: "Holding torque [N·m]",
    sort: "holdingTorqueNm",
    numeric: true,
    value: (r) => r.holdingTorqueNm.toFixed(2),
  },
  {
    key: "ratedCurrent",
    label: "Rated current [A]",
    numeric: true,
    value: (r) => r.ratedCurrentA.toFixed(2),
  },
  {
    key: "currentSetting",
    label: "Setting [A]",
    sort: "currentSettingA",
    numeric: true,
    value: (r) => `${r.currentSettingA.toFixed(2)} ${r.currentConvention}`,
  },
  {
    key: "stepMode",
    label: "Step mode",
    value: (r) => (r.stepMode === "micro" ? `1/${r.microsteps}` : r.stepMode),
  },
  { key: "busVoltage", label: "Bus [V]", numeric: true, value: (r) => String(r.busVoltageV) },
  {
    key: "speed",
    label: "Speed [rpm]",
    sort: "speedRpm",
    numeric: true,
    value: (r) => String(r.speedRpm),
  },
  {
    key: "loadTorque",
    label: "Load [N·m]",
    sort: "loadTorqueNm",
    numeric: true,
    value: (r) => r.loadTorqueNm.toFixed(3),
  },
  {
    key: "peakTorque",
    label: "Peak [N·m]",
    numeric: true,
    value: (r) => r.peakTorqueNm.toFixed(3),
  },
  {
    key: "holdTorque",
    label: "Standstill load [N·m]",
    numeric: true,
    value: (r) => (r.holdTorqueNm ? r.holdTorqueNm.toFixed(3) : "—"),
  },
  {
    key: "duty",
    label: "Move / hold [%]",
    numeric: true,
    value: (r) => `${r.movePct} / ${r.holdPct}`,
  },
  { key: "hours", label: "Hours / year", numeric: true, value: (r) => String(r.hoursPerYear) },
  {
    key: "resistance",
    label: "R20 [Ω]",
    numeric: true,
    value: (r) => String(r.phaseResistanceOhm),
  },
  { key: "inductance", label: "L [mH]", numeric: true, value: (r) => String(r.phaseInductanceMh) },
  { key: "insulation", label: "Class", value: (r) => r.insulationClass },
  {
    key: "stepLoss",
    label: "Lost steps / year",
    numeric: true,
    value: (r) => String(r.stepLossEventsPerYear),
  },
];

export const DEFAULT_AXIS_COLUMNS = [
  "machine",
  "quantity",
  "holdingTorque",
  "currentSetting",
  "stepMode",
  "speed",
  "loadTorque",
  "peakTorque",
  "duty",
];
