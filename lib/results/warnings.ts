import {
  AXIS_WARNINGS,
  MACHINE_WARNINGS,
  type AxisWarning,
  type MachineWarning,
} from "@/lib/engine";

export type WarningCode = AxisWarning | MachineWarning;
export const WARNING_CODES: readonly WarningCode[] = [...AXIS_WARNINGS, ...MACHINE_WARNINGS];

/** One plain sentence per warning code of docs/model.md, for engineers and finance alike. */
export const WARNING_SENTENCES: Record<WarningCode, string> = {
  OL_THERMAL_RUNAWAY:
    "Open loop today, the winding gains heat faster than it can shed it, so the model finds no steady temperature.",
  CL_THERMAL_RUNAWAY:
    "Even closed loop, the winding gains heat faster than it can shed it, so the model finds no steady temperature.",
  OL_WINDING_OVER_CLASS:
    "Open loop today, the winding runs hotter than its insulation class allows.",
  CL_WINDING_OVER_CLASS:
    "Closed loop, the winding would still run hotter than its insulation class allows.",
  SPEED_BEYOND_CURVE:
    "The operating speed lies outside the measured pull-out curve, so the open-loop torque there is taken from the curve's nearest end.",
  CL_KIT_UNDERSIZED:
    "The kit cannot supply the current this load needs, so the closed loop is undersized and no lost-step savings are counted for it.",
  SAVING_OUTSIDE_BAND:
    "The modelled energy saving of this axis lies outside the claimed band, so check its duty figures before quoting the band.",
  CURRENT_ABOVE_RATING:
    "Today's drive setting heats the winding more than the motor's rated current would.",
  HOLDING_LOAD: "This axis holds a load at standstill, as a vertical or tensioned axis does.",
  OL_HOLD_SLIPS:
    "At standstill today's drive, reduced to its idle current, holds less torque than the load pulls with, so the axis can creep or drop while it waits.",
  SENSORLESS_LOW_SPEED:
    "The axis moves slower than the lowest speed at which the sensorless kit can estimate the rotor position, so it runs open loop in effect and no lost steps count as avoided.",
  SENSORLESS_HOLDING_LOAD:
    "A sensorless kit has no position signal at standstill, so it cannot notice this axis's load slipping while it holds.",
  INERTIA_RATIO_HIGH:
    "The load's inertia seen at the motor exceeds the ratio to the rotor's own inertia that open-loop steppers handle well, so moves may ring or stall.",
  MOTOR_INERTIA_UNKNOWN:
    "The rotor inertia is not given, so the torque that accelerates the rotor itself is missing from the peak torque and no inertia ratio can be stated.",
  THROUGHPUT_CAPPED:
    "The throughput gain of this machine is limited to the speed headroom its axes actually have.",
};

/** A few words per warning, for the axis table; the sentence and advice stand in the warnings panel. */
export const WARNING_TITLES: Record<WarningCode, string> = {
  OL_THERMAL_RUNAWAY: "No steady temperature today",
  CL_THERMAL_RUNAWAY: "No steady temperature closed loop",
  OL_WINDING_OVER_CLASS: "Over its insulation class today",
  CL_WINDING_OVER_CLASS: "Over its insulation class closed loop",
  SPEED_BEYOND_CURVE: "Speed beyond the pull-out curve",
  CL_KIT_UNDERSIZED: "Kit too small",
  SAVING_OUTSIDE_BAND: "Saving outside the claimed band",
  CURRENT_ABOVE_RATING: "Current above the motor's rating",
  HOLDING_LOAD: "Holds a load at rest",
  OL_HOLD_SLIPS: "Cannot hold its load today",
  SENSORLESS_LOW_SPEED: "Too slow for sensorless",
  SENSORLESS_HOLDING_LOAD: "Sensorless kit on a held load",
  INERTIA_RATIO_HIGH: "High inertia ratio",
  MOTOR_INERTIA_UNKNOWN: "Rotor inertia unknown",
  THROUGHPUT_CAPPED: "Throughput gain capped",
};

/** What to do about each warning, one short instruction, shown under its sentence. */
export const WARNING_ADVICE: Record<WarningCode, string> = {
  OL_THERMAL_RUNAWAY:
    "Check today's current setting and the duty figures; measure the housing temperature on site before quoting.",
  CL_THERMAL_RUNAWAY: "Choose a kit or motor with more thermal reserve, or check the duty figures.",
  OL_WINDING_OVER_CLASS:
    "Measure the housing temperature on site; the retrofit helps only if the closed-loop figure is within class.",
  CL_WINDING_OVER_CLASS: "Choose a larger kit or motor, or lower the load or the duty.",
  SPEED_BEYOND_CURVE:
    "Extend the pull-out curve to the operating speed from the motor's datasheet.",
  CL_KIT_UNDERSIZED: "Pick a kit with more current or a higher bus voltage for this axis.",
  SAVING_OUTSIDE_BAND:
    "Check the axis's speed, load torque and move and hold shares before quoting the claimed band.",
  CURRENT_ABOVE_RATING: "Check the drive's current setting against the motor's rated current.",
  HOLDING_LOAD:
    "Plan the brake and the safe stop, and what the axis does when the closed-loop drive faults.",
  OL_HOLD_SLIPS:
    "Check the idle-current setting and the brake now; the closed loop holds with the current the load needs, but the brake stays.",
  SENSORLESS_LOW_SPEED:
    "Use a kit with an encoder on this axis, or check whether the move can run above the kit's minimum speed.",
  SENSORLESS_HOLDING_LOAD:
    "Use a kit with an encoder on axes that hold a load, and keep the brake and safe-stop concept.",
  INERTIA_RATIO_HIGH:
    "Consider a gear reduction or a motor with more rotor inertia, and check the tuning at commissioning.",
  MOTOR_INERTIA_UNKNOWN: "Enter the rotor inertia from the motor's datasheet.",
  THROUGHPUT_CAPPED:
    "Lower the machine's throughput gain to what its axes can run, or give its slowest axis more headroom.",
};

