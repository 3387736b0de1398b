import "../support/node-async-storage";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as pipelineRoute } from "@/app/api/v1/pipeline/route";
import { GET as pipelineCsvRoute } from "@/app/api/v1/pipeline.csv/route";
import { db } from "@/db";
import { openDatabase } from "@/db/client";
import { seedDatabase } from "@/db/seed";
import { backfillVendorRevenue } from "@/db/backfill-vendor-revenue";
import { migrateDatabase } from "@/db/migrate";
import { listAxesForExport } from "@/db/queries/axes";
import { createCase, getCaseOrThrow, updateAssumptions } from "@/db/queries/cases";
import { setCaseAxes, setCaseAxesRetrofit } from "@/db/queries/case-axes";
import { pipelineQuotesPage } from "@/db/queries/pipeline";
import { listSites } from "@/db/queries/sites";
import { proposals, quotes } from "@/db/schema";
import { bulkRetrofitSchema, caseAssumptionsSchema } from "@/lib/validations/case";
import { freezeProposal } from "@/server/cases/freeze";
import { caller } from "../support/callers";
import { parseCsv } from "../support/csv";
import { expectedRevenue, fixed, type FrozenInput } from "../support/exact-revenue";
import { asRequestOf } from "../support/next-request";

// The vendor's revenue is stored on the quote when a proposal is frozen (migration 0013), filled
// in for older quotes by db/backfill-vendor-revenue.ts, and read from there by the pipeline.
// Every stored figure is checked against tests/support/exact-revenue.ts, which shares no code
// with the app's decimal.js sums.

const engineer = () => caller("engineer@example.com");
const manager = () => caller("manager@example.com");

const frozenInput = (id: number) =>
  db.select({ input: proposals.input }).from(proposals).where(eq(proposals.id, id)).get()!
    .input as unknown as FrozenInput;

const storedOf = (id: number) => db.select().from(quotes).where(eq(quotes.proposalId, id)).get()!;

const NOTHING_STORED = {
  vendorRevenue: null,
  revenueKitsAtListPrice: null,
  revenueDiscounts: null,
  revenueInstallation: null,
  revenueCommissioning: null,
};

/** Each stored part equals the independent whole-number computation, exactly. */
function expectStoredExact(id: number) {
  const q = storedOf(id);
  const want = expectedRevenue(frozenInput(id));
  expect(fixed(q.vendorRevenue!), `quote ${id}`).toBe(want.revenue);
  expect(fixed(q.revenueKitsAtListPrice!)).toBe(want.kits);
  expect(fixed(q.revenueDiscounts!)).toBe(want.discounts);
  expect(fixed(q.revenueInstallation!)).toBe(want.installation);
  expect(fixed(q.revenueCommissioning!)).toBe(want.commissioning);
}

async function pipelineJson() {
  const res = await asRequestOf(manager(), () =>
    pipelineRoute(new Request("http://localhost/api/v1/pipeline")),
  );
  expect(res.status).toBe(200);
  return (await res.json()) as {
    quotes: { id: number; currency: string; vendorRevenue: string }[];
    totals: { currency: string; revenue: string }[];
  };
}

