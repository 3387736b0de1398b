import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { AXIS_FIELDS } from "@/lib/fields";
import { styleHeader, styleSection } from "./formats";
import { safeText } from "./safe-text";
import { CAUTION_CODES, GENERAL_CAUTIONS, axisCautionText } from "./warning-text";

const CAUTION_TITLE: Record<(typeof CAUTION_CODES)[number], string> = {
  HOLDING_LOAD: AXIS_FIELDS.holdTorqueNm.label,
  OL_WINDING_OVER_CLASS: "Winding above its insulation class today",
  CL_WINDING_OVER_CLASS: "Winding above its insulation class closed loop",
  OL_THERMAL_RUNAWAY: "No steady winding temperature today",
  CL_THERMAL_RUNAWAY: "No steady winding temperature closed loop",
  CL_KIT_UNDERSIZED: "Kit undersized",
};

/**
 * The cautions of the product brief, then one row per axis and caution (HOLDING_LOAD, winding
 * over class, thermal runaway, undersized kit). The product defers to local codes and licensed
 * practice; so does this sheet.
 */
export function writeCautionsSheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): void {
  sheet.columns = [{ width: 16 }, { width: 30 }, { width: 42 }, { width: 110 }];
  styleHeader(sheet.addRow(["Axis id", "Label", "Caution", "What it means"]));
  for (const c of GENERAL_CAUTIONS) {
    const row = sheet.addRow(["All axes", "", c.topic, c.text]);
    row.alignment = { wrapText: true, vertical: "top" };
  }

  let perAxis = 0;
  result.axes.forEach((axis, i) => {
    const parsed = input.axes[i];
    for (const code of CAUTION_CODES) {
      if (!axis.warnings.includes(code)) continue;
      const row = sheet.addRow([
        safeText(axis.id),
        safeText(parsed.label),
        CAUTION_TITLE[code],
        axisCautionText(code, axis, parsed.motor.insulationClass),
      ]);
      row.alignment = { wrapText: true, vertical: "top" };
      perAxis++;
    }
  });
  if (perAxis === 0) {
    sheet.addRow([]);
    styleSection(sheet.addRow(["No axis of this case carries a caution of its own."]).getCell(1));
  }
}
