import { describe, expect, it } from "vitest";
import type { CaseInput } from "@/lib/engine";
import { vendorRevenue } from "@/lib/pipeline/revenue";
import { sortGroups, sortQuotes, type SortableQuote } from "@/lib/pipeline/sort-quotes";

// Only the fields the revenue reads; the rest of a case does not matter to it.
const caseWith = (
  axes: { quantity: number; retrofit: Record<string, unknown> }[],
  laborRatePerHour?: string,
) =>
  ({
    finance: { tariffPerKWh: "0.2", ...(laborRatePerHour ? { laborRatePerHour } : {}) },
    axes,
  }) as unknown as CaseInput;

describe("the vendor's revenue of a quote", () => {
  it("is kits at list price less discounts, plus installation and commissioning, per unit", () => {
    // Worked by hand: 3 × 1,250.00 = 3,750.00 list; 12.5 % off = 468.75; 3 × 4 h × 62.50 = 750.00;
    // 3 × 180.00 = 540.00 commissioning. 2 × 899.99 = 1,799.98 list, no discount, no labour.
    const r = vendorRevenue(
      caseWith(
        [
          {
            quantity: 3,
            retrofit: {
              kit: { price: "1250.00" },
              discountPct: 12.5,
              installHours: 4,
              commissioningCost: "180.00",
            },
          },
          { quantity: 2, retrofit: { kit: { price: 899.99 } } },
        ],
        "62.50",
      ),
    );
    expect(r).toEqual({
      kitsAtListPrice: "5549.98",
      discounts: "468.75",
      installation: "750",
      commissioning: "540",
      revenue: "6371.23",
    });
  });

  it("adds in exact decimals, not binary doubles", () => {
    // 3 × 0.1 = 0.3 and 10 % of it 0.03, exactly (in doubles 3 × 0.1 is 0.30000000000000004).
    const r = vendorRevenue(
      caseWith([{ quantity: 3, retrofit: { kit: { price: "0.1" }, discountPct: 10 } }]),
    );
    expect(r.revenue).toBe("0.27");
    expect(r.discounts).toBe("0.03");
  });
});

const q = (id: number, over: Partial<SortableQuote>): SortableQuote => ({
  id,
  caseName: "Line",
  version: 1,
  accountName: "A",
  ownerName: "O",
  stage: "sent",
  vendorRevenue: "0",
  value: "0",
  probabilityPct: 0,
  weighted: "0",
  expectedCloseOn: "2026-01-01",
  paybackYears: 1,
  createdAt: "2026-01-01T00:00:00.000Z",
  ...over,
});

describe("sorting the pipeline's tables", () => {
  it("sorts amounts as numbers, not as text", () => {
    const rows = [
      q(1, { vendorRevenue: "900" }),
      q(2, { vendorRevenue: "10000" }),
      q(3, { vendorRevenue: "95.5" }),
    ];
    expect(sortQuotes(rows, "revenue", "asc").map((r) => r.id)).toEqual([3, 1, 2]);
    expect(sortQuotes(rows, "revenue", "desc").map((r) => r.id)).toEqual([2, 1, 3]);
  });

  it("puts a payback that never comes last either way, and breaks ties by id", () => {
    const rows = [
      q(1, { paybackYears: null }),
      q(2, { paybackYears: 3 }),
      q(3, { paybackYears: 1 }),
    ];
    expect(sortQuotes(rows, "payback", "asc").map((r) => r.id)).toEqual([3, 2, 1]);
    expect(sortQuotes(rows, "payback", "desc").map((r) => r.id)).toEqual([2, 3, 1]);
    expect(sortQuotes([q(5, {}), q(4, {})], "owner", "asc").map((r) => r.id)).toEqual([4, 5]);
  });

  it("sorts stage and month sums by any column, or keeps their own order", () => {
    const rows = [
      { key: "a", count: 2, value: "5", revenue: "4", weighted: "1" },
      { key: "b", count: 1, value: "50", revenue: "40", weighted: "0" },
      { key: "c", count: 3, value: "7", revenue: "6", weighted: "3" },
    ];
    expect(sortGroups(rows, "label", "asc").map((r) => r.key)).toEqual(["a", "b", "c"]);
    expect(sortGroups(rows, "label", "desc").map((r) => r.key)).toEqual(["c", "b", "a"]);
    expect(sortGroups(rows, "revenue", "desc").map((r) => r.key)).toEqual(["b", "c", "a"]);
    expect(sortGroups(rows, "count", "asc").map((r) => r.key)).toEqual(["b", "a", "c"]);
    expect(sortGroups(rows, "investment", "asc").map((r) => r.key)).toEqual(["a", "c", "b"]);
  });
});
