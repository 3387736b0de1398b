import Decimal from "decimal.js";
import type { Draw } from "@/lib/dossier";

export interface HistogramBin {
  /** Lower and upper edge of the bin, rounded money as chart numbers. */
  from: number;
  to: number;
  count: number;
}

/**
 * The draws' NPVs in equal-width bins for the histogram. Decimal for the edges and the sorting
 * into bins, so that a draw on an edge lands where the table says; the chart gets doubles.
 */
export function npvHistogram(draws: readonly Draw[], binCount = 24): HistogramBin[] {
  if (draws.length === 0) return [];
  const values = draws.map((d) => new Decimal(d.npv));
  const min = Decimal.min(...values);
  const max = Decimal.max(...values);
  const width = max.minus(min).div(binCount);
  const bins: HistogramBin[] = Array.from({ length: binCount }, (_, i) => ({
    from: min.plus(width.times(i)).toNumber(),
    to: min.plus(width.times(i + 1)).toNumber(),
    count: 0,
  }));
  for (const v of values) {
    const i = width.isZero()
      ? 0
      : Math.min(binCount - 1, v.minus(min).div(width).floor().toNumber());
    bins[i].count++;
  }
  return bins;
}

/** Tone of a payback cell: within the first third of the horizon, within it, or beyond it. */
export function paybackTone(years: number | null, horizonYears: number): "good" | "fair" | "late" {
  if (years === null) return "late";
  return years <= horizonYears / 3 ? "good" : "fair";
}
