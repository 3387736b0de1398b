import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { caseInputSchema, evaluateParsedCase } from "@/lib/engine";
import { buildProposalWorkbook } from "@/lib/workbook";
import { PAYBACK_STATUS_LABELS } from "@/lib/glossary";
import { asStoredV1Result } from "@/tests/support/stored-v1-result";
import { definedNameTarget } from "@/tests/support/libreoffice";
import { META, buildWorkbookOf, formulaOf, sheetOf } from "./fixture-workbook";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;

/** SLN(cost, salvage, life) = (cost − salvage)/life — LibreOffice Calc help, SLN. */
const sln = (cost: number, salvage: number, life: number) => (cost - salvage) / life;

const cachedByName = (workbook: ExcelJS.Workbook, name: string) => {
  const { sheet, address } = definedNameTarget(workbook, name);
  return sheetOf(workbook, sheet).getCell(address).result;
};

describe("straight-line depreciation against LibreOffice's SLN (docs/model.md (Sources of the check values))", () => {
  it("the definition: SLN(50000, 3500, 84) = 553.57 a month (LibreOffice Calc help's example, from memory)", () => {
    expect(sln(50000, 3500, 84).toFixed(2)).toBe("553.57");
  });

  it("the workbook depreciates the whole capex with no salvage value: SLN(Capex, 0, years), then nothing", async () => {
    const raw = structuredClone(fixtureCase) as Json;
    Object.assign(raw.finance, { taxRatePct: 25, depreciationYears: 3 });
    const { workbook, result } = await buildWorkbookOf(raw);
    const sheet = sheetOf(workbook, "Cash flow");
    expect(formulaOf(sheet.getCell("C60"))).toBe("SLN(Capex,0,Depreciation_Years)");
    const perYear = sln(Number(result.totals.capex), 0, 3);
    expect(cachedByName(workbook, "Depreciation_PerYear")).toBeCloseTo(perYear, 9);
    // The depreciation row of the value-by-source block: years 1..3, then 0 (horizon 5).
    const row = [1, 2, 3, 4, 5].map((t) => sheet.getCell(67, 2 + t).result);
    expect(row).toEqual([perYear, perYear, perYear, 0, 0]);
    // The engine taxes the flow less the same amount: tax_t = −0.25·(P_t − SLN) for t ≤ 3.
    const s = result.scenarios.physics;
    for (let t = 1; t <= 5; t++) {
      const tax = Number(s.bySource.tax[t - 1]);
      const beforeTax = Number(s.cashFlows[t]) - tax;
      expect(tax).toBeCloseTo(-0.25 * (beforeTax - (t <= 3 ? perYear : 0)), 9);
    }
  });
});

describe("a proposal issued by engine v1 keeps a workbook (docs/model.md: stored results keep their version)", () => {
  it("builds from a stored v1 result without value by source, payback status or break-even", async () => {
    const input = caseInputSchema.parse(fixtureCase);
    const v1 = asStoredV1Result(evaluateParsedCase(input));
    expect((v1.scenarios.physics as { bySource?: unknown }).bySource).toBeUndefined();
    const xlsx = await buildProposalWorkbook(input, v1, { ...META, engineVersion: "1.0.0" });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(xlsx as unknown as ArrayBuffer);
    expect(workbook.worksheets.map((s) => s.name)).toEqual([
      "Summary",
      "Axes",
      "Cash flow",
      "Assumptions",
      "Cautions",
    ]);
    // The stored figures are what the cached values show.
    expect(cachedByName(workbook, "NPV_Physics")).toBe(Number(v1.scenarios.physics.npv));
    expect(cachedByName(workbook, "PaybackStatus_Physics")).toBe(PAYBACK_STATUS_LABELS.reached);
    // The value-by-source rows are worked out from the v1 totals and add up to its flows.
    const sheet = sheetOf(workbook, "Cash flow");
    for (let t = 1; t <= input.finance.horizonYears; t++) {
      let sum = 0;
      for (let row = 70; row <= 76; row++) sum += sheet.getCell(row, 2 + t).result as number;
      expect(sum).toBeCloseTo(Number(v1.scenarios.physics.cashFlows[t]), 6);
    }
  });
});
