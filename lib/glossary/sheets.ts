/** The sheet names of the proposal workbook, in reading order. */
export const SHEET = {
  summary: "Summary",
  axes: "Axes",
  cashFlow: "Cash flow",
  assumptions: "Assumptions",
  cautions: "Cautions",
} as const;

/**
 * The sheet a proposal workbook adds after Cautions when the sources of its typed figures are
 * at hand (the download routes read them; a workbook built without them has no such sheet).
 */
export const SOURCES_SHEET = "Sources";

/** The sheets the dossier workbook adds after the proposal's, before one sheet per axis. */
export const DOSSIER_SHEET = {
  monthly: "Monthly cash flow",
  paybackGrid: "Payback grid",
  sensitivity: "Sensitivity",
  uncertainty: "Uncertainty",
  axisIndex: "Axis sheets",
} as const;

/**
 * Headers of the workbook columns that hold a record's key (the id the database keeps it under):
 * technical columns that formulas match machines by, or that tie a row to the Axes sheet, never
 * the name a reader knows an axis or a machine by (that is in its own column, to the left).
 */
export const RECORD_KEY_HEADER = {
  axis: "Axis record key (technical)",
  machine: "Machine record key (for formulas)",
  kit: "Kit record key (technical)",
} as const;
