import type { AxisResult, AxisWarning, MachineWarning } from "@/lib/engine";

/** The insulation class limits of IEC 60085 (Table 1) that the engine compares with (docs/model.md (Winding temperature)). */
const CLASS_LIMIT_C: Record<string, number> = { B: 130, F: 155, H: 180 };

const degrees = (value: number | null): string =>
  value === null ? "no steady value" : `${value.toFixed(0)} °C`;

/** One sentence per warning code, for the Axes sheet's warnings column (docs/model.md). */
export function axisWarningText(
  code: AxisWarning,
  axis: AxisResult,
  insulationClass: string,
): string {
  const limit = CLASS_LIMIT_C[insulationClass];
  switch (code) {
    case "OL_THERMAL_RUNAWAY":
      return "Open loop today: the winding finds no steady temperature at this current (thermal runaway).";
    case "CL_THERMAL_RUNAWAY":
      return "Closed loop: the winding finds no steady temperature with this kit (thermal runaway).";
    case "OL_WINDING_OVER_CLASS":
      return `Open loop today: the winding reaches ${degrees(axis.openLoop.windingTempC)}, above the ${limit} °C of insulation class ${insulationClass}.`;
    case "CL_WINDING_OVER_CLASS":
      return `Closed loop: the winding reaches ${degrees(axis.closedLoop.windingTempC)}, above the ${limit} °C of insulation class ${insulationClass}.`;
    case "SPEED_BEYOND_CURVE":
      return "The operating speed lies outside the measured pull-out curve; its end point was held flat.";
    case "CL_KIT_UNDERSIZED":
      return "The kit cannot deliver the torque this axis demands; its step-loss savings are not counted.";
    case "SAVING_OUTSIDE_BAND":
      return `The engineering estimate of ${axis.savings.energyPct === null ? "this axis's saving" : `the saving, ${axis.savings.energyPct.toFixed(1)} %,`} lies ${axis.savings.band} the band claimed in the trade.`;
    case "CURRENT_ABOVE_RATING":
      return "Today's current setting dissipates more than the motor's rating at 20 °C.";
    case "HOLDING_LOAD":
      return "The axis holds a load at standstill (vertical or tensioned): see the Cautions sheet.";
    case "OL_HOLD_SLIPS":
      return `Open loop today: the idle current holds ${axis.openLoop.holdingCapabilityNm?.toFixed(3) ?? "less than"} N·m at standstill, less than the holding load.`;
    case "SENSORLESS_LOW_SPEED":
      return "The sensorless kit runs below its minimum speed: it works open loop in effect and its step-loss savings are not counted.";
    case "SENSORLESS_HOLDING_LOAD":
      return "A sensorless kit cannot see the axis drop at standstill while it holds a load: see the Cautions sheet.";
    case "INERTIA_RATIO_HIGH":
      return "The load inertia reflected to the motor is high against the rotor's (above the axis's limit).";
    case "MOTOR_INERTIA_UNKNOWN":
      return "The rotor inertia is not given: the peak torque leaves out the rotor's own acceleration.";
  }
}

export function machineWarningText(code: MachineWarning): string {
  switch (code) {
    case "THROUGHPUT_CAPPED":
      return "The speed-up counted is capped by the least speed headroom of the machine's axes.";
  }
}

/** The cautions of the product brief that every proposal carries. */
export const GENERAL_CAUTIONS: readonly { topic: string; text: string }[] = [
  {
    topic: "Electrical work on machinery",
    text:
      "Converting an axis means working on live machine wiring: isolate and lock out the machine, " +
      "let only qualified people do it, and follow its risk assessment and the local electrical and machinery-safety codes.",
  },
  {
    topic: "Loads at standstill",
    text:
      "A vertical or tensioned axis holds its load at rest: it needs a brake and a safe-stop plan, " +
      "since a closed-loop drive trips when it loses its encoder — decide what the axis then does.",
  },
  {
    topic: "Temperatures",
    text:
      "The sheets flag windings hotter than their insulation class and housings hot enough to burn " +
      "a hand; every temperature here is estimated from datasheet values — not measurements.",
  },
  {
    topic: "Estimates",
    text:
      "Savings and payback are estimates from the stated assumptions; the Assumptions sheet lists " +
      "them all, with where each default comes from.",
  },
];

/** The warning codes that carry a caution of their own on the Cautions sheet. */
export const CAUTION_CODES = [
  "HOLDING_LOAD",
  "OL_WINDING_OVER_CLASS",
  "CL_WINDING_OVER_CLASS",
  "OL_THERMAL_RUNAWAY",
  "CL_THERMAL_RUNAWAY",
  "CL_KIT_UNDERSIZED",
] as const satisfies readonly AxisWarning[];

export type CautionCode = (typeof CAUTION_CODES)[number];

export function axisCautionText(
  code: CautionCode,
  axis: AxisResult,
  insulationClass: string,
): string {
  const limit = CLASS_LIMIT_C[insulationClass];
  switch (code) {
    case "HOLDING_LOAD":
      return (
        "This axis holds a load at standstill: it needs a brake and a safe-stop concept, and a " +
        "closed-loop drive faults on encoder loss — decide what the axis does then before the retrofit."
      );
    case "OL_WINDING_OVER_CLASS":
      return (
        `Today the winding is estimated at ${degrees(axis.openLoop.windingTempC)}, above the ${limit} °C ` +
        `of insulation class ${insulationClass} (IEC 60085); the housing may be hot enough to burn ` +
        "on touch. An estimate from datasheet values, not a measurement: check on the machine."
      );
    case "CL_WINDING_OVER_CLASS":
      return (
        `Even closed loop the winding is estimated at ${degrees(axis.closedLoop.windingTempC)}, above the ` +
        `${limit} °C of insulation class ${insulationClass} (IEC 60085): choose another motor or ` +
        "lower the duty; the housing may be hot enough to burn on touch."
      );
    case "OL_THERMAL_RUNAWAY":
      return (
        "At today's current setting the estimated winding losses grow faster than the motor sheds " +
        "heat: no steady temperature exists. Check the setting and the motor on the machine."
      );
    case "CL_THERMAL_RUNAWAY":
      return (
        "With the proposed kit the estimated winding losses grow faster than the motor sheds heat: " +
        "no steady temperature exists. Do not retrofit this axis with this kit."
      );
    case "CL_KIT_UNDERSIZED":
      return (
        "The proposed kit cannot deliver the torque this axis demands with the closed-loop margin: " +
        "choose a larger kit. This axis's step-loss savings are not counted."
      );
  }
}
