import Database from "better-sqlite3";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { parseCsv } from "../support/csv";
import { cents, expectedRevenue, fixed, type FrozenInput } from "../support/exact-revenue";
import { request, signInOverHttp, type CookieJar } from "./support/http";

// The pipeline's money over real HTTP against the built app: the vendor's revenue of each demo
// quote equals kits + installation + commissioning − discounts, computed here from the frozen
// input read straight from the SQLite file. Only reads: nothing another e2e file counts moves.
const database = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
const frozenInput = (id: number) =>
  JSON.parse(
    (database.prepare("select input from proposals where id = ?").get(id) as { input: string })
      .input,
  ) as FrozenInput;

let manager: CookieJar;
let engineer: CookieJar;
let reviewer: CookieJar;

beforeAll(async () => {
  const sign = async (email: string) => {
    const { jar, error } = await signInOverHttp(email, "loopshift-demo");
    expect(error).toBeNull();
    return jar;
  };
  manager = await sign("manager@example.com");
  engineer = await sign("engineer@example.com");
  reviewer = await sign("reviewer@example.com");
});

describe("the pipeline over HTTP", () => {
  it("gives each quote's vendor revenue to the cent, beside the customer's investment, in JSON and CSV", async () => {
    const res = await request(manager, "/api/v1/pipeline");
    expect(res.status).toBe(200);
    const body = (await res.json()) as {
      quotes: { id: number; value: string; vendorRevenue: string }[];
    };
    expect(body.quotes.length).toBeGreaterThanOrEqual(5);
    for (const q of body.quotes) {
      const want = expectedRevenue(frozenInput(q.id)).revenue;
      expect(cents(fixed(q.vendorRevenue)), `quote ${q.id}`).toBe(cents(want));
      // The investment adds the customer's own costs (downtime, one-time project cost); a quote
      // made by another file's flow may have none, so it is never below the revenue.
      expect(fixed(q.value) >= want, `quote ${q.id}`).toBe(true);
    }

    const csv = await request(manager, "/api/v1/pipeline.csv");
    expect(csv.status).toBe(200);
    const [header, ...rows] = parseCsv(await csv.text());
    expect(rows).toHaveLength(body.quotes.length);
    rows.forEach((row, i) => {
      const want = expectedRevenue(frozenInput(body.quotes[i].id)).revenue;
      expect(cents(fixed(row[header.indexOf("Vendor revenue")]))).toBe(cents(want));
      expect(row[header.indexOf("Customer investment")]).toBe(body.quotes[i].value);
    });
  });

  it("shows both amounts on the page, and every column of the quote list sorts through the URL", async () => {
    const res = await request(manager, "/pipeline?sort=revenue&dir=asc");
    expect(res.status).toBe(200);
    const page = await res.text();
    expect(page).toContain("Vendor revenue");
    expect(page).toContain("Customer investment");
    for (const column of [
      "proposal",
      "account",
      "owner",
      "stage",
      "revenue",
      "investment",
      "chance",
      "weighted",
      "close",
      "payback",
    ])
      expect(page, column).toMatch(new RegExp(`href="/pipeline\\?[^"]*sort=${column}`));
  });
});

describe("the vendor's test-mode banner", () => {
  it("is on the engineer's pages and not on the reviewer's", async () => {
    const vendorPage = await (await request(engineer, "/cases")).text();
    expect(vendorPage).toContain("TEST MODE");
    const res = await request(reviewer, "/review");
    expect(res.status).toBe(200);
    const reviewPage = await res.text();
    expect(reviewPage).toContain("Retrofit proposals sent to");
    expect(reviewPage).not.toContain("TEST MODE");
  });
});
