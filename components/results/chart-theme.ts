import config from "@/tailwind.config";

/**
 * Chart colours from the Loopshift palette (tailwind.config.ts), so charts and the rest of the
 * screen speak one visual language: copper for open loop today (the hot winding), the brand's
 * blue-green for closed loop, steel for references.
 */
type Shades = Record<string | number, string>;
const colors = config.theme?.extend?.colors as Record<"flux" | "coil" | "steel" | "danger", Shades>;

export const CHART_COLORS = {
  openLoop: colors.coil[500],
  closedLoop: colors.flux[600],
  reference: colors.steel[500],
  operatingPoint: colors.steel[900],
  limit: colors.danger[600],
  bandLow: colors.steel[400],
  bandHigh: colors.coil[400],
  text: colors.steel[700],
  grid: colors.steel[200],
} as const;

/** A nivo theme in our type scale; nivo draws SVG text, so the font is named explicitly. */
export const chartTheme = {
  background: "transparent",
  text: {
    fontFamily: "Lato, ui-sans-serif, system-ui, sans-serif",
    fontSize: 12,
    fill: CHART_COLORS.text,
  },
  axis: {
    domain: { line: { stroke: colors.steel[300], strokeWidth: 1 } },
    ticks: {
      line: { stroke: colors.steel[300], strokeWidth: 1 },
      text: { fontSize: 12, fill: CHART_COLORS.text },
    },
    legend: { text: { fontSize: 13, fontWeight: 700, fill: colors.steel[800] } },
  },
  grid: { line: { stroke: CHART_COLORS.grid, strokeWidth: 1 } },
  markers: { lineColor: colors.steel[500], lineStrokeWidth: 1 },
  tooltip: {
    container: {
      background: "#ffffff",
      color: colors.steel[900],
      fontSize: 13,
      borderRadius: 6,
      boxShadow: "0 1px 2px rgb(18 52 51 / 0.12), 0 4px 14px rgb(18 52 51 / 0.12)",
    },
  },
};
