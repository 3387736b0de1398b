import type { Band } from "@/lib/engine";
import { formatNumber } from "./format";

export type BandPosition = Band;

/** Where a saving lands against the claimed band; both ends count as inside (docs/model.md (Energy and cooling)). */
export function bandPosition(savingPct: number, band: { lowPct: number; highPct: number }): Band {
  if (savingPct < band.lowPct) return "below";
  if (savingPct > band.highPct) return "above";
  return "within";
}

const POSITION_WORDS: Record<Band, string> = {
  below: "below",
  within: "within",
  above: "above",
};

/** "32.7 % of today's energy saved — within the 25–50 % band". */
export function bandPositionText(
  savingPct: number | null,
  band: { lowPct: number; highPct: number },
): string {
  const range = `the ${formatNumber(band.lowPct)}–${formatNumber(band.highPct)} % band`;
  if (savingPct === null) return `No energy today to compare with ${range}`;
  const position = bandPosition(savingPct, band);
  // 24.996 % is below a 25 % band yet rounds to "25.0"; the words then say which side it is on.
  const shown = formatNumber(savingPct, 1);
  const edge = [band.lowPct, band.highPct].find((e) => formatNumber(e, 1) === shown);
  const figure =
    position !== "within" && edge !== undefined
      ? `Just ${position === "below" ? "under" : "over"} ${formatNumber(edge)} %`
      : `${shown} %`;
  return `${figure} of today's energy saved — ${POSITION_WORDS[position]} ${range}`;
}

/** Per-axis band position in words, from the engine's own verdict. */
export function axisBandText(band: Band): string {
  switch (band) {
    case "below":
      return "Saves less than the claimed band";
    case "within":
      return "Saving within the claimed band";
    case "above":
      return "Saves more than the claimed band";
  }
}
