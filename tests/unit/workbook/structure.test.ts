import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { LOOP_STATUS_LABELS, PAYBACK_STATUS_LABELS, RECORD_KEY_HEADER } from "@/lib/glossary";
import { definedNameTarget, xlsxPart } from "@/tests/support/libreoffice";
import { buildWorkbookOf, formulaOf, sheetOf } from "./fixture-workbook";

const REQUIRED_NAMES = {
  Capex: { sheet: "Cash flow", address: "C50" },
  EnergySaved_kWh: { sheet: "Cash flow", address: "C51" },
  NPV_Physics: { sheet: "Cash flow", address: "C37" },
  IRR_Physics: { sheet: "Cash flow", address: "C38" },
  Payback_Physics: { sheet: "Cash flow", address: "C39" },
  NPV_BandLow: { sheet: "Cash flow", address: "I37" },
  NPV_BandHigh: { sheet: "Cash flow", address: "O37" },
  // docs/model.md (The business case), engine v2.
  PaybackStatus_Physics: { sheet: "Cash flow", address: "C43" },
  BreakEven_Tariff: { sheet: "Cash flow", address: "C45" },
  BreakEven_StepLossFactor: { sheet: "Cash flow", address: "C47" },
  Depreciation_PerYear: { sheet: "Cash flow", address: "C60" },
};

