import {
  AXIS_WARNINGS,
  MACHINE_WARNINGS,
  type AxisWarning,
  type MachineWarning,
} from "@/lib/engine";

export type WarningCode = AxisWarning | MachineWarning;
export const WARNING_CODES: readonly WarningCode[] = [...AXIS_WARNINGS, ...MACHINE_WARNINGS];

/** One plain sentence per warning code of ENGINE.md §9, for engineers and finance alike. */
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
  THROUGHPUT_CAPPED:
    "The throughput gain of this machine is limited to the speed headroom its axes actually have.",
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

const HOT_CODES: ReadonlySet<WarningCode> = new Set([
  "OL_THERMAL_RUNAWAY",
  "CL_THERMAL_RUNAWAY",
  "OL_WINDING_OVER_CLASS",
  "CL_WINDING_OVER_CLASS",
]);

/** The caution a warning carries, or null when it needs none beyond the general ones. */
export function warningCaution(code: WarningCode): string | null {
  if (code === "HOLDING_LOAD") return CAUTIONS.holdingLoad;
  if (HOT_CODES.has(code)) return `${CAUTIONS.hotWinding} ${CAUTIONS.estimates}`;
  return null;
}

export interface ExplainedWarning {
  code: WarningCode;
  sentence: string;
  caution: string | null;
  /** Whether the warning is about safety (shown in the danger tone) or about the figures. */
  safety: boolean;
}

export function explainWarning(code: WarningCode): ExplainedWarning {
  const caution = warningCaution(code);
  return { code, sentence: WARNING_SENTENCES[code], caution, safety: caution !== null };
}

/** A code the engine may add later still reads as a sentence instead of a raw code. */
export function explainAnyWarning(code: string): ExplainedWarning {
  if ((WARNING_CODES as readonly string[]).includes(code))
    return explainWarning(code as WarningCode);
  return {
    code: code as WarningCode,
    sentence: "The engine flagged this axis; see the workbook for details.",
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
    if (axis.warnings.includes("HOLDING_LOAD")) holding.push(axisLabel(axis.id));
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
