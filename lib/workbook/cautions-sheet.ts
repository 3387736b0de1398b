import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { AXIS_FIELDS } from "@/lib/fields";
import { RECORD_KEY_HEADER } from "@/lib/glossary";
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
 * practice; so does this sheet. Each axis is named as the app names it, with its machine; its
 * record key (the id the Axes sheet lists it under) stays at the right, a technical column.
 */
export function writeCautionsSheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
): void {
  sheet.columns = [{ width: 30 }, { width: 24 }, { width: 42 }, { width: 110 }, { width: 16 }];
  styleHeader(
    sheet.addRow(["Axis", "Machine", "Caution", "What it means", RECORD_KEY_HEADER.axis]),
  );
  for (const c of GENERAL_CAUTIONS) {
    const row = sheet.addRow(["All axes", "", c.topic, c.text, ""]);
    row.alignment = { wrapText: true, vertical: "top" };
  }

  const machineNames = new Map(input.machines.map((m) => [m.id, m.name]));
  let perAxis = 0;
  result.axes.forEach((axis, i) => {
    const parsed = input.axes[i];
    for (const code of CAUTION_CODES) {
      if (!axis.warnings.includes(code)) continue;
      const row = sheet.addRow([
        safeText(parsed.label),
        safeText(machineNames.get(parsed.machineId) ?? ""),
        CAUTION_TITLE[code],
        axisCautionText(code, axis, parsed.motor.insulationClass),
        safeText(axis.id),
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
