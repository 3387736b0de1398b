import { describe, expect, it } from "vitest";
import { columnLetter } from "@/lib/workbook/layout";
import { buildWorkbookOf, formulaOf, sheetOf } from "./fixture-workbook";

// The Cash flow sheet is what a finance reviewer audits: every year of every scenario is a
// formula over the inputs (docs/model.md (The business case)), never a typed number.
describe("Cash flow sheet formulas (docs/model.md (The business case))", () => {
  it("starts each scenario at −Capex and takes every year from the sum of its value by source", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Cash flow");
    // The sum rows of the value-by-source block: physics 77, band low 87, band high 97; year t
    // in column C + t − 1.
    for (const [flow, sumRow] of [
      ["C", 77],
      ["I", 87],
      ["O", 97],
    ] as const) {
      expect(formulaOf(sheet.getCell(`${flow}3`))).toBe("-Capex");
      for (let t = 1; t <= 30; t++) {
        const row = 3 + t;
        expect(sheet.getCell(`A${row}`).value).toBe(t);
        expect(formulaOf(sheet.getCell(`${flow}${row}`))).toBe(
          `IF($A${row}<=Horizon_Years,${columnLetter(2 + t)}${sumRow},0)`,
        );
      }
    }
    expect(formulaOf(sheet.getCell("B4"))).toBe("Tariff*(1+TariffEscalation_Pct/100)^($A4-1)");
  });

  it("builds the value by source from escalation, inflation, tax and straight-line depreciation (docs/model.md (The business case))", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Cash flow");
    const f = (address: string) => formulaOf(sheet.getCell(address));
    // Shared factor rows, year 2 in column D (its t in D63).
    expect(f("D64")).toBe("IF(D$63<=Horizon_Years,(1+TariffEscalation_Pct/100)^(D$63-1),0)");
    expect(f("D65")).toBe("IF(D$63<=Horizon_Years,(1+Inflation_Pct/100)^(D$63-1),0)");
    expect(f("D66")).toBe("1/(1+DiscountRate_Pct/100)^D$63");
    expect(f("D67")).toBe(
      "IF(AND(D$63<=Horizon_Years,D$63<=Depreciation_Years),Depreciation_PerYear,0)",
    );
    // SLN(cost, salvage, life) = (cost − salvage)/life (LibreOffice Calc help, SLN).
    expect(f("C60")).toBe("SLN(Capex,0,Depreciation_Years)");
    // Physics, year 2: rows 70..76 are energy, cooling, reliability, maintenance, throughput,
    // service and tax; 77 their sum.
    expect(f("D70")).toBe("EnergySaved_kWh*Tariff*D$64");
    expect(f("D71")).toBe("CoolingSaved_kWh*Tariff*D$64");
    expect(f("D72")).toBe("Reliability_PerYear*D$65");
    expect(f("D73")).toBe("Maintenance_PerYear*D$65");
    expect(f("D74")).toBe("Throughput_PerYear*D$65");
    expect(f("D75")).toBe("-AnnualServiceCost*D$65");
    expect(f("D76")).toBe("IF(D$63<=Horizon_Years,-TaxRate_Pct/100*(SUM(D70:D75)-D$67),0)");
    expect(f("D77")).toBe("SUM(D70:D76)");
    // Band low: its share of today's drive and cooling energy.
    expect(f("D80")).toBe("BandLow_Pct/100*EnergyOpenLoop_kWh*Tariff*D$64");
    expect(f("D81")).toBe("BandLow_Pct/100*CoolingOpenLoop_kWh*Tariff*D$64");
  });

  it("gives payback status and the break-even values as formulas (docs/model.md (The business case))", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Cash flow");
    const f = (address: string) => formulaOf(sheet.getCell(address));
    expect(f("C43")).toBe(
      'IF(ISNUMBER(C39),"Paid back within the horizon",IF(INDEX(C3:C33,Horizon_Years+1)>0,"Paid back after the horizon","Never paid back"))',
    );
    expect(f("C44")).toBe(
      "(1-TaxRate_Pct/100)*(EnergySaved_kWh+CoolingSaved_kWh)*SUMPRODUCT($C$64:$AF$64,$C$66:$AF$66)",
    );
    expect(f("C45")).toBe(
      'IF(C44<=0,"none",IF(Tariff-NPV_Physics/C44<0,"none",Tariff-NPV_Physics/C44))',
    );
    expect(f("C46")).toBe(
      "(1-TaxRate_Pct/100)*Reliability_PerYear*SUMPRODUCT($C$65:$AF$65,$C$66:$AF$66)",
    );
    expect(f("C47")).toBe('IF(C46<=0,"none",IF(1-NPV_Physics/C46<0,"none",1-NPV_Physics/C46))');
  });

  it("accumulates, discounts and finds the payback year by formula", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Cash flow");
    expect(formulaOf(sheet.getCell("D5"))).toBe("D4+C5");
    expect(formulaOf(sheet.getCell("E5"))).toBe("C5/(1+DiscountRate_Pct/100)^$A5");
    expect(formulaOf(sheet.getCell("F5"))).toBe("F4+E5");
    expect(formulaOf(sheet.getCell("G5"))).toBe(
      'IF(AND($A5<=Horizon_Years,D4<0,D5>=0),$A5-1+(-D4)/C5,"")',
    );
    expect(formulaOf(sheet.getCell("H5"))).toBe(
      'IF(AND($A5<=Horizon_Years,F4<0,F5>=0),$A5-1+(-F4)/E5,"")',
    );
    expect(formulaOf(sheet.getCell("C39"))).toBe(
      'IF(Capex=0,0,IF(COUNT(G4:G33)=0,"beyond the horizon",MIN(G4:G33)))',
    );
    expect(formulaOf(sheet.getCell("C40"))).toBe(
      'IF(Capex=0,0,IF(COUNT(H4:H33)=0,"beyond the horizon",MIN(H4:H33)))',
    );
    expect(formulaOf(sheet.getCell("C41"))).toBe('IF(Capex=0,"n/a",100*SUM(C3:C33)/Capex)');
  });

  it("counts the band scenarios as their fraction of today's drive and cooling energy", async () => {
    const { workbook } = await buildWorkbookOf();
    const sheet = sheetOf(workbook, "Cash flow");
    expect(formulaOf(sheet.getCell("C36"))).toBe("EnergySaved_kWh+CoolingSaved_kWh");
    expect(formulaOf(sheet.getCell("I36"))).toBe(
      "BandLow_Pct/100*(EnergyOpenLoop_kWh+CoolingOpenLoop_kWh)",
    );
    expect(formulaOf(sheet.getCell("O36"))).toBe(
      "BandHigh_Pct/100*(EnergyOpenLoop_kWh+CoolingOpenLoop_kWh)",
    );
    expect(formulaOf(sheet.getCell("C59"))).toBe("C55+C56+C57-C58");
  });

  it("gives the Summary's headline figures as formulas over the Cash flow sheet, not typed numbers", async () => {
    const { workbook } = await buildWorkbookOf();
    const summary = sheetOf(workbook, "Summary");
    const rows = new Map<string, number>();
    summary.eachRow((row, n) => rows.set(String(row.getCell(1).value), n));
    const row = (label: string) => {
      const n = rows.get(label);
      if (n === undefined) throw new Error(`no Summary row "${label}"`);
      return summary.getRow(n);
    };
    expect([2, 3, 4].map((c) => formulaOf(row("NPV").getCell(c)))).toEqual([
      "NPV_Physics",
      "NPV_BandLow",
      "NPV_BandHigh",
    ]);
    expect([2, 3, 4].map((c) => formulaOf(row("IRR").getCell(c)))).toEqual([
      "IRR_Physics",
      "IRR_BandLow",
      "IRR_BandHigh",
    ]);
    expect(formulaOf(row("Payback, simple").getCell(2))).toBe("Payback_Physics");
    expect(formulaOf(row("Up-front cost").getCell(2))).toBe("Capex");
    expect(formulaOf(row("Cash flow in year 1").getCell(3))).toBe("'Cash flow'!$I$4");
    for (const label of [
      "Up-front cost",
      "NPV",
      "IRR",
      "Payback, simple",
      "Payback, discounted",
      "ROI over the horizon",
    ])
      for (const c of [2, 3, 4]) formulaOf(row(label).getCell(c));
  });

  it("keeps every axis's money as formulas over its own row", async () => {
    const { workbook } = await buildWorkbookOf();
    const axes = sheetOf(workbook, "Axes");
    const headers = axes.getRow(2).values as unknown[];
    const at = (header: string) => headers.indexOf(header);
    for (const row of [3, 4, 5]) {
      for (const header of [
        "Up-front cost, one unit",
        "Up-front cost, all units",
        "Drive energy saved, all units (kWh/yr)",
        "Step losses avoided, per year",
      ])
        formulaOf(axes.getRow(row).getCell(at(header)));
    }
    expect(formulaOf(axes.getRow(3).getCell(at("Step losses avoided, per year")))).toMatch(
      /^IF\([A-Z]+3="no",0,/,
    );
  });
});
