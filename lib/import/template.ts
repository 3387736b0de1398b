import ExcelJS from "exceljs";
import { csvField } from "./csv";
import { IMPORT_FIELDS, type ImportField, type ImportFieldKey } from "./fields";
import { headerFor } from "./headers";
import { supportedUnits } from "./units";

/** An invented axis of NEMA 23 class, in the template's (SI) units; blank = left to its default. */
const EXAMPLE: Record<ImportFieldKey, number | string> = {
  machine: "Carton erector 2",
  label: "X feed",
  quantity: 2,
  rotorTeeth: 50,
  holdingTorqueNm: 1.26,
  ratedCurrentA: 2.8,
  phaseResistanceOhm: 0.9,
  phaseInductanceMh: 2.5,
  thermalResistanceKPerW: "",
  ratedTempRiseK: 80,
  insulationClass: "B",
  hysteresisWPerHz: 0.002,
  eddyWPerHz2: 0.000002,
  busVoltageV: 48,
  currentSettingA: 2.8,
  currentConvention: "peak",
  stepMode: "micro",
  microsteps: 16,
  idleCurrentPct: 50,
  driveEfficiencyPct: 90,
  driveStandbyW: 2,
  hoursPerYear: 4000,
  movePct: 40,
  holdPct: 35,
  speedRpm: 300,
  loadTorqueNm: 0.35,
  peakTorqueNm: 0.6,
  holdTorqueNm: 0.1,
  ambientC: 35,
  stepLossEventsPerYear: 3,
  costPerEvent: "250.00",
  avoidedPct: 90,
};

/** One header per import field, `Label [unit]` or `Label` for a unitless field, in field order. */
export function templateHeaders(): string[] {
  return IMPORT_FIELDS.map(headerFor);
}

function defaultText(field: ImportField): string {
  if (field.required) return "none: required";
  if (field.siteDefault) return "the site's value";
  if (field.default === undefined) return "none: may stay blank";
  return String(field.default);
}

function unitsText(field: ImportField): string {
  const units = supportedUnits(field);
  return units.length === 0 ? "" : units.join(", ");
}

/**
 * The import template as .xlsx: sheet "Axes" with the bold header row and one example row, and
 * sheet "Help" with each column's unit, the units it may be given in, whether it is required,
 * its default and what the value is. Plain values only, no formulas.
 */
export async function templateXlsx(): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const axes = workbook.addWorksheet("Axes", { views: [{ state: "frozen", ySplit: 1 }] });
  const headers = templateHeaders();
  axes.columns = headers.map((header) => ({ header, width: Math.max(12, header.length + 2) }));
  axes.getRow(1).font = { bold: true };
  axes.addRow(
    IMPORT_FIELDS.map((f) => (f.key === "costPerEvent" ? Number(EXAMPLE[f.key]) : EXAMPLE[f.key])),
  );

  const help = workbook.addWorksheet("Help");
  help.columns = [
    { header: "Column", width: 36 },
    { header: "Unit", width: 10 },
    { header: "Units accepted in the header", width: 42 },
    { header: "Required", width: 10 },
    { header: "Default when blank", width: 20 },
    { header: "What it is", width: 100 },
  ];
  help.getRow(1).font = { bold: true };
  for (const field of IMPORT_FIELDS) {
    const choices = field.choices ? ` One of: ${field.choices.join(", ")}.` : "";
    help.addRow([
      headerFor(field),
      field.unit ?? "",
      unitsText(field),
      field.required ? "yes" : "no",
      defaultText(field),
      field.help + choices,
    ]);
  }
  const data = await workbook.xlsx.writeBuffer();
  return Buffer.from(data as ArrayBuffer);
}

/**
 * The import template as CSV: header and example row, CRLF line ends (RFC 4180) and a UTF-8 BOM,
 * without which spreadsheet programs misread "N·m", "Ω" and "°C" as a legacy code page.
 */
export function templateCsv(): string {
  const lines = [
    templateHeaders().map((h) => csvField(h)),
    IMPORT_FIELDS.map((f) => csvField(String(EXAMPLE[f.key]))),
  ];
  return `\uFEFF${lines.map((line) => line.join(",")).join("\r\n")}\r\n`;
}