describe("the vendor's revenue stored on the quote", () => {
  it("is stored exactly when a proposal is frozen, awkward decimals included", () => {
    const site = listSites(manager()).find((s) => s.name === "North hall")!;
    const c = createCase(engineer(), { name: "Stored revenue", siteId: site.id });
    const axisIds = listAxesForExport(engineer(), site.id, 0, 4).axes.map((a) => a.id);
    setCaseAxes(engineer(), c.id, axisIds);
    const { assumptions } = getCaseOrThrow(engineer(), c.id);
    updateAssumptions(
      engineer(),
      c.id,
      caseAssumptionsSchema.parse({
        ...assumptions,
        finance: { ...assumptions.finance, laborRatePerHour: "61.35" },
      }),
    );
    setCaseAxesRetrofit(
      engineer(),
      c.id,
      bulkRetrofitSchema.parse({
        axisIds,
        discountPct: "7.5",
        installHours: "2.25",
        commissioningCost: "133.33",
      }),
    );
    const proposal = freezeProposal(engineer(), c.id);
    const want = expectedRevenue(frozenInput(proposal.id));
    expect(want.discounts > 0n && want.installation > 0n && want.commissioning > 0n).toBe(true);
    expectStoredExact(proposal.id);
  });

  it("is filled in from the frozen input for quotes that lack it, when the database is migrated", () => {
    const ids = db
      .select({ id: quotes.proposalId })
      .from(quotes)
      .all()
      .map((r) => r.id);
    expect(ids.length).toBeGreaterThanOrEqual(5);
    // As a quote frozen before migration 0013 stands: the columns exist but hold nothing.
    db.update(quotes).set(NOTHING_STORED).run();
    // One with a single part missing has every part worked out again, not just that one.
    db.update(quotes)
      .set({
        vendorRevenue: "1",
        revenueKitsAtListPrice: "1",
        revenueInstallation: "1",
        revenueCommissioning: "1",
      })
      .where(eq(quotes.proposalId, ids[0]))
      .run();
    migrateDatabase(db);
    for (const id of ids) expectStoredExact(id);
    // Once filled, there is nothing left to do.
    expect(backfillVendorRevenue(db)).toBe(0);
  });

  it("upgrades a database from before migration 0013: columns added, every quote filled in", () => {
    // A second file, seeded, then put back as it stood before 0013: its columns dropped and its
    // record of having run 0013 removed, so that migrating applies drizzle/0013 itself.
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-0013-")), "old.db");
    const old = openDatabase(file);
    try {
      migrateDatabase(old);
      seedDatabase(old);
      const raw = old.$client;
      for (const column of [
        "vendor_revenue",
        "revenue_kits_at_list_price",
        "revenue_discounts",
        "revenue_installation",
        "revenue_commissioning",
      ])
        raw.exec(`alter table quotes drop column ${column}`);
      raw.exec(
        "delete from __drizzle_migrations where created_at = (select max(created_at) from __drizzle_migrations)",
      );
      const before = raw.prepare("select count(*) as n from __drizzle_migrations").get() as {
        n: number;
      };
      migrateDatabase(old);
      const after = raw.prepare("select count(*) as n from __drizzle_migrations").get() as {
        n: number;
      };
      expect(after.n).toBe(before.n + 1);
      const rows = raw
        .prepare(
          `select q.vendor_revenue, q.revenue_kits_at_list_price, q.revenue_discounts,
                  q.revenue_installation, q.revenue_commissioning, p.input
             from quotes q join proposals p on p.id = q.proposal_id`,
        )
        .all() as Record<string, string>[];
      expect(rows.length).toBeGreaterThanOrEqual(5);
      for (const r of rows) {
        const want = expectedRevenue(JSON.parse(r.input) as FrozenInput);
        expect(fixed(r.vendor_revenue)).toBe(want.revenue);
        expect(fixed(r.revenue_kits_at_list_price)).toBe(want.kits);
        expect(fixed(r.revenue_discounts)).toBe(want.discounts);
        expect(fixed(r.revenue_installation)).toBe(want.installation);
        expect(fixed(r.revenue_commissioning)).toBe(want.commissioning);
      }
    } finally {
      old.$client.close();
      fs.rmSync(path.dirname(file), { recursive: true, force: true });
    }
  });

  it("reports how many quotes it filled, and leaves stored ones alone", () => {
    const [first, second] = db.select({ id: quotes.proposalId }).from(quotes).limit(2).all();
    db.update(quotes).set(NOTHING_STORED).where(eq(quotes.proposalId, first.id)).run();
    const untouched = storedOf(second.id);
    expect(backfillVendorRevenue(db)).toBe(1);
    expectStoredExact(first.id);
    expect(storedOf(second.id)).toEqual(untouched);
  });
});

