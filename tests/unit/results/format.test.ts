import { describe, expect, it } from "vitest";
import {
  formatIrr,
  formatMoney,
  formatMoneyChange,
  formatPayback,
  moneyToChartNumber,
} from "@/lib/results/format";

describe("money and figures on screen", () => {
  it("rounds money half-even to the currency's minor unit before display (ENGINE.md §1)", () => {
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

  it("reads payback in months under two years and says when it is not reached", () => {
    expect(formatPayback(0.3459)).toBe("4 months");
    expect(formatPayback(0)).toBe("immediate");
    expect(formatPayback(3.26)).toBe("3.3 years");
    expect(formatPayback(null, 5)).toBe("not within 5 years");
  });

  it("shows the IRR, a rate, in percent", () => {
    expect(formatIrr(0.1234)).toBe("12.3 %");
    expect(formatIrr(null)).toBe("no rate of return");
  });
});
