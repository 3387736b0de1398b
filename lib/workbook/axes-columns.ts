import { AXIS_INPUT_COLUMNS } from "./axes-input-columns";
import { AXIS_MONEY_COLUMNS } from "./axes-money-columns";
import { AXIS_MOTION_COLUMNS } from "./axes-motion-columns";
import { AXIS_RESULT_COLUMNS } from "./axes-result-columns";
import type { AxisColumn } from "./axis-column";

/**
 * The columns of the Axes sheet, left to right: the inputs of each axis, its mechanism and move
 * when it was sized from them, its per-axis results
 * (one unit), and the money and totals columns that the Cash flow sheet sums.
 */
export const AXIS_COLUMNS: readonly AxisColumn[] = [
  ...AXIS_INPUT_COLUMNS,
  ...AXIS_MOTION_COLUMNS,
  ...AXIS_RESULT_COLUMNS,
  ...AXIS_MONEY_COLUMNS,
];
