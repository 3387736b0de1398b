import type ExcelJS from "exceljs";
import type { MotionResult, ParsedMotor } from "@/lib/engine";
import {
  AXIS_FIELDS,
  EVENT_FIELDS,
  KIT_FIELDS,
  labelWithUnit,
  type AxisFieldGroup,
  type AxisFieldKey,
  type AxisFieldSpec,
  type EventFieldKey,
  type FieldSpec,
} from "@/lib/fields";
import { RECORD_KEY_HEADER } from "@/lib/glossary";
import { eventCostValue, money, type AxisColumn, type AxisRowContext } from "./axis-column";
import { FORMATS } from "./formats";
import { NAME } from "./layout";
import { safeText } from "./safe-text";

type DutyFigure =
  "movePct" | "holdPct" | "speedRpm" | "loadTorqueNm" | "peakTorqueNm" | "holdTorqueNm";

/**
 * A duty figure as the engine used it: with a mechanism and move profile (docs/model.md (Motion from the mechanism)) the
 * figures it derived (the result's motion block), else the duty as typed. A result stored by
 * engine v1 has no motion block.
 */
function dutyFigure(r: AxisRowContext, figure: DutyFigure): number {
  const motion = (r.result as { motion?: MotionResult | null }).motion;
  return motion ? motion[figure] : (r.axis.duty[figure] ?? 0);
}

function motorSummary(motor: ParsedMotor | undefined): string {
  if (!motor) return "keeps the axis motor";
  return `new motor: ${motor.holdingTorqueNm} N·m holding, ${motor.ratedCurrentA} A, ${motor.phaseResistanceOhm} Ω, ${motor.phaseInductanceMh / 1000} H`;
}

function curveText(motor: ParsedMotor): string {
  if (!motor.pullOutCurve) return "modelled";
  return motor.pullOutCurve.map((p) => `${p.rpm} rpm: ${p.torqueNm} N·m`).join("; ");
}

const A = AXIS_FIELDS;

/** The header of a field's column: its registry label with its unit, "Idle current (%)". */
export const sheetHeader = (spec: FieldSpec, unit = spec.unit) =>
  labelWithUnit({ label: spec.label, unit }, "()");

const GROUP_TITLE: Record<AxisFieldGroup, string> = {
  axis: "Axis",
  motor: "Motor",
  drive: "Drive today",
  duty: "Duty",
  reliability: "Reliability",
};

// The sheet's own keys of the fields (its formulas name them through `cell(key)`).
const KEY_OF: Partial<Record<AxisFieldKey, string>> = {
  quantity: "qty",
  rotorTeeth: "teeth",
  holdingTorqueNm: "holding",
  ratedCurrentA: "ratedA",
  phaseResistanceOhm: "r20",
  phaseInductanceMh: "inductance",
  thermalResistanceKPerW: "rth",
  ratedTempRiseK: "rise",
  insulationClass: "class",
  hysteresisWPerHz: "kh",
  eddyWPerHz2: "ke",
  busVoltageV: "busV",
  currentSettingA: "setA",
  currentConvention: "convention",
  microsteps: "microsteps",
  idleCurrentPct: "idle",
  driveEfficiencyPct: "driveEff",
  driveStandbyW: "driveStandby",
  hoursPerYear: "hours",
  movePct: "move",
  holdPct: "hold",
  speedRpm: "rpm",
  loadTorqueNm: "load",
  peakTorqueNm: "peak",
  holdTorqueNm: "holdTorque",
  ambientC: "ambient",
  stepLossEventsPerYear: "events",
  costPerEvent: "eventCostGiven",
  avoidedPct: "avoided",
};

const SHEET_FORMAT: Record<NonNullable<FieldSpec["sheetFormat"]>, string> = {
  whole: FORMATS.whole,
  physics: FORMATS.physics,
  fine: FORMATS.fine,
  pct: FORMATS.pct,
  pct2: FORMATS.pct2,
  currency: "currency",
  sci: "0.000E+00",
};

