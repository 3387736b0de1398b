import type ExcelJS from "exceljs";
import type { AxisDetail } from "@/lib/dossier";
import { FORMATS, styleHeader, styleSection, styleTitle } from "../formats";
import { safeText } from "../safe-text";

const LOOP = { open: "Open loop (today)", closed: "Closed loop (kit)" } as const;
const STATE = { move: "Moving", hold: "Holding", off: "Off" } as const;

/** A sheet name of at most 31 characters without the characters spreadsheets refuse. */
export function axisSheetName(index: number, label: string): string {
  const clean = safeText(label)
    .replace(/[[\]:*?/\\']/g, " ")
    .replace(/\s+/g, " ")
    .trim();
  return `${index + 1} ${clean}`.slice(0, 31).trim();
}

/** One axis: both loops' torque–speed points, and each state's current, losses and power, temperatures. */
export function writeAxisSheet(sheet: ExcelJS.Worksheet, axis: AxisDetail) {
  sheet.columns = [
    { width: 22 },
    { width: 14 },
    { width: 16 },
    { width: 16 },
    { width: 4 },
    { width: 14 },
    { width: 16 },
    { width: 16 },
  ];
  // Named as the app names it, with its machine; its record key stays in the index's technical column.
  styleTitle(sheet.addRow([`${safeText(axis.label)} (${safeText(axis.machineName)})`]).getCell(1));
  sheet.addRow(["Machine", safeText(axis.machineName)]);
  sheet.addRow(["Quantity", axis.quantity]);
  sheet.addRow(["Speed while moving (rpm)", axis.speedRpm]);
  sheet.addRow(["Load torque, RMS (N·m)", axis.loadTorqueNm]).getCell(2).numFmt = FORMATS.physics;
  sheet.addRow(["Peak torque (N·m)", axis.peakTorqueNm]).getCell(2).numFmt = FORMATS.physics;
  sheet.addRow(["Ambient (°C)", axis.ambientC]);
  sheet.addRow([]);

  styleSection(sheet.addRow(["Torque capability against speed"]).getCell(1));
  styleHeader(
    sheet.addRow([
      "Open loop: speed (rpm)",
      "Torque (N·m)",
      `Usable, −${axis.requiredPct.open} % margin (N·m)`,
      "",
      "",
      "Closed loop: speed (rpm)",
      "Torque (N·m)",
      `Usable, −${axis.requiredPct.closed} % margin (N·m)`,
    ]),
  );
  const { open, closed } = axis.curves;
  for (let i = 0; i < Math.max(open.length, closed.length); i++) {
    const o = open[i];
    const c = closed[i];
    const row = sheet.addRow([
      o?.rpm ?? null,
      o?.torqueNm ?? null,
      o ? o.torqueNm * (1 - axis.requiredPct.open / 100) : null,
      null,
      null,
      c?.rpm ?? null,
      c?.torqueNm ?? null,
      c ? c.torqueNm * (1 - axis.requiredPct.closed / 100) : null,
    ]);
    for (const col of [1, 6]) row.getCell(col).numFmt = FORMATS.whole;
    for (const col of [2, 3, 7, 8]) row.getCell(col).numFmt = FORMATS.physics;
  }
  sheet.addRow([]);

  styleSection(sheet.addRow(["Currents, losses and power per state (one unit)"]).getCell(1));
  styleHeader(
    sheet.addRow([
      "Loop",
      "State",
      "Current (A)",
      "Copper loss (W)",
      "",
      "Iron loss (W)",
      "Electrical input (W)",
    ]),
  );
  for (const s of axis.states) {
    const row = sheet.addRow([
      LOOP[s.loop],
      STATE[s.state],
      s.currentA,
      s.copperLossW,
      null,
      s.ironLossW,
      s.inputPowerW,
    ]);
    for (const col of [3, 4, 6, 7]) row.getCell(col).numFmt = FORMATS.physics;
  }
  sheet.addRow([]);

  styleSection(sheet.addRow(["Temperatures (steady state over the duty mix)"]).getCell(1));
  styleHeader(
    sheet.addRow([
      "Loop",
      "Winding (°C)",
      "Class limit (°C)",
      "Hot resistance (Ω)",
      "",
      "Cabinet heat (W)",
    ]),
  );
  for (const loop of ["open", "closed"] as const) {
    const t = axis.thermal[loop];
    const row = sheet.addRow([
      LOOP[loop],
      t.windingTempC ?? "no steady temperature (thermal runaway)",
      t.classLimitC,
      t.resistanceHotOhm,
      null,
      t.cabinetHeatW,
    ]);
    row.getCell(2).numFmt = FORMATS.pct;
    row.getCell(4).numFmt = FORMATS.physics;
    row.getCell(6).numFmt = FORMATS.physics;
  }
  sheet.addRow([]);
  sheet.addRow([
    "Temperatures are estimates from datasheet values, not measurements; hot surfaces can burn.",
  ]).font = { italic: true };
}
