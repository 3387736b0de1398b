import "../support/node-async-storage";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as pipelineRoute } from "@/app/api/v1/pipeline/route";
import { GET as pipelineCsvRoute } from "@/app/api/v1/pipeline.csv/route";
import { pipelineWinRate } from "@/db/queries/pipeline";
import { db } from "@/db";
import { proposals, quotes } from "@/db/schema";
import { PIPELINE_CSV_HEADER } from "@/lib/pipeline/csv";
import { caller } from "../support/callers";
import { parseCsv } from "../support/csv";
import {
  cents,
  expectedOwnCosts,
  expectedRevenue,
  fixed,
  ONE,
  type FrozenInput,
} from "../support/exact-revenue";
import { asRequestOf } from "../support/next-request";

const manager = () => caller("manager@example.com");

const frozenInput = (id: number) =>
  db.select({ input: proposals.input }).from(proposals).where(eq(proposals.id, id)).get()!
    .input as unknown as FrozenInput;

async function get(route: (r: Request) => Promise<Response>, path: string) {
  return asRequestOf(manager(), () => route(new Request(`http://localhost${path}`)));
}

type ApiQuote = {
  id: number;
  currency: string;
  stage: string;
  value: string;
  vendorRevenue: string;
  weighted: string;
  probabilityPct: number;
};

describe("GET /api/v1/pipeline and /api/v1/pipeline.csv: the vendor's revenue", () => {
  it("is kits + installation + commissioning − discounts to the cent for every demo quote", async () => {
    const res = await get(pipelineRoute, "/api/v1/pipeline");
    expect(res.status).toBe(200);
    const body = (await res.json()) as {
      quotes: ApiQuote[];
      totals: { currency: string; value: string; revenue: string; weighted: string }[];
    };
    expect(body.quotes.length).toBeGreaterThanOrEqual(5);
    for (const q of body.quotes) {
      const input = frozenInput(q.id);
      const want = expectedRevenue(input);
      // Exact, and so to the cent.
      expect(fixed(q.vendorRevenue), `quote ${q.id}`).toBe(want.revenue);
      expect(cents(fixed(q.vendorRevenue))).toBe(cents(want.revenue));
      // The demo quotes carry discounts and labour, so the check covers every part.
      expect(want.discounts > 0n && want.installation > 0n && want.commissioning > 0n).toBe(true);
      // The customer's investment is that revenue plus their own costs, and so larger.
      expect(fixed(q.value), `quote ${q.id}`).toBe(want.revenue + expectedOwnCosts(input));
      expect(fixed(q.value) > fixed(q.vendorRevenue)).toBe(true);
      // Weighted on the revenue: revenue × chance, half-even to the cent.
      expect(fixed(q.weighted)).toBe(
        cents((want.revenue * BigInt(q.probabilityPct)) / 100n) * (ONE / 100n),
      );
    }
    for (const t of body.totals) {
      const rows = body.quotes.filter((q) => q.currency === t.currency);
      const open = rows.filter((q) => ["ready", "sent", "changes"].includes(q.stage));
      expect(fixed(t.revenue)).toBe(
        rows.reduce((s, q) => s + expectedRevenue(frozenInput(q.id)).revenue, 0n),
      );
      expect(fixed(t.weighted)).toBe(open.reduce((s, q) => s + fixed(q.weighted), 0n));
      expect(fixed(t.value)).toBe(rows.reduce((s, q) => s + fixed(q.value), 0n));
    }
  });

  it("puts both amounts and the revenue's parts in the CSV, rebuilding the revenue to the cent", async () => {
    const res = await get(pipelineCsvRoute, "/api/v1/pipeline.csv");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("text/csv");
    const [header, ...rows] = parseCsv(await res.text());
    expect(header).toEqual(PIPELINE_CSV_HEADER);
    const col = (row: string[], name: string) => row[header.indexOf(name)];
    const ids = (
      (await (await get(pipelineRoute, "/api/v1/pipeline")).json()) as { quotes: ApiQuote[] }
    ).quotes.map((q) => q.id);
    expect(rows).toHaveLength(ids.length);
    rows.forEach((row, i) => {
      const want = expectedRevenue(frozenInput(ids[i]));
      expect(fixed(col(row, "Kits at list price"))).toBe(want.kits);
      expect(fixed(col(row, "Discounts"))).toBe(want.discounts);
      expect(fixed(col(row, "Installation"))).toBe(want.installation);
      expect(fixed(col(row, "Commissioning"))).toBe(want.commissioning);
      expect(cents(fixed(col(row, "Vendor revenue")))).toBe(cents(want.revenue));
      expect(fixed(col(row, "Customer investment")) > fixed(col(row, "Vendor revenue"))).toBe(true);
    });
  });
});

describe("the win rate counts the quotes decided inside the period", () => {
  it("takes the first instant of the first month and leaves out the first of the month after", () => {
    const ids = db
      .select({ id: quotes.proposalId })
      .from(quotes)
      .all()
      .map((r) => r.id);
    expect(ids.length).toBeGreaterThanOrEqual(5);
    // Hand-set decisions around a period of April to June 2025 (UTC).
    const decisions: [string, string | null][] = [
      ["accepted", "2025-03-31T23:59:59.999Z"], // before: not counted
      ["accepted", "2025-04-01T00:00:00.000Z"], // first instant: won
      ["declined", "2025-06-30T23:59:59.999Z"], // last instant: lost
      ["accepted", "2025-07-01T00:00:00.000Z"], // after: not counted
      ["sent", null], // open: not counted
    ];
    decisions.forEach(([stage, decidedAt], i) =>
      db
        .update(quotes)
        .set({ stage: stage as "accepted", decidedAt })
        .where(eq(quotes.proposalId, ids[i]))
        .run(),
    );
    const rate = pipelineWinRate(manager(), { from: "2025-04", to: "2025-06" });
    expect([rate.won, rate.lost, rate.ratePct]).toEqual([1, 1, 50]);
    const spring = pipelineWinRate(manager(), { from: "2025-03", to: "2025-04" });
    expect([spring.won, spring.lost]).toEqual([2, 0]);
    const none = pipelineWinRate(manager(), { from: "2024-01", to: "2024-12" });
    expect(none.ratePct).toBeNull();
  });
});
