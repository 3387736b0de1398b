import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { pipeline, pipelineWinRate } from "@/db/queries/pipeline";
import { ForbiddenError } from "@/lib/errors";
import { PIPELINE_CSV_HEADER, csvField, pipelineCsv } from "@/lib/pipeline/csv";
import { openWeighted, winRate } from "@/lib/pipeline/figures";
import { OPEN_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import { caller } from "../support/callers";
import { parseCsv } from "../support/csv";

const manager = () => caller("manager@example.com");
const engineer = () => caller("engineer@example.com");

describe("the pipeline's figures say what they count (hand-counted fixture)", () => {
  const fixture = [
    { stage: "ready", weighted: "100" },
    { stage: "sent", weighted: "400" },
    { stage: "changes", weighted: "30" },
    { stage: "accepted", weighted: "1000" },
    { stage: "declined", weighted: "0" },
    { stage: "accepted", weighted: "2000" },
    { stage: "replaced", weighted: "0" },
  ] as const;

  it("weights open quotes only: 100 + 400 + 30, not the 3000 already won", () => {
    expect(openWeighted([...fixture])).toBe("530");
  });

  it("counts the win rate over decided quotes only: 2 won of 3 decided", () => {
    const decided = fixture.filter((q) => q.stage === "accepted" || q.stage === "declined");
    const rate = winRate(decided);
    expect([rate.won, rate.lost]).toEqual([2, 1]);
    expect(rate.ratePct).toBeCloseTo(66.667, 2);
  });

  it("on the seeded quotes, the weighted total is the open quotes' sum and the stages add up", () => {
    const data = pipeline(manager());
    for (const t of data.totals) {
      const rows = data.quotes.filter((q) => q.currency === t.currency);
      const open = rows.filter((q) => OPEN_STAGES.includes(q.stage));
      const add = (xs: string[]) => xs.reduce((s, x) => s.plus(x), new Decimal(0));
      expect(new Decimal(t.weighted).eq(add(open.map((q) => q.weighted)))).toBe(true);
      const stages = data.stages.filter((s) => s.currency === t.currency);
      expect(new Decimal(t.value).eq(add(stages.map((s) => s.value)))).toBe(true);
      expect(new Decimal(t.revenue).eq(add(stages.map((s) => s.revenue)))).toBe(true);
      expect(new Decimal(t.revenue).eq(add(rows.map((q) => q.vendorRevenue)))).toBe(true);
      expect(stages.reduce((n, s) => n + s.count, 0)).toBe(rows.length);
    }
    const rate = pipelineWinRate(manager(), { from: "2000-01", to: "2100-12" });
    const decided = data.quotes.filter((q) => q.decidedAt !== null);
    expect(rate.won + rate.lost).toBe(
      decided.filter((q) => q.stage === "accepted" || q.stage === "declined").length,
    );
  });
});

describe("the pipeline as CSV", () => {
  it("quotes fields as RFC 4180 asks", () => {
    expect(csvField("plain")).toBe("plain");
    expect(csvField('Line 2, "north"')).toBe('"Line 2, ""north"""');
    expect(parseCsv(`a,${csvField('x,"y"\r\nz')}\r\n`)).toEqual([["a", 'x,"y"\r\nz']]);
  });

  it("parsed back, has the page's quotes and totals, for each filter and scope", () => {
    for (const who of [manager(), engineer()]) {
      const all = pipeline(who);
      for (const filters of [{}, { stage: all.quotes[0]?.stage }]) {
        const data = pipeline(who, filters);
        const [header, ...rows] = parseCsv(pipelineCsv(data.quotes));
        expect(header).toEqual(PIPELINE_CSV_HEADER);
        expect(rows).toHaveLength(data.quotes.length);
        rows.forEach((r, i) => {
          const q = data.quotes[i];
          expect(r[0]).toBe(q.caseName);
          expect(r[2]).toBe(q.accountName);
          expect(r[5]).toBe(STAGE_LABELS[q.stage]);
          const col = (name: string) => r[PIPELINE_CSV_HEADER.indexOf(name)];
          expect(col("Vendor revenue")).toMatch(/^-?\d+(\.\d+)?$/);
          expect(new Decimal(col("Vendor revenue")).eq(q.vendorRevenue)).toBe(true);
          expect(new Decimal(col("Customer investment")).eq(q.value)).toBe(true);
          expect(new Decimal(col("Weighted revenue")).eq(q.weighted)).toBe(true);
          // The parts in the file rebuild the revenue beside them.
          expect(
            new Decimal(col("Kits at list price"))
              .minus(col("Discounts"))
              .plus(col("Installation"))
              .plus(col("Commissioning"))
              .eq(col("Vendor revenue")),
          ).toBe(true);
        });
        const at = (name: string) => PIPELINE_CSV_HEADER.indexOf(name);
        for (const t of data.totals) {
          const inCurrency = rows.filter((r) => r[at("Currency")] === t.currency);
          const total = (name: string) =>
            inCurrency.reduce((s, r) => s.plus(r[at(name)]), new Decimal(0));
          expect(total("Customer investment").eq(t.value)).toBe(true);
          expect(total("Vendor revenue").eq(t.revenue)).toBe(true);
          expect(inCurrency).toHaveLength(t.count);
        }
        if (who.role === "engineer")
          expect(rows.every((r) => r[4] === data.quotes[0].ownerName)).toBe(true);
      }
    }
    expect(() => pipeline(caller("reviewer@example.com"))).toThrow(ForbiddenError);
  });
});
