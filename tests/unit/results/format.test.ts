import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { irr } from "@/lib/engine/finance";
import {
  formatIrr,
  formatMoney,
  formatMoneyChange,
  formatMoneyHeadline,
  formatPayback,
  formatPct,
  moneyToChartNumber,
} from "@/lib/results/format";
import type { Scenario } from "@/lib/engine";
import { irrValue } from "@/lib/workbook/cash-flow-values";

describe("money and figures on screen", () => {
  it("rounds money half-even to the currency's minor unit before display (docs/contracts.md (Numbers and money))", () => {
    expect(formatMoney("0.125", "EUR")).toBe("€0.12");
    expect(formatMoney("0.135", "EUR")).toBe("€0.14");
    expect(formatMoney("5649.1", "EUR")).toBe("€5,649.10");
    expect(formatMoney("1234.5", "JPY")).toBe("JP¥1,234");
    expect(formatMoney("-0.001", "EUR")).toBe("€0.00");
  });

  it("keeps cents exact on amounts a double cannot hold", () => {
    expect(formatMoney("12345678901234567.89", "EUR")).toBe("€12,345,678,901,234,567.89");
  });

  it("signs changes against a reference", () => {
    expect(formatMoneyChange("1200", "EUR")).toBe("+€1,200.00");
    expect(formatMoneyChange("-300.004", "EUR")).toBe("\u2212€300.00");
    expect(formatMoneyChange("0.001", "EUR")).toBe("€0.00");
  });

  it("gives charts the rounded amount", () => {
    expect(moneyToChartNumber("59555.3976979306", "EUR")).toBe(59555.4);
  });

  it("reads payback in whole years and months and says when it is not reached", () => {
    expect(formatPayback(0.3459)).toBe("4 months");
    expect(formatPayback(7 / 12)).toBe("7 months");
    expect(formatPayback(0)).toBe("immediate");
    expect(formatPayback(1 + 4 / 12)).toBe("1 year 4 months");
    expect(formatPayback(2)).toBe("2 years");
    expect(formatPayback(3.26)).toBe("3 years 3 months");
    expect(formatPayback(1.99)).toBe("2 years");
    expect(formatPayback(null, 5)).toBe("not within 5 years");
  });

  it("shows the IRR, a rate, in percent", () => {
    expect(formatIrr({ irr: 0.1234, cashFlows: ["-100", "60", "60"] })).toBe("12.3 %");
  });

  it("tells an IRR beyond the 1,000 % searched from flows that never repay (docs/model.md (The business case))", () => {
    // Repaid fifty times over in a year: the engine finds no root up to 1,000 % and says null.
    const fast = ["-100", "5000", "5000"];
    expect(irr(fast.map((f) => new Decimal(f)))).toBeNull();
    expect(formatIrr({ irr: null, cashFlows: fast })).toBe("over 1,000 %");
    // Costs every year and no income: no rate makes them worth anything.
    const never = ["-100", "-5", "-5"];
    expect(irr(never.map((f) => new Decimal(f)))).toBeNull();
    expect(formatIrr({ irr: null, cashFlows: never })).toBe("no rate of return");
  });

  it("says the same about an IRR as the workbook's cached IRR cell (lib/workbook/cash-flow-values.ts)", () => {
    const cases = [
      { irr: 0.1234, cashFlows: ["-100", "60", "60"] },
      { irr: null, cashFlows: ["-100", "5000", "5000"] },
      { irr: null, cashFlows: ["-100", "-5", "-5"] },
      { irr: null, cashFlows: ["0", "5", "5"] },
    ];
    for (const scenario of cases) {
      const cell = irrValue(scenario as unknown as Scenario);
      const asShown = typeof cell === "number" ? formatPct(cell * 100, 1) : cell;
      expect(asShown).toBe(formatIrr(scenario));
    }
  });

  it("rounds a headline amount to the nearest hundred, half-even", () => {
    expect(formatMoneyHeadline("59555.3976", "EUR")).toBe("€59,600");
    expect(formatMoneyHeadline("1250", "EUR")).toBe("€1,200");
    expect(formatMoneyHeadline("1350", "EUR")).toBe("€1,400");
    expect(formatMoneyHeadline("-4321.5", "GBP")).toBe("\u2212£4,300");
  });
});
