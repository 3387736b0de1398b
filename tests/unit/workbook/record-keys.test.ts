import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { buildDossier } from "@/lib/dossier";
import { caseInputSchema } from "@/lib/engine";
import { DOSSIER_SHEET, RECORD_KEY_HEADER } from "@/lib/glossary";
import { DEFAULT_RANGES } from "@/lib/validations/dossier";
import { buildDossierWorkbook } from "@/lib/workbook";
import { META, buildWorkbookOf, sheetOf } from "./fixture-workbook";

// Issue 16, no database ids in labels: the Cautions sheet, the Assumptions sheet's machine table
// and the dossier's axis index name each axis and machine as the app does; where a record key
// stays (formulas match machines by it, or it ties a row to the Axes sheet), its header says so.

const rowTexts = (sheet: ExcelJS.Worksheet): string[][] => {
  const rows: string[][] = [];
  sheet.eachRow((row) => {
    const cells: string[] = [];
    for (let c = 1; c <= row.cellCount; c++) {
      const v = row.getCell(c).value as { text?: string } | string | number | null;
      cells.push(v !== null && typeof v === "object" ? String(v.text ?? "") : String(v ?? ""));
    }
    rows.push(cells);
  });
  return rows;
};

describe("record keys in the workbook", () => {
  it("the Assumptions machine table heads its key as one, with the machine's name beside it", async () => {
    const { workbook } = await buildWorkbookOf();
    const rows = rowTexts(sheetOf(workbook, "Assumptions"));
    const header = rows.findIndex((r) => r[0] === RECORD_KEY_HEADER.machine);
    expect(header, "the machine table's header").toBeGreaterThan(0);
    expect(rows[header][1]).toBe("Machine");
    expect(rows.slice(header + 1, header + 3).map((r) => r.slice(0, 2))).toEqual([
      ["M1", "Invented pick-and-place cell"],
      ["M2", "Invented labeller"],
    ]);
    for (const r of rows) expect(r.join(" | ")).not.toMatch(/\b(Axis|Machine|Kit) id\b/);
  });

  it("the Axes sheet starts with the axis's label and machine, its keys after them", async () => {
    const { workbook } = await buildWorkbookOf();
    const rows = rowTexts(sheetOf(workbook, "Axes"));
    expect(rows[1].slice(0, 4)).toEqual([
      "Axis label",
      "Machine",
      RECORD_KEY_HEADER.axis,
      RECORD_KEY_HEADER.machine,
    ]);
    expect(rows[3].slice(0, 4)).toEqual([
      "Vertical Z",
      "Invented pick-and-place cell",
      "M1-Z",
      "M1",
    ]);
    // The kit by its name, its catalogue key to the right of it; no "… id" header anywhere.
    const kit = rows[1].indexOf("Kit");
    expect(kit, "the Kit column").toBeGreaterThan(3);
    expect(rows[1][kit + 1]).toBe(RECORD_KEY_HEADER.kit);
    for (const r of rows.slice(0, 3))
      expect(r.join(" | ")).not.toMatch(/\b(Axis|Machine|Kit) id\b/);
  });

  it("the dossier's axis index lists axis, machine and sheet first, the key last", async () => {
    const input = caseInputSchema.parse(fixtureCase);
    const dossier = buildDossier(input, { seed: 4242, ...DEFAULT_RANGES });
    const file = await buildDossierWorkbook(input, dossier, {
      ...META,
      engineVersion: dossier.result.engineVersion,
    });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(file as unknown as ArrayBuffer);
    const index = rowTexts(sheetOf(workbook, DOSSIER_SHEET.axisIndex));
    expect(index[0]).toEqual(["Axis", "Machine", "Sheet", RECORD_KEY_HEADER.axis]);
    expect(index[2]).toEqual([
      "Vertical Z",
      "Invented pick-and-place cell",
      "2 Vertical Z",
      "M1-Z",
    ]);
    // The sheet cell still links to the axis's own sheet.
    const link = sheetOf(workbook, DOSSIER_SHEET.axisIndex).getCell("C3").value as {
      hyperlink: string;
    };
    expect(link.hyperlink).toBe("#'2 Vertical Z'!A1");
    for (const name of [DOSSIER_SHEET.axisIndex, "Cautions", "Assumptions", "Axes"])
      for (const r of rowTexts(sheetOf(workbook, name)))
        expect(r.join(" | "), name).not.toMatch(/\b(Axis|Machine) id\b/);
  });
});