describe("the pipeline reads the stored revenue", () => {
  it("shows what is stored, not a figure worked out again from the frozen input", async () => {
    const before = await pipelineJson();
    const target = before.quotes[0];
    const worked = expectedRevenue(frozenInput(target.id));
    // A stored figure a recomputation could never give: larger than every quote's revenue.
    const largest = before.quotes.reduce(
      (m, q) => (fixed(q.vendorRevenue) > m ? fixed(q.vendorRevenue) : m),
      0n,
    );
    const planted = {
      vendorRevenue: "987654321.125",
      revenueKitsAtListPrice: "987654000",
      revenueDiscounts: "0.875",
      revenueInstallation: "300",
      revenueCommissioning: "22",
    };
    expect(fixed(planted.vendorRevenue) > largest).toBe(true);
    expect(fixed(planted.vendorRevenue)).not.toBe(worked.revenue);
    db.update(quotes).set(planted).where(eq(quotes.proposalId, target.id)).run();
    try {
      const after = await pipelineJson();
      const shown = after.quotes.find((q) => q.id === target.id)!;
      expect(shown.vendorRevenue).toBe(planted.vendorRevenue);
      // The totals sum the stored figures.
      const total = after.totals.find((t) => t.currency === target.currency)!;
      const beforeTotal = before.totals.find((t) => t.currency === target.currency)!;
      expect(fixed(total.revenue)).toBe(
        fixed(beforeTotal.revenue) - fixed(target.vendorRevenue) + fixed(planted.vendorRevenue),
      );
      // The sort key is the stored figure: largest first by revenue.
      const page = pipelineQuotesPage(manager(), {}, { sort: "revenue", dir: "desc" });
      expect(page.rows[0].id).toBe(target.id);
      // And the CSV export carries the stored parts.
      const res = await asRequestOf(manager(), () =>
        pipelineCsvRoute(new Request("http://localhost/api/v1/pipeline.csv")),
      );
      const [header, ...rows] = parseCsv(await res.text());
      const row = rows[after.quotes.findIndex((q) => q.id === target.id)];
      const col = (name: string) => row[header.indexOf(name)];
      expect(col("Kits at list price")).toBe(planted.revenueKitsAtListPrice);
      expect(col("Discounts")).toBe(planted.revenueDiscounts);
      expect(col("Installation")).toBe(planted.revenueInstallation);
      expect(col("Commissioning")).toBe(planted.revenueCommissioning);
      expect(fixed(col("Vendor revenue"))).toBe(fixed(planted.vendorRevenue));
    } finally {
      db.update(quotes).set(NOTHING_STORED).where(eq(quotes.proposalId, target.id)).run();
      backfillVendorRevenue(db);
    }
    expectStoredExact(target.id);
  });

  it("works the revenue out of the frozen input for a quote that still lacks it", async () => {
    const [{ id }] = db.select({ id: quotes.proposalId }).from(quotes).limit(1).all();
    db.update(quotes).set(NOTHING_STORED).where(eq(quotes.proposalId, id)).run();
    try {
      const shown = (await pipelineJson()).quotes.find((q) => q.id === id)!;
      expect(fixed(shown.vendorRevenue)).toBe(expectedRevenue(frozenInput(id)).revenue);
      // Reading does not write: the quote still lacks it until the next migration run.
      expect(storedOf(id).vendorRevenue).toBeNull();
    } finally {
      backfillVendorRevenue(db);
    }
  });
});

describe("a frozen input the backfill cannot sum", () => {
  it("is left unfilled and named, and does not stop the others or the start", () => {
    const sample = db.select().from(proposals).limit(1).get()!;
    const input = structuredClone(sample.input);
    (input.axes[0].retrofit.kit as { price: unknown }).price = "not a price";
    const [bad] = db
      .insert(proposals)
      .values({ ...sample, id: undefined, version: 990, input, createdAt: undefined })
      .returning()
      .all();
    const ownerId = storedOf(sample.id).ownerId;
    db.insert(quotes)
      .values({
        proposalId: bad.id,
        ownerId,
        value: "1",
        currency: "EUR",
        expectedCloseOn: "2030-01-01",
      })
      .run();
    const [other] = db.select({ id: quotes.proposalId }).from(quotes).limit(1).all();
    db.update(quotes).set(NOTHING_STORED).where(eq(quotes.proposalId, other.id)).run();
    const warnings: string[] = [];
    const warn = console.warn;
    console.warn = (message: string) => warnings.push(message);
    try {
      expect(backfillVendorRevenue(db)).toBe(1);
      expect(() => migrateDatabase(db)).not.toThrow();
    } finally {
      console.warn = warn;
      db.delete(proposals).where(eq(proposals.id, bad.id)).run();
    }
    expectStoredExact(other.id);
    expect(warnings[0]).toContain(`proposal ${bad.id}`);
    expect(warnings).toHaveLength(2);
  });
});