describe("proposal workbook structure (issue 5)", () => {
  it("has the five sheets a finance reviewer reads, in reading order", async () => {
    const { workbook } = await buildWorkbookOf();
    expect(workbook.worksheets.map((s) => s.name)).toEqual([
      "Summary",
      "Axes",
      "Cash flow",
      "Assumptions",
      "Cautions",
    ]);
  });

  it("defines the workbook-level names of issue 5 on single cells that hold formulas", async () => {
    const { workbook } = await buildWorkbookOf();
    for (const [name, target] of Object.entries(REQUIRED_NAMES)) {
      expect(definedNameTarget(workbook, name), name).toEqual(target);
      formulaOf(sheetOf(workbook, target.sheet).getCell(target.address));
    }
    const formula = (name: keyof typeof REQUIRED_NAMES) =>
      formulaOf(sheetOf(workbook, "Cash flow").getCell(REQUIRED_NAMES[name].address));
    expect(formula("Capex")).toMatch(
      /^SUM\(Axes!\$[A-Z]+\$3:\$[A-Z]+\$5\)\+SUM\(Assumptions!\$C\$\d+:\$C\$\d+\)\*DowntimeCost_PerHour\+ProjectOneTimeCost$/,
    );
    expect(formula("EnergySaved_kWh")).toMatch(/^SUM\(Axes!/);
    expect(formula("NPV_Physics")).toBe("NPV(DiscountRate_Pct/100,C4:C33)+C3");
    expect(formula("NPV_BandLow")).toBe("NPV(DiscountRate_Pct/100,I4:I33)+I3");
    expect(formula("NPV_BandHigh")).toBe("NPV(DiscountRate_Pct/100,O4:O33)+O3");
    expect(formula("IRR_Physics")).toContain("IRR(C3:C33,C42)");
    expect(formulaOf(sheetOf(workbook, "Cash flow").getCell("C42"))).toContain(
      "SUMPRODUCT($A$4:$A$33,C4:C33)",
    );
    expect(formula("Payback_Physics")).toContain("MIN(G4:G33)");
  });

  it("names every input the formulas read, on the Assumptions sheet", async () => {
    const { workbook, input } = await buildWorkbookOf();
    const value = (name: string) => {
      const { sheet, address } = definedNameTarget(workbook, name);
      expect(sheet).toBe("Assumptions");
      return sheetOf(workbook, sheet).getCell(address).value;
    };
    expect(value("Tariff")).toBe(0.24);
    expect(value("TariffEscalation_Pct")).toBe(input.finance.tariffEscalationPct);
    expect(value("DiscountRate_Pct")).toBe(8);
    expect(value("Horizon_Years")).toBe(5);
    expect(value("LabourRate_PerHour")).toBe(85);
    expect(value("DowntimeCost_PerHour")).toBe(400);
    expect(value("ProjectOneTimeCost")).toBe(1500);
    expect(value("AnnualServiceCost")).toBe(120);
    expect(value("BandLow_Pct")).toBe(25);
    expect(value("BandHigh_Pct")).toBe(50);
    // Engine v2 finance inputs, at their schema defaults in the fixture.
    expect(value("Inflation_Pct")).toBe(0);
    expect(value("TaxRate_Pct")).toBe(0);
    expect(value("Depreciation_Years")).toBe(5);
  });

  it("caches the engine's figures beside the formulas, for viewers that do not calculate", async () => {
    const { workbook, result } = await buildWorkbookOf();
    const cached = (name: string) => {
      const { sheet, address } = definedNameTarget(workbook, name);
      return sheetOf(workbook, sheet).getCell(address).result;
    };
    expect(cached("Capex")).toBe(5649.1);
    expect(cached("NPV_Physics")).toBe(Number(result.scenarios.physics.npv));
    expect(cached("IRR_Physics")).toBe(result.scenarios.physics.irr);
    expect(cached("Payback_Physics")).toBe(result.scenarios.physics.paybackYears);
    expect(cached("NPV_BandHigh")).toBe(Number(result.scenarios.bandHigh.npv));
    expect(cached("PaybackStatus_Physics")).toBe(
      PAYBACK_STATUS_LABELS[result.scenarios.physics.paybackStatus],
    );
    const tariff = result.breakEven.tariffPerKWh;
    expect(cached("BreakEven_Tariff")).toBe(tariff === null ? "none" : Number(tariff));
  });

  it("shows money in the case's currency, freezes the header rows and prints landscape one page wide", async () => {
    const { workbook, xlsx } = await buildWorkbookOf();
    const cashFlow = sheetOf(workbook, "Cash flow");
    expect(cashFlow.getCell("C37").numFmt).toBe('#,##0.00 "EUR";-#,##0.00 "EUR"');
    expect(cashFlow.getCell("C38").numFmt).toBe("0.00%");
    const frozen = {
      Summary: [1, 0],
      Axes: [2, 2],
      "Cash flow": [2, 1],
      Assumptions: [1, 0],
      Cautions: [1, 0],
    };
    for (const [name, [rows, columns]] of Object.entries(frozen)) {
      const sheet = sheetOf(workbook, name);
      expect(sheet.views[0], name).toMatchObject({
        state: "frozen",
        ySplit: rows,
        xSplit: columns,
      });
      expect(sheet.pageSetup, name).toMatchObject({
        orientation: "landscape",
        fitToPage: true,
        fitToWidth: 1,
        fitToHeight: 0,
      });
    }
    expect(sheetOf(workbook, "Axes").getColumn(2).width).toBeGreaterThan(20);
    expect(xlsxPart(xlsx, "xl/workbook.xml")).toContain("_xlnm.Print_Titles");
  });

  it("writes a currency without minor units without decimals", async () => {
    const raw = structuredClone((await import("@/tests/fixtures/engine-hand-case.json")).default);
    raw.currency = "JPY";
    const { workbook } = await buildWorkbookOf(raw);
    expect(sheetOf(workbook, "Cash flow").getCell("C37").numFmt).toBe('#,##0 "JPY";-#,##0 "JPY"');
  });

  it("lists every finance, margins, band, sensitivity and thermal input with a unit and a source note", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Assumptions");
    const rows = new Map<string, { value: ExcelJS.CellValue; unit: string; source: string }>();
    sheet.eachRow((row) => {
      const path = row.getCell(7).value;
      if (typeof path === "string" && /^(finance|margins|band|sensitivity|thermal)\./.test(path))
        rows.set(path, {
          value: row.getCell(3).value,
          unit: String(row.getCell(4).value ?? ""),
          source: String(row.getCell(6).value),
        });
    });
    const expected = [
      "finance.tariffPerKWh",
      "finance.tariffEscalationPct",
      "finance.discountRatePct",
      "finance.horizonYears",
      "finance.laborRatePerHour",
      "finance.downtimeCostPerHour",
      "finance.projectOneTimeCost",
      "finance.annualServiceCost",
      "finance.coolingCop",
      "finance.gridKgCo2PerKWh",
      "finance.inflationPct",
      "finance.taxRatePct",
      "finance.depreciationYears",
      "margins.openLoopRequiredPct",
      "margins.closedLoopRequiredPct",
      "band.lowPct",
      "band.highPct",
      "sensitivity.swingPct",
      "thermal.lifeHalvingK",
    ];
    expect([...rows.keys()].sort()).toEqual([...expected].sort());
    for (const [path, row] of rows) {
      expect(row.source, path).toMatch(
        /^(published source: |common practice|estimate — replace with the customer's figure)/,
      );
      expect(row.value, path).not.toBeNull();
    }
  });

  it("carries the product's cautions and one per axis that holds a load at standstill", async () => {
    const { workbook } = await buildWorkbookOf();
    const texts: string[][] = [];
    sheetOf(workbook, "Cautions").eachRow((row) =>
      texts.push([1, 2, 3, 4, 5].map((c) => String(row.getCell(c).value ?? ""))),
    );
    const all = texts.map((t) => t.join(" | ")).join("\n");
    expect(all).toContain("isolate and lock out");
    expect(all).toContain("brake and a safe-stop");
    expect(all).toContain("not measurements");
    expect(all).toContain("estimates from the stated assumptions");
    // The axis by its label and machine, as the app names it; its record key in the last column.
    expect(texts[0]).toEqual([
      "Axis",
      "Machine",
      "Caution",
      "What it means",
      "Axis record key (technical)",
    ]);
    expect(
      texts.filter(
        (t) =>
          t[0] === "Vertical Z" &&
          t[1] === "Invented pick-and-place cell" &&
          t[2] === "Standstill load torque" &&
          t[4] === "M1-Z",
      ),
    ).toHaveLength(1);
  });

  it("writes each axis's statuses, gains and warnings in words on the Axes sheet", async () => {
    const { workbook, result } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Axes");
    const headers = (sheet.getRow(2).values as ExcelJS.CellValue[]).map((v) => String(v ?? ""));
    const column = (header: string, group: string) => {
      const groups = sheet.getRow(1);
      let current = "";
      for (let c = 1; c < headers.length; c++) {
        current = String(groups.getCell(c).value ?? current) || current;
        if (current === group && headers[c] === header) return c;
      }
      throw new Error(`no column ${group} / ${header}`);
    };
    const z = sheet.getRow(4);
    expect(z.getCell(1).value).toBe("Vertical Z");
    expect(z.getCell(column(RECORD_KEY_HEADER.axis, "Axis")).value).toBe("M1-Z");
    expect(z.getCell(column("Status", "Open loop today")).value).toBe(
      LOOP_STATUS_LABELS[result.axes[1].openLoop.status],
    );
    expect(z.getCell(column("Status", "Closed loop")).value).toBe(
      LOOP_STATUS_LABELS[result.axes[1].closedLoop.status],
    );
    expect(z.getCell(column("Torque freed (N·m)", "Gains, one unit")).value).toBe(
      result.axes[1].savings.torqueFreedNm,
    );
    expect(z.getCell(column("Phase inductance (H)", "Motor")).value).toBeCloseTo(0.0025, 12);
    expect(String(z.getCell(column("Warnings", "Warnings")).value)).toMatch(
      /holds a load at standstill/,
    );
    expect(
      formulaOf(z.getCell(column("Up-front cost, one unit", "Money and totals (formulas)"))),
    ).toMatch(/\*LabourRate_PerHour\+/);
  });
});
