import { describe, expect, it } from "vitest";
import { parseTypedNumber, typedNumberMessage } from "@/lib/validations/typed-number";

const value = (text: string) => {
  const parsed = parseTypedNumber(text);
  return parsed.ok ? parsed.value : parsed.reason;
};

describe("numbers as people type them (lib/validations/typed-number.ts)", () => {
  it("accepts a decimal comma or point", () => {
    expect(value("0,24")).toBe(0.24);
    expect(value("0.24")).toBe(0.24);
    expect(value("12,5")).toBe(12.5);
    expect(value(" 189 ")).toBe(189);
    expect(value("-3,5")).toBe(-3.5);
    expect(value("0,240")).toBe(0.24);
  });

  it("reads grouped thousands when the decimal mark is the other one", () => {
    expect(value("1,234.5")).toBe(1234.5);
    expect(value("1.234,5")).toBe(1234.5);
    expect(value("1,234,567")).toBe(1234567);
    expect(value("1 234,5")).toBe(1234.5);
  });

  it("refuses a lone comma before three digits: a thousand or a decimal", () => {
    expect(value("1,234")).toBe("ambiguous");
    expect(typedNumberMessage("Tariff", "1,234", "ambiguous")).toBe(
      "Tariff: write 1234 or 1.234 — '1,234' could mean either",
    );
  });

  it("refuses what is not a number, and says nothing was typed when empty", () => {
    expect(value("abc")).toBe("not-a-number");
    expect(value("1,2,3")).toBe("not-a-number");
    expect(value("1.2.3,4")).toBe("not-a-number");
    expect(value("")).toBe("empty");
    expect(typedNumberMessage("Tariff", "abc", "not-a-number")).toBe("Tariff: enter a number such as 0.24");
  });
});
