/** The sheet names of the proposal workbook, in reading order. */
export const SHEET = {
  summary: "Summary",
  axes: "Axes",
  cashFlow: "Cash flow",
  assumptions: "Assumptions",
  cautions: "Cautions",
} as const;

/** The sheets the dossier workbook adds after the proposal's, before one sheet per axis. */
export const DOSSIER_SHEET = {
  monthly: "Monthly cash flow",
  paybackGrid: "Payback grid",
  sensitivity: "Sensitivity",
  uncertainty: "Uncertainty",
  axisIndex: "Axis sheets",
} as const;