/** The cautions of the product brief that belong to a warning, shown beside it. */
export const CAUTIONS = {
  general:
    "Retrofit work is electrical work on machinery: isolate and lock out, let only qualified persons do it, and follow the machine's risk assessment and the local electrical and machinery-safety codes.",
  holdingLoad:
    "An axis that holds a load at standstill needs a brake and a safe-stop concept, and a closed-loop drive faults when it loses its encoder signal, so plan what the axis does then.",
  hotWinding:
    "Windings above their insulation class, and housings hot enough to burn on touch, need attention before and after the retrofit.",
  estimates: "Temperatures are estimates from datasheet values, not measurements.",
  savings:
    "Savings and payback are estimates from the stated assumptions; the workbook lists every one of them.",
} as const;

// Warnings about a hot winding, open loop first, then closed loop: each carries the burn caution.
const HOT_CODES: ReadonlySet<WarningCode> = new Set([
  "OL_THERMAL_RUNAWAY",
  "OL_WINDING_OVER_CLASS",
  "CL_THERMAL_RUNAWAY",
  "CL_WINDING_OVER_CLASS",
]);

// Warnings about a load at standstill: each carries the brake and safe-stop caution.
const HOLDING_CODES: ReadonlySet<WarningCode> = new Set([
  "HOLDING_LOAD",
  "OL_HOLD_SLIPS",
  "SENSORLESS_HOLDING_LOAD",
]);

/** The caution a warning carries, or null when it needs none beyond the general ones. */
export function warningCaution(code: WarningCode): string | null {
  if (HOLDING_CODES.has(code)) return CAUTIONS.holdingLoad;
  if (HOT_CODES.has(code)) return `${CAUTIONS.hotWinding} ${CAUTIONS.estimates}`;
  return null;
}

export interface ExplainedWarning {
  code: WarningCode;
  title: string;
  sentence: string;
  /** What to do about it. */
  advice: string;
  caution: string | null;
  /** Whether the warning is about safety (shown in the danger tone) or about the figures. */
  safety: boolean;
}

export function explainWarning(code: WarningCode): ExplainedWarning {
  const caution = warningCaution(code);
  return {
    code,
    title: WARNING_TITLES[code],
    sentence: WARNING_SENTENCES[code],
    advice: WARNING_ADVICE[code],
    caution,
    safety: caution !== null,
  };
}

/** A code the engine may add later still reads as a sentence instead of a raw code. */
export function explainAnyWarning(code: string): ExplainedWarning {
  if ((WARNING_CODES as readonly string[]).includes(code))
    return explainWarning(code as WarningCode);
  return {
    code: code as WarningCode,
    title: "Flagged by the engine",
    sentence: "The engine flagged this axis; see the workbook for details.",
    advice: "Ask the application engineer who prepared the case.",
    caution: null,
    safety: false,
  };
}

export interface CaseCaution {
  id: "electrical-work" | "holding-load" | "hot-winding" | "estimates";
  title: string;
  text: string;
  /** Labels of the axes it concerns; empty for cautions that hold for every case. */
  axes: string[];
}

/**
 * The cautions a case carries: the two that hold for every retrofit, and those that the axes'
 * warnings call for, each naming the axes concerned.
 */
export function caseCautions(
  result: { axes: { id: string; warnings: readonly string[] }[] },
  axisLabel: (id: string) => string = (id) => id,
): CaseCaution[] {
  const holding: string[] = [];
  const hot: string[] = [];
  for (const axis of result.axes) {
    if (axis.warnings.some((w) => HOLDING_CODES.has(w as WarningCode)))
      holding.push(axisLabel(axis.id));
    if (axis.warnings.some((w) => HOT_CODES.has(w as WarningCode))) hot.push(axisLabel(axis.id));
  }
  const cautions: CaseCaution[] = [
    {
      id: "electrical-work",
      title: "Electrical work on machinery",
      text: CAUTIONS.general,
      axes: [],
    },
  ];
  if (holding.length > 0) {
    cautions.push({
      id: "holding-load",
      title: "Axes that hold a load",
      text: CAUTIONS.holdingLoad,
      axes: holding,
    });
  }
  if (hot.length > 0) {
    cautions.push({
      id: "hot-winding",
      title: "Hot windings and surfaces",
      text: `${CAUTIONS.hotWinding} ${CAUTIONS.estimates}`,
      axes: hot,
    });
  }
  cautions.push({
    id: "estimates",
    title: "Estimates, not guarantees",
    text: `${CAUTIONS.savings} ${CAUTIONS.estimates}`,
    axes: [],
  });
  return cautions;
}
