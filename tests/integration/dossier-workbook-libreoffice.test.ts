import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { buildDossier } from "@/lib/dossier";
import { caseInputSchema } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { DEFAULT_RANGES } from "@/lib/validations/dossier";
import { buildDossierWorkbook } from "@/lib/workbook";
import {
  recalculateWithLibreOffice,
  sofficeVersion,
  withoutCachedFormulaValues,
} from "@/tests/support/libreoffice";

// LibreOffice Calc recalculates the dossier workbook's own formulas — the months as twelfths of
// the Cash flow sheet's yearly flows, and the percentiles as SMALL() over the draws — with every
// cached value removed first, and must land on the engine's figures.
const cellValue = (cell: ExcelJS.Cell): unknown => {
  const v = cell.value as { result?: unknown } | unknown;
  return v !== null && typeof v === "object" && "result" in v ? v.result : v;
};

describe("the dossier workbook in LibreOffice Calc", () => {
  it("recalculates the monthly cash flow and the P10/P50/P90 to the engine's figures", async () => {
    sofficeVersion();
    const input = caseInputSchema.parse(fixtureCase);
    const dossier = buildDossier(input, { seed: 4242, ...DEFAULT_RANGES });
    const file = await buildDossierWorkbook(input, dossier, {
      title: "Dossier",
      accountName: "Invented",
      siteName: "Invented",
      caseName: "Invented",
      version: 1,
      engineVersion: dossier.result.engineVersion,
      generatedAt: "2025-01-15T09:30:00.000Z",
    });
    const calc = new ExcelJS.Workbook();
    await calc.xlsx.load(
      recalculateWithLibreOffice(await withoutCachedFormulaValues(file)) as unknown as ArrayBuffer,
    );

    const monthly = calc.getWorksheet("Monthly cash flow")!;
    dossier.monthly.rows.forEach((m, i) => {
      const row = monthly.getRow(i + 2);
      expect(row.getCell(1).value).toBe(m.month);
      // Money to the cent.
      expect(Math.abs(Number(cellValue(row.getCell(3))) - Number(m.flow))).toBeLessThan(0.005);
      expect(Math.abs(Number(cellValue(row.getCell(4))) - Number(m.cumulative))).toBeLessThan(
        0.005,
      );
    });

    const uncertainty = calc.getWorksheet("Uncertainty")!;
    let found = 0;
    uncertainty.eachRow((row) => {
      const label = row.getCell(1).value;
      const q = dossier.uncertainty.percentiles.find((p) => label === `P${p.p}`);
      if (!q) return;
      found++;
      const npv = Number(cellValue(row.getCell(6)));
      expect(Math.abs(new Money(npv).minus(q.npv).toNumber())).toBeLessThan(0.005);
      expect(Number(cellValue(row.getCell(7)))).toBeCloseTo(q.paybackYears!, 9);
    });
    expect(found).toBe(3);
    // LibreOffice's start-up and the 1,000 draws take most of vitest's default 30 s on a shared
    // machine; the workbook test beside this one allows the same.
  }, 180_000);
});
