import type { Axis } from "@/db/schema";
import { AXIS_FIELDS, labelWithUnit, type AxisFieldKey, type AxisFieldSpec } from "@/lib/fields";

type Row = Axis & { machineName: string };

export interface AxisTableColumn {
  key: string;
  label: string;
  /** The registry fields (lib/fields/axis.ts) the column shows. */
  fields: AxisFieldKey[];
  /** The server-side sort key, where there is one. */
  sort?: string;
  numeric?: boolean;
  value: (r: Row) => string;
}

const A = AXIS_FIELDS;
const header = (key: AxisFieldKey) => labelWithUnit(A[key]);

// Columns that show a field in their own way (several fields in one cell, fixed decimals).
const SHAPED: AxisTableColumn[] = [
  {
    key: "quantity",
    label: A.quantity.label,
    fields: ["quantity"],
    sort: "quantity",
    numeric: true,
    value: (r) => String(r.quantity),
  },
  {
    key: "holdingTorque",
    label: header("holdingTorqueNm"),
    fields: ["holdingTorqueNm"],
    sort: "holdingTorqueNm",
    numeric: true,
    value: (r) => r.holdingTorqueNm.toFixed(2),
  },
  {
    key: "ratedCurrent",
    label: header("ratedCurrentA"),
    fields: ["ratedCurrentA"],
    numeric: true,
    value: (r) => r.ratedCurrentA.toFixed(2),
  },
  {
    key: "currentSetting",
    label: header("currentSettingA"),
    fields: ["currentSettingA", "currentConvention"],
    sort: "currentSettingA",
    numeric: true,
    value: (r) => `${r.currentSettingA.toFixed(2)} ${r.currentConvention}`,
  },
  {
    key: "stepMode",
    label: A.stepMode.label,
    fields: ["stepMode", "microsteps"],
    value: (r) => (r.stepMode === "micro" ? `1/${r.microsteps}` : r.stepMode),
  },
  {
    key: "speed",
    label: header("speedRpm"),
    fields: ["speedRpm"],
    sort: "speedRpm",
    numeric: true,
    value: (r) => String(r.speedRpm),
  },
  {
    key: "loadTorque",
    label: header("loadTorqueNm"),
    fields: ["loadTorqueNm"],
    sort: "loadTorqueNm",
    numeric: true,
    value: (r) => r.loadTorqueNm.toFixed(3),
  },
  {
    key: "peakTorque",
    label: header("peakTorqueNm"),
    fields: ["peakTorqueNm"],
    numeric: true,
    value: (r) => r.peakTorqueNm.toFixed(3),
  },
  {
    key: "holdTorque",
    label: header("holdTorqueNm"),
    fields: ["holdTorqueNm"],
    numeric: true,
    value: (r) => (r.holdTorqueNm ? r.holdTorqueNm.toFixed(3) : "—"),
  },
  {
    key: "duty",
    label: `${A.movePct.label} / ${A.holdPct.label} [%]`,
    fields: ["movePct", "holdPct"],
    numeric: true,
    value: (r) => `${r.movePct} / ${r.holdPct}`,
  },
];

// The table's own key of a field that had a column before the registry (kept: views saved in URLs name them).
const KEY_OF: Partial<Record<AxisFieldKey, string>> = {
  busVoltageV: "busVoltage",
  hoursPerYear: "hours",
  phaseResistanceOhm: "resistance",
  phaseInductanceMh: "inductance",
  insulationClass: "insulation",
  stepLossEventsPerYear: "stepLoss",
};

/** A registry field shown as stored, in its unit; an empty value as a dash. */
function plainColumn(key: AxisFieldKey): AxisTableColumn {
  const spec: AxisFieldSpec = A[key];
  const numeric = spec.kind === "number" || spec.kind === "int";
  return {
    key: KEY_OF[key] ?? key,
    label: labelWithUnit(spec),
    fields: [key],
    numeric,
    value: (r) => {
      const v = (r as Record<string, unknown>)[key];
      return v === null || v === undefined || v === "" ? "—" : String(v);
    },
  };
}

const shaped = new Set(SHAPED.flatMap((c) => c.fields));

/**
 * The columns the axes table can show, in registry order: the machine, then every axis field
 * (lib/fields/axis.ts) but the label, which heads each row. A field added to the registry gets
 * a plain column here with no other edit.
 */
export const AXIS_COLUMNS: AxisTableColumn[] = [
  { key: "machine", label: "Machine", fields: [], sort: "machine", value: (r) => r.machineName },
  ...(Object.keys(A) as AxisFieldKey[])
    .filter((key) => key !== "label")
    .flatMap((key) => {
      const own = SHAPED.find((c) => c.fields[0] === key);
      if (own) return [own];
      return shaped.has(key) ? [] : [plainColumn(key)];
    }),
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
