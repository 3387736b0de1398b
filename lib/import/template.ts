import ExcelJS from "exceljs";
import { csvField } from "./csv";
import { IMPORT_FIELDS, type ImportField, type ImportFieldKey } from "./fields";
import { headerFor } from "./headers";
import { supportedUnits } from "./units";

type Example = Record<ImportFieldKey, number | string>;

/** Each column's default as the example rows show it (lib/fields), "" where there is none. */
const DEFAULTS = Object.fromEntries(IMPORT_FIELDS.map((f) => [f.key, f.default ?? ""])) as Example;

/**
 * An invented axis of NEMA 23 class, in the template's (SI) units; where it has a field's
 * default the registry's value is written out, so that the example shows it.
 */
const TYPED_EXAMPLE: Example = {
  ...DEFAULTS,
  machine: "Carton erector 2",
  label: "X feed",
  quantity: 2,
  holdingTorqueNm: 1.26,
  ratedCurrentA: 2.8,
  phaseResistanceOhm: 0.9,
  phaseInductanceMh: 2.5,
  thermalResistanceKPerW: "",
  hysteresisWPerHz: 0.002,
  eddyWPerHz2: 0.000002,
  busVoltageV: 48,
  currentSettingA: 2.8,
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
  "motion.mechanism": "",
  "motion.radiusMm": "",
  "motion.leadMm": "",
  "motion.efficiencyPct": "",
  "motion.gearRatio": "",
  "motion.gearEfficiencyPct": "",
  "motion.massKg": "",
  "motion.loadInertiaKgM2": "",
  "motion.motorInertiaKgM2": "",
  "motion.inclineDeg": "",
  "motion.frictionCoeff": "",
  "motion.externalForceN": "",
  "motion.externalTorqueNm": "",
  "motion.stroke": "",
  "motion.moveTimeS": "",
  "motion.accelSharePct": "",
  "motion.dwellTimeS": "",
  "motion.returnMove": "",
  "motion.energizedPct": "",
  "motion.maxInertiaRatio": "",
  "event.downtimeMinutes": "",
  "event.scrapParts": "",
  "event.scrapCostPerPart": "",
  "event.restartLaborHours": "",
};

/**
 * An invented vertical screw axis described by its mechanism and move (docs/model.md (Motion from the mechanism)): the
 * speed, torques and duty shares stay blank and are derived; its step-loss events are costed
 * from what one causes (docs/model.md (The business case)) instead of a cost per event.
 */
const MOTION_EXAMPLE: Example = {
  ...TYPED_EXAMPLE,
  label: "Z lift",
  quantity: DEFAULTS.quantity,
  holdTorqueNm: "",
  movePct: "",
  holdPct: "",
  speedRpm: "",
  loadTorqueNm: "",
  peakTorqueNm: "",
  stepLossEventsPerYear: 4,
  costPerEvent: "",
  "motion.mechanism": "screw",
  "motion.leadMm": 10,
  "motion.massKg": 6,
  "motion.motorInertiaKgM2": 0.000048,
  "motion.loadInertiaKgM2": 0.000012,
  "motion.inclineDeg": 90,
  "motion.frictionCoeff": 0.05,
  "motion.stroke": 150,
  "motion.moveTimeS": 0.5,
  "motion.dwellTimeS": 1.5,
  "event.downtimeMinutes": 20,
  "event.scrapParts": 3,
  "event.scrapCostPerPart": "4.80",
  "event.restartLaborHours": 0.5,
};

const EXAMPLES = [TYPED_EXAMPLE, MOTION_EXAMPLE];

// Money cells go into the workbook as numbers, so that a spreadsheet shows them as amounts.
const xlsxCell = (field: ImportField, value: number | string) =>
  field.type === "money-string" && value !== "" ? Number(value) : value;

/** One header per import field, `Label [unit]` or `Label` for a unitless field, in field order. */
export function templateHeaders(): string[] {
  return IMPORT_FIELDS.map(headerFor);
}

function defaultText(field: ImportField): string {
  if (field.required) return "none: required";
  if (field.requiredUnlessMotion) return "none: required without a mechanism";
  if (field.siteDefault) return "the site's value";
  if (field.default === undefined) return "none: may stay blank";
  return String(field.default);
}

function unitsText(field: ImportField): string {
  const units = supportedUnits(field);
  return units.length === 0 ? "" : units.join(", ");
}

/**
 * The import template as .xlsx: sheet "Axes" with the bold header row and two example rows (typed
 * duty figures, and a mechanism with its move), and
 * sheet "Help" with each column's unit, the units it may be given in, whether it is required,
 * its default and what the value is. Plain values only, no formulas.
 */
export async function templateXlsx(): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const axes = workbook.addWorksheet("Axes", { views: [{ state: "frozen", ySplit: 1 }] });
  const headers = templateHeaders();
  axes.columns = headers.map((header) => ({ header, width: Math.max(12, header.length + 2) }));
  axes.getRow(1).font = { bold: true };
  for (const example of EXAMPLES)
    axes.addRow(IMPORT_FIELDS.map((f) => xlsxCell(f, example[f.key])));

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
      field.required ? "yes" : field.requiredUnlessMotion ? "without a mechanism" : "no",
      defaultText(field),
      field.help + choices,
    ]);
  }
  const data = await workbook.xlsx.writeBuffer();
  return Buffer.from(data as ArrayBuffer);
}

/**
 * The import template as CSV: header and the two example rows, CRLF line ends (RFC 4180) and a UTF-8 BOM,
 * without which spreadsheet programs misread "N·m", "Ω" and "°C" as a legacy code page.
 */
export function templateCsv(): string {
  const lines = [
    templateHeaders().map((h) => csvField(h)),
    ...EXAMPLES.map((example) => IMPORT_FIELDS.map((f) => csvField(String(example[f.key])))),
  ];
  return `\uFEFF${lines.map((line) => line.join(",")).join("\r\n")}\r\n`;
}