/** The value an axis field takes in the engine's parsed axis (its group object, its engine name). */
function parsedValue(r: AxisRowContext, key: AxisFieldKey): ExcelJS.CellValue {
  const spec: AxisFieldSpec = A[key];
  const name = spec.engineKey ?? key;
  const holder = spec.group === "axis" ? r.axis : (r.axis[spec.group] as object);
  const value = (holder as Record<string, unknown>)[name];
  if (value === undefined || value === null) return null;
  if (spec.kind === "money") return money(String(value));
  return spec.kind === "text" ? safeText(String(value)) : (value as ExcelJS.CellValue);
}

// Fields whose cell is not the parsed value as it stands.
const VALUE_OF: Partial<Record<AxisFieldKey, (r: AxisRowContext) => ExcelJS.CellValue>> = {
  phaseInductanceMh: (r) => r.axis.motor.phaseInductanceMh / 1000,
  thermalResistanceKPerW: (r) => r.axis.motor.thermalResistanceKPerW ?? "from rated rise",
  movePct: (r) => dutyFigure(r, "movePct"),
  holdPct: (r) => dutyFigure(r, "holdPct"),
  speedRpm: (r) => dutyFigure(r, "speedRpm"),
  loadTorqueNm: (r) => dutyFigure(r, "loadTorqueNm"),
  peakTorqueNm: (r) => dutyFigure(r, "peakTorqueNm"),
  holdTorqueNm: (r) => dutyFigure(r, "holdTorqueNm"),
  costPerEvent: (r) => money(r.axis.reliability.costPerEvent ?? "0"),
};

// The workbook gives inductance in H (SI), the registry in mH as datasheets do.
const HEADER_OF: Partial<Record<AxisFieldKey, string>> = {
  phaseInductanceMh: sheetHeader(A.phaseInductanceMh, "H"),
  costPerEvent: `${A.costPerEvent.label}, as given`,
};

/** The Axes sheet column of a registry field: header, width and format from lib/fields/axis.ts. */
function fieldColumn(key: AxisFieldKey): AxisColumn {
  const spec: AxisFieldSpec = A[key];
  return {
    key: KEY_OF[key] ?? key,
    group: GROUP_TITLE[spec.group],
    header: HEADER_OF[key] ?? sheetHeader(spec),
    width: spec.sheetWidth ?? 12,
    ...(spec.sheetFormat ? { format: SHEET_FORMAT[spec.sheetFormat] } : {}),
    value: VALUE_OF[key] ?? ((r) => parsedValue(r, key)),
  };
}

const fieldsOf = (group: AxisFieldGroup, except: AxisFieldKey[] = []) =>
  (Object.keys(A) as AxisFieldKey[])
    .filter((key) => (A[key] as AxisFieldSpec).group === group && !except.includes(key))
    .map(fieldColumn);

// The step-loss event build-up (docs/model.md (The business case)): 0 when the axis has none.
const EVENT_KEY: Record<EventFieldKey, string> = {
  downtimeMinutes: "eventDowntime",
  scrapParts: "eventScrapParts",
  scrapCostPerPart: "eventScrapCost",
  restartLaborHours: "eventRestartHours",
};
const EVENT_WIDTH: Record<EventFieldKey, number> = {
  downtimeMinutes: 10,
  scrapParts: 10,
  scrapCostPerPart: 12,
  restartLaborHours: 10,
};
const eventColumns = (Object.keys(EVENT_FIELDS) as EventFieldKey[]).map((key): AxisColumn => ({
  key: EVENT_KEY[key],
  group: GROUP_TITLE.reliability,
  header: sheetHeader(EVENT_FIELDS[key]),
  width: EVENT_WIDTH[key],
  format: EVENT_FIELDS[key].kind === "money" ? "currency" : FORMATS.pct2,
  value: (r) => {
    const event = r.axis.reliability.event;
    const value = event?.[key] ?? EVENT_FIELDS[key].default;
    return typeof value === "string" ? money(value) : value;
  },
}));

/**
 * The inputs of each axis, in SI units (inductance in H; speeds in rpm as docs/model.md takes
 * them). Every axis field of the registry has its column, in registry order within its group;
 * a field added there appears here with no other edit.
 */
