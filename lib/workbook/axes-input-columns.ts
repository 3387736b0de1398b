import type { MotionResult, ParsedMotor } from "@/lib/engine";
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

/** The inputs of each axis, in SI units (inductance in H; speeds in rpm as docs/model.md takes them). */
export const AXIS_INPUT_COLUMNS: readonly AxisColumn[] = [
  { key: "id", group: "Axis", header: "Axis id", width: 14, value: (r) => safeText(r.axis.id) },
  { key: "label", group: "Axis", header: "Label", width: 28, value: (r) => safeText(r.axis.label) },
  {
    key: "machine",
    group: "Axis",
    header: "Machine id",
    width: 12,
    value: (r) => safeText(r.axis.machineId),
  },
  {
    key: "machineName",
    group: "Axis",
    header: "Machine",
    width: 22,
    value: (r) => safeText(r.machineName),
  },
  {
    key: "qty",
    group: "Axis",
    header: "Quantity",
    width: 9,
    format: FORMATS.whole,
    value: (r) => r.axis.quantity,
  },

  {
    key: "teeth",
    group: "Motor",
    header: "Rotor teeth",
    width: 8,
    format: FORMATS.whole,
    value: (r) => r.axis.motor.rotorTeeth,
  },
  {
    key: "holding",
    group: "Motor",
    header: "Holding torque (N·m)",
    width: 10,
    format: FORMATS.physics,
    value: (r) => r.axis.motor.holdingTorqueNm,
  },
  {
    key: "ratedA",
    group: "Motor",
    header: "Rated current (A)",
    width: 9,
    format: FORMATS.physics,
    value: (r) => r.axis.motor.ratedCurrentA,
  },
  {
    key: "r20",
    group: "Motor",
    header: "Phase resistance at 20 °C (Ω)",
    width: 11,
    format: FORMATS.physics,
    value: (r) => r.axis.motor.phaseResistanceOhm,
  },
  {
    key: "inductance",
    group: "Motor",
    header: "Phase inductance (H)",
    width: 11,
    format: FORMATS.fine,
    value: (r) => r.axis.motor.phaseInductanceMh / 1000,
  },
  {
    key: "rth",
    group: "Motor",
    header: "Thermal resistance (K/W)",
    width: 11,
    format: FORMATS.physics,
    value: (r) => r.axis.motor.thermalResistanceKPerW ?? "from rated rise",
  },
  {
    key: "rise",
    group: "Motor",
    header: "Rated temperature rise (K)",
    width: 10,
    format: FORMATS.pct,
    value: (r) => r.axis.motor.ratedTempRiseK,
  },
  {
    key: "class",
    group: "Motor",
    header: "Insulation class",
    width: 9,
    value: (r) => r.axis.motor.insulationClass,
  },
  {
    key: "kh",
    group: "Motor",
    header: "Hysteresis loss (W/Hz)",
    width: 10,
    format: FORMATS.fine,
    value: (r) => r.axis.motor.hysteresisWPerHz,
  },
  {
    key: "ke",
    group: "Motor",
    header: "Eddy loss (W/Hz²)",
    width: 10,
    format: "0.000E+00",
    value: (r) => r.axis.motor.eddyWPerHz2,
  },
  {
    key: "curve",
    group: "Motor",
    header: "Pull-out curve",
    width: 24,
    value: (r) => safeText(curveText(r.axis.motor)),
  },

  {
    key: "busV",
    group: "Drive today",
    header: "Bus voltage (V)",
    width: 9,
    format: FORMATS.pct,
    value: (r) => r.axis.drive.busVoltageV,
  },
  {
    key: "setA",
    group: "Drive today",
    header: "Current setting (A)",
    width: 9,
    format: FORMATS.physics,
    value: (r) => r.axis.drive.currentSettingA,
  },
  {
    key: "convention",
    group: "Drive today",
    header: "Current convention",
    width: 10,
    value: (r) => r.axis.drive.currentConvention,
  },
  {
    key: "stepMode",
    group: "Drive today",
    header: "Step mode",
    width: 12,
    value: (r) => r.axis.drive.stepMode,
  },
  {
    key: "microsteps",
    group: "Drive today",
    header: "Microsteps",
    width: 9,
    format: FORMATS.whole,
    value: (r) => r.axis.drive.microsteps,
  },
  {
    key: "idle",
    group: "Drive today",
    header: "Idle current (%)",
    width: 9,
    format: FORMATS.pct,
    value: (r) => r.axis.drive.idleCurrentPct,
  },
  {
    key: "driveEff",
    group: "Drive today",
    header: "Efficiency (%)",
    width: 9,
    format: FORMATS.pct,
    value: (r) => r.axis.drive.efficiencyPct,
  },
  {
    key: "driveStandby",
    group: "Drive today",
    header: "Standby (W)",
    width: 9,
    format: FORMATS.pct2,
    value: (r) => r.axis.drive.standbyW,
  },

  {
    key: "hours",
    group: "Duty",
    header: "Hours per year",
    width: 9,
    format: FORMATS.whole,
    value: (r) => r.axis.duty.hoursPerYear,
  },
  {
    key: "move",
    group: "Duty",
    header: "Moving (%)",
    width: 8,
    format: FORMATS.pct,
    value: (r) => dutyFigure(r, "movePct"),
  },
  {
    key: "hold",
    group: "Duty",
    header: "Holding (%)",
    width: 8,
    format: FORMATS.pct,
    value: (r) => dutyFigure(r, "holdPct"),
  },
  {
    key: "rpm",
    group: "Duty",
    header: "Speed (rpm)",
    width: 9,
    format: FORMATS.pct,
    value: (r) => dutyFigure(r, "speedRpm"),
  },
  {
    key: "load",
    group: "Duty",
    header: "Load torque, RMS (N·m)",
    width: 10,
    format: FORMATS.physics,
    value: (r) => dutyFigure(r, "loadTorqueNm"),
  },
  {
    key: "peak",
    group: "Duty",
    header: "Peak torque (N·m)",
    width: 10,
    format: FORMATS.physics,
    value: (r) => dutyFigure(r, "peakTorqueNm"),
  },
  {
    key: "holdTorque",
    group: "Duty",
    header: "Holding load (N·m)",
    width: 10,
    format: FORMATS.physics,
    value: (r) => dutyFigure(r, "holdTorqueNm"),
  },
  {
    key: "ambient",
    group: "Duty",
    header: "Ambient (°C)",
    width: 9,
    format: FORMATS.pct,
    value: (r) => r.axis.duty.ambientC,
  },

  {
    key: "events",
    group: "Reliability",
    header: "Step-loss events per year",
    width: 10,
    format: FORMATS.pct2,
    value: (r) => r.axis.reliability.stepLossEventsPerYear,
  },
  {
    key: "eventCostGiven",
    group: "Reliability",
    header: "Cost per event, as given",
    width: 13,
    format: "currency",
    value: (r) => money(r.axis.reliability.costPerEvent ?? "0"),
  },
  // docs/model.md (The business case): or the cost built from what one event causes (not both).
  {
    key: "eventDowntime",
    group: "Reliability",
    header: "Event: downtime (min)",
    width: 10,
    format: FORMATS.pct2,
    value: (r) => r.axis.reliability.event?.downtimeMinutes ?? 0,
  },
  {
    key: "eventScrapParts",
    group: "Reliability",
    header: "Event: scrapped parts",
    width: 10,
    format: FORMATS.pct2,
    value: (r) => r.axis.reliability.event?.scrapParts ?? 0,
  },
  {
    key: "eventScrapCost",
    group: "Reliability",
    header: "Event: cost per scrapped part",
    width: 12,
    format: "currency",
    value: (r) => money(r.axis.reliability.event?.scrapCostPerPart ?? "0"),
  },
  {
    key: "eventRestartHours",
    group: "Reliability",
    header: "Event: restart labour (h)",
    width: 10,
    format: FORMATS.pct2,
    value: (r) => r.axis.reliability.event?.restartLaborHours ?? 0,
  },
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
  {
    key: "avoided",
    group: "Reliability",
    header: "Events avoided closed loop (%)",
    width: 10,
    format: FORMATS.pct,
    value: (r) => r.axis.reliability.avoidedPct,
  },

  {
    key: "kitId",
    group: "Retrofit",
    header: "Kit id",
    width: 12,
    value: (r) => safeText(r.axis.retrofit.kit.id),
  },
  {
    key: "kitName",
    group: "Retrofit",
    header: "Kit",
    width: 26,
    value: (r) => safeText(r.axis.retrofit.kit.name),
  },
  {
    key: "sensing",
    group: "Retrofit",
    header: "Sensing",
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
    header: "Kit peak current (A)",
    width: 10,
    format: FORMATS.physics,
    value: (r) => r.axis.retrofit.kit.maxCurrentPeakA ?? "√2 × rated",
  },
  {
    key: "kitBusV",
    group: "Retrofit",
    header: "Kit bus voltage (V)",
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
