/**
 * The three scenarios of every case (docs/model.md (The business case)), named alike on screen,
 * in the workbook and in the e-mails. "physics" is the engine's own estimate from the axes'
 * torque and energy model; a finance reader knows it as the engineering estimate.
 */

export type ScenarioKeyName = "physics" | "bandLow" | "bandHigh";

export const SCENARIO_LABELS: Record<ScenarioKeyName, string> = {
  physics: "Engineering estimate",
  bandLow: "Low trade claim",
  bandHigh: "High trade claim",
};

/** What each scenario assumes, for a sheet's group title or a chart's description. */
export const SCENARIO_EXPLANATIONS: Record<ScenarioKeyName, string> = {
  physics: "the engine's torque and energy model of each axis",
  bandLow: "the low end of the saving the trade claims",
  bandHigh: "the high end of the saving the trade claims",
};

/** A scenario's name with the band fraction a trade-claim scenario assumes: "Low trade claim (20 % saved)". */
export function scenarioLabel(
  key: ScenarioKeyName,
  band: { lowPct: number; highPct: number },
): string {
  switch (key) {
    case "physics":
      return SCENARIO_LABELS.physics;
    case "bandLow":
      return `${SCENARIO_LABELS.bandLow} (${band.lowPct} % saved)`;
    case "bandHigh":
      return `${SCENARIO_LABELS.bandHigh} (${band.highPct} % saved)`;
  }
}