export const AXIS_INPUT_COLUMNS: readonly AxisColumn[] = [
  // The axis as a reader knows it, by its label and machine (the two frozen columns), then the
  // record keys: the machine's is what the Summary's per-machine formulas match on, the axis's
  // ties a row of the Cautions sheet or the dossier's index to this one. Formulas find every
  // column by its key, never by its place.
  fieldColumn("label"),
  {
    key: "machineName",
    group: "Axis",
    header: "Machine",
    width: 22,
    value: (r) => safeText(r.machineName),
  },
  {
    key: "id",
    group: "Axis",
    header: RECORD_KEY_HEADER.axis,
    width: 14,
    value: (r) => safeText(r.axis.id),
  },
  {
    key: "machine",
    group: "Axis",
    header: RECORD_KEY_HEADER.machine,
    width: 14,
    value: (r) => safeText(r.axis.machineId),
  },
  ...fieldsOf("axis", ["label"]),
  ...fieldsOf("motor"),
  {
    key: "curve",
    group: "Motor",
    header: "Pull-out curve",
    width: 24,
    value: (r) => safeText(curveText(r.axis.motor)),
  },
  ...fieldsOf("drive"),
  ...fieldsOf("duty"),
  ...fieldsOf("reliability", ["avoidedPct"]),
  // docs/model.md (The business case): or the cost built from what one event causes (not both).
  ...eventColumns,
  {
    key: "eventCost",
    group: "Reliability",
    header: "Cost of one event (formula)",
    width: 13,
    format: "currency",
    value: (r) => ({
      formula: `${r.cell("eventCostGiven")}+${r.cell("eventDowntime")}/60*${NAME.downtimeCost}+${r.cell("eventScrapParts")}*${r.cell("eventScrapCost")}+${r.cell("eventRestartHours")}*${NAME.laborRate}`,
      result: eventCostValue(r),
    }),
  },
  fieldColumn("avoidedPct"),

  {
    key: "kitName",
    group: "Retrofit",
    header: "Kit",
    width: 26,
    value: (r) => safeText(r.axis.retrofit.kit.name),
  },
  {
    key: "kitId",
    group: "Retrofit",
    header: RECORD_KEY_HEADER.kit,
    width: 14,
    value: (r) => safeText(r.axis.retrofit.kit.id),
  },
  {
    key: "sensing",
    group: "Retrofit",
    header: sheetHeader(KIT_FIELDS.sensing),
    width: 11,
    value: (r) => r.axis.retrofit.kit.sensing,
  },
  {
    key: "kitMotor",
    group: "Retrofit",
    header: "Kit motor",
    width: 26,
    value: (r) => safeText(motorSummary(r.axis.retrofit.kit.motor)),
  },
  {
    key: "kitMaxA",
    group: "Retrofit",
    header: sheetHeader(KIT_FIELDS.maxCurrentPeakA),
    width: 10,
    format: FORMATS.physics,
    value: (r) => r.axis.retrofit.kit.maxCurrentPeakA ?? "√2 × rated",
  },
  {
    key: "kitBusV",
    group: "Retrofit",
    header: sheetHeader(KIT_FIELDS.busVoltageV),
    width: 10,
    format: FORMATS.pct,
    value: (r) => r.axis.retrofit.kit.busVoltageV ?? "as today",
  },
  {
    key: "price",
    group: "Retrofit",
    header: "Kit price",
    width: 13,
    format: "currency",
    value: (r) => money(r.axis.retrofit.kit.price),
  },
  {
    key: "discount",
    group: "Retrofit",
    header: "Discount (%)",
    width: 9,
    format: FORMATS.pct2,
    value: (r) => r.axis.retrofit.discountPct,
  },
  {
    key: "installHours",
    group: "Retrofit",
    header: "Install hours",
    width: 9,
    format: FORMATS.pct2,
    value: (r) => r.axis.retrofit.installHours,
  },
  {
    key: "commissioning",
    group: "Retrofit",
    header: "Commissioning",
    width: 13,
    format: "currency",
    value: (r) => money(r.axis.retrofit.commissioningCost),
  },
  {
    key: "maintenanceUnit",
    group: "Retrofit",
    header: "Maintenance saving per year",
    width: 13,
    format: "currency",
    value: (r) => money(r.axis.retrofit.maintenanceSavingPerYear),
  },
];
