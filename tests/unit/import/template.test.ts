import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { IMPORT_FIELDS } from "@/lib/import/fields";
import { matchHeaders } from "@/lib/import/headers";
import { readWorkbook } from "@/lib/import/read";
import { templateCsv, templateHeaders, templateXlsx } from "@/lib/import/template";
import { validateRows } from "@/lib/import/validate";

const site = { hoursPerYear: 5000, ambientC: 30 };

describe("template headers", () => {
  it("one column per field: `Label [unit]`, or the label alone for a unitless field", () => {
    const headers = templateHeaders();
    expect(headers).toHaveLength(IMPORT_FIELDS.length);
    expect(headers.slice(0, 5)).toEqual([
      "Machine",
      "Axis label",
      "Quantity",
      "Rotor teeth",
      "Holding torque [N·m]",
    ]);
    expect(headers).toContain("Phase inductance [mH]");
    expect(headers).toContain("Speed [rpm]");
    expect(headers).toContain("Step mode");
    expect(headers).toContain("Mechanism");
    expect(headers).toContain("Screw lead [mm]");
    expect(headers).toContain("Rotor inertia [kg·m²]");
    expect(headers).toContain("Downtime per step-loss event [min]");
    expect(headers).toContain("Cost per step-loss event");
  });
});

describe("template round trip: read back and validated, 2 valid rows (typed duty, and a mechanism with its move) and no error", () => {
  it("xlsx", async () => {
    const { kind, sheets } = await readWorkbook(await templateXlsx(), "template.xlsx");
    expect(kind).toBe("xlsx");
    expect(sheets.map((s) => s.name)).toEqual(["Axes", "Help"]);
    const result = validateRows(sheets[0], matchHeaders(sheets[0].headers), site);
    expect(result.errors).toEqual([]);
    expect(result.rowsRead).toBe(2);
    expect(result.rows).toHaveLength(2);
    expect(result.rows[0]).toMatchObject({
      machineName: "Carton erector 2",
      label: "X feed",
      holdingTorqueNm: 1.26,
      motion: null,
      event: null,
    });
    expect(result.rows[1]).toMatchObject({
      label: "Z lift",
      motion: { mechanism: "screw", leadMm: 10, inclineDeg: 90 },
      event: { scrapParts: 3, scrapCostPerPart: "4.8" },
      costPerEvent: "0",
    });
  });

  it("csv", async () => {
    const text = templateCsv();
    expect(text.startsWith("\uFEFFMachine,Axis label,")).toBe(true);
    expect(text.split("\r\n")).toHaveLength(4);
    const { kind, sheets } = await readWorkbook(Buffer.from(text, "utf8"), "template.csv");
    expect(kind).toBe("csv");
    const result = validateRows(sheets[0], matchHeaders(sheets[0].headers), site);
    expect(result.errors).toEqual([]);
    expect(result.rows).toHaveLength(2);
    expect(result.rows[0]).toMatchObject({ costPerEvent: "250.00", thermalResistanceKPerW: null });
    expect(result.rows[1]).toMatchObject({
      motion: { mechanism: "screw", stroke: 150, moveTimeS: 0.5 },
      event: { downtimeMinutes: 20, scrapCostPerPart: "4.80" },
    });
  });
});

describe("template workbook layout", () => {
  it("bold header, widths, no formulas; a Help sheet with unit, units accepted, required, default and help", async () => {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await templateXlsx()) as unknown as ArrayBuffer);
    const axes = workbook.getWorksheet("Axes") as ExcelJS.Worksheet;
    expect(axes.getRow(1).getCell(1).font?.bold).toBe(true);
    expect(axes.getColumn(5).width).toBeGreaterThanOrEqual("Holding torque [N·m]".length);
    let formulas = 0;
    workbook.eachSheet((sheet) =>
      sheet.eachRow((row) =>
        row.eachCell((cell) => (formulas += cell.type === ExcelJS.ValueType.Formula ? 1 : 0)),
      ),
    );
    expect(formulas).toBe(0);

    const help = workbook.getWorksheet("Help") as ExcelJS.Worksheet;
    expect(help.rowCount).toBe(IMPORT_FIELDS.length + 1);
    const rowOf = (header: string) => {
      for (let r = 2; r <= help.rowCount; r++) {
        const values = (help.getRow(r).values as unknown[]).slice(1);
        if (values[0] === header) return values;
      }
      throw new Error(`no help row for ${header}`);
    };
    expect(rowOf("Holding torque [N·m]")).toEqual([
      "Holding torque [N·m]",
      "N·m",
      "N·m, mN·m, ozf·in, lbf·in, lbf·ft, kgf·cm",
      "yes",
      "none: required",
      "Datasheet holding torque of the motor: both phases on at rated current, at standstill.",
    ]);
    expect(rowOf("Hours per year [h]").slice(3, 5)).toEqual(["no", "the site's value"]);
    expect(rowOf("Microsteps").slice(3, 5)).toEqual(["no", "16"]);
    expect(rowOf("Step mode")[5]).toMatch(/One of: full, half, half-compensated, micro\.$/);
  });
});
