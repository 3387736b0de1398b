export { buildDossier, DOSSIER_SWINGS_PCT, type Dossier } from "./build-dossier";
export type { AxisDetail, StateRow, LoopThermal } from "./axis-detail";
export type { MonthlyCashFlow, MonthRow } from "./monthly";
export { GRID_STEPS_PCT, type PaybackGrid } from "./payback-grid";
export {
  DRAW_COUNT,
  PERCENTILES,
  nearestRank,
  type Draw,
  type Percentile,
  type UncertaintyResult,
} from "./uncertainty";
