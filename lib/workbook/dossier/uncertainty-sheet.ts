import type ExcelJS from "exceljs";
import type { Dossier } from "@/lib/dossier";
import { nearestRank } from "@/lib/dossier";
import type { ParsedCase } from "@/lib/engine";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { BEYOND_HORIZON } from "../cash-flow-values";
import { FORMATS, currencyFormat, styleHeader, styleSection, styleTitle } from "../formats";
import { DRIVER_LABEL } from "./tables-sheets";

/**
 * The seed, the ranges, P10/P50/P90 as live SMALL() formulas over the draws (nearest rank), and
 * every draw: its four changes and the engine's NPV and payback for them.
 */
export function writeUncertaintySheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  dossier: Dossier,
) {
  const u = dossier.uncertainty;
  const currency = currencyFormat(input.currency);
  sheet.columns = [
    { width: 26 },
    { width: 16 },
    { width: 16 },
    { width: 16 },
    { width: 16 },
    { width: 20 },
    { width: 20 },
  ];
  styleTitle(sheet.addRow(["Uncertainty analysis"]).getCell(1));
  sheet.addRow(["Seed", u.seed]).font = { bold: true };
  sheet.addRow(["Draws", u.draws.length]);
  sheet.addRow(["Generator", u.generator]);
  sheet.addRow([
    "Method",
    `Each draw changes the four drivers together, each independently and uniformly within its range; the engine evaluates the ${SCENARIO_LABELS.physics.toLowerCase()} for each.`,
  ]);
  sheet.addRow([]);
  styleHeader(sheet.addRow(["Driver", "Low (%)", "High (%)"]));
  for (const driver of ["tariff", "hoursPerYear", "loadTorque", "stepLossEvents"] as const) {
    const r = u.ranges[driver];
    sheet.addRow([DRIVER_LABEL[driver], r.lowPct, r.highPct]);
  }
  const blank = sheet.addRow([]).number;

  // Below: title, header, three percentiles, the count without payback, a blank, the draws' header.
  const drawsHeaderRow = blank + 8;
  const first = drawsHeaderRow + 1;
  const last = first + u.draws.length - 1;
  const npvRange = `$F$${first}:$F$${last}`;
  const paybackRange = `$G$${first}:$G$${last}`;
  styleSection(sheet.addRow(["Percentiles (nearest rank)"]).getCell(1));
  styleHeader(sheet.addRow(["Percentile", "Rank", "", "", "", "NPV", "Payback (years)"]));
  for (const q of u.percentiles) {
    const k = nearestRank(q.p, u.draws.length);
    const row = sheet.addRow([`P${q.p}`, k]);
    const r = row.number;
    row.getCell(6).value = { formula: `SMALL(${npvRange},B${r})`, result: Number(q.npv) };
    // Paybacks beyond the horizon are text, which SMALL skips: they rank after every number.
    row.getCell(7).value = {
      formula: `IF(COUNT(${paybackRange})>=B${r},SMALL(${paybackRange},B${r}),"${BEYOND_HORIZON}")`,
      result: q.paybackYears ?? BEYOND_HORIZON,
    };
    row.getCell(6).numFmt = currency;
    row.getCell(7).numFmt = FORMATS.years;
  }
  sheet.addRow(["Draws without payback", u.drawsWithoutPayback]);
  sheet.addRow([]);
  styleHeader(
    sheet.addRow([
      "Draw",
      "Tariff (%)",
      "Hours (%)",
      "Load torque (%)",
      "Step-loss events (%)",
      "NPV",
      "Payback (years)",
    ]),
  );
  u.draws.forEach((d, i) => {
    const row = sheet.addRow([
      i + 1,
      d.pct.tariff,
      d.pct.hoursPerYear,
      d.pct.loadTorque,
      d.pct.stepLossEvents,
      Number(d.npv),
      d.paybackYears ?? BEYOND_HORIZON,
    ]);
    row.getCell(6).numFmt = currency;
    row.getCell(7).numFmt = FORMATS.years;
  });
}
