import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { request, signInOverHttp, type CookieJar } from "./support/http";

const fixture = (name: string) => fs.readFileSync(path.resolve("tests/fixtures/import", name));

const accountsSchema = z.object({
  accounts: z.array(z.object({ id: z.number(), name: z.string(), ownerId: z.number() })),
});
const sitesSchema = z.object({
  sites: z.array(
    z.object({
      id: z.number(),
      accountId: z.number(),
      name: z.string(),
      currency: z.string(),
      axisCount: z.number(),
    }),
  ),
});
const axesSchema = z.object({
  siteId: z.number(),
  total: z.number(),
  axes: z.array(
    z.object({
      id: z.number(),
      label: z.string(),
      machineName: z.string(),
      holdingTorqueNm: z.number(),
      phaseInductanceMh: z.number(),
      speedRpm: z.number(),
    }),
  ),
});
const importSchema = z.object({
  rowsRead: z.number(),
  rowsValid: z.number(),
  imported: z.number(),
  errors: z.array(z.object({ row: z.number().int(), column: z.string(), message: z.string() })),
});

let engineer: CookieJar;
let engineer2: CookieJar;
let reviewer: CookieJar;
let cartoniaSite: number;
let labSite: number;

async function json<T>(jar: CookieJar, url: string, schema: z.ZodType<T>) {
  const res = await request(jar, url);
  expect(res.status).toBe(200);
  return schema.parse(await res.json());
}

function upload(
  jar: CookieJar,
  siteId: number,
  name: string,
  bytes: Uint8Array,
  extra: Record<string, string> = {},
) {
  const form = new FormData();
  form.set("file", new Blob([new Uint8Array(bytes)]), name);
  for (const [k, v] of Object.entries(extra)) form.set(k, v);
  return request(jar, `/api/v1/sites/${siteId}/imports`, { method: "POST", body: form });
}

beforeAll(async () => {
  ({ jar: engineer } = await signInOverHttp("engineer@example.com", "loopshift-demo"));
  ({ jar: engineer2 } = await signInOverHttp("engineer2@example.com", "loopshift-demo"));
  ({ jar: reviewer } = await signInOverHttp("reviewer@example.com", "loopshift-demo"));
  const mine = await json(engineer, "/api/v1/sites", sitesSchema);
  cartoniaSite = mine.sites.find((s) => s.name === "South hall")!.id;
  labSite = (await json(engineer2, "/api/v1/sites", sitesSchema)).sites.find(
    (s) => s.name === "Assembly and test",
  )!.id;
});

describe("installed base over HTTP, scoped by the caller", () => {
  it("lists the engineer's own accounts and their sites", async () => {
    const { accounts } = await json(engineer, "/api/v1/accounts", accountsSchema);
    expect(accounts.map((a) => a.name).sort()).toEqual([
      "Cartonia Packaging Plant",
      "Webline Print Finishing",
    ]);
    const { sites } = await json(
      engineer,
      `/api/v1/sites?accountId=${accounts[0].id}`,
      sitesSchema,
    );
    expect(sites.every((s) => s.accountId === accounts[0].id)).toBe(true);
  });

  it("another engineer's account, site and axes answer 404, like missing ids", async () => {
    const lab = (await json(engineer2, "/api/v1/accounts", accountsSchema)).accounts.find((a) =>
      a.name.startsWith("Pipetteworks"),
    )!;
    expect((await request(engineer, `/api/v1/sites?accountId=${lab.id}`)).status).toBe(404);
    expect((await request(engineer, `/api/v1/sites?accountId=999999`)).status).toBe(404);
    expect((await request(engineer, `/api/v1/sites/${labSite}/axes`)).status).toBe(404);
    expect((await request(engineer, `/api/v1/sites/999999/axes`)).status).toBe(404);
    expect(
      (await upload(engineer, labSite, "clean.csv", fixture("clean.csv"), { dryRun: "true" }))
        .status,
    ).toBe(404);
    // The pages answer the same way as the API.
    expect((await request(engineer, `/sites/${labSite}`)).status).toBe(404);
    expect((await request(engineer, `/accounts/${lab.id}`)).status).toBe(404);
    expect((await request(engineer2, `/sites/${labSite}`)).status).toBe(200);
  });

  it("gives a site's axes with their fields in SI units", async () => {
    const page = await json(engineer2, `/api/v1/sites/${labSite}/axes?limit=10`, axesSchema);
    expect(page.axes).toHaveLength(10);
    expect(page.total).toBeGreaterThan(10);
    expect(page.axes[0].holdingTorqueNm).toBeLessThan(5);
  });

  it("keeps reviewers out of the installed base", async () => {
    expect((await request(reviewer, "/api/v1/accounts")).status).toBe(403);
    expect((await request(reviewer, `/api/v1/sites/${cartoniaSite}/axes`)).status).toBe(403);
  });
});

describe("importing a spreadsheet (POST /api/v1/sites/{id}/imports)", () => {
  it("a dry run of a clean file finds every row valid and imports nothing", async () => {
    const before = (await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=1`, axesSchema))
      .total;
    const res = await upload(engineer, cartoniaSite, "clean.csv", fixture("clean.csv"), {
      dryRun: "true",
    });
    expect(res.status).toBe(200);
    const body = importSchema.parse(await res.json());
    expect(body).toMatchObject({ rowsRead: 20, rowsValid: 20, imported: 0, errors: [] });
    expect(
      (await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=1`, axesSchema)).total,
    ).toBe(before);
  });

  it("a file with faults names each faulty cell by spreadsheet row and column, and leaves the site untouched", async () => {
    const before = (await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=1`, axesSchema))
      .total;
    const res = await upload(engineer, cartoniaSite, "faults.csv", fixture("faults.csv"));
    expect(res.status).toBe(422);
    const body = importSchema.parse(await res.json());
    expect(body.imported).toBe(0);
    expect(body.errors.length).toBeGreaterThanOrEqual(3);
    expect(new Set(body.errors.map((e) => e.row)).size).toBeGreaterThan(1);
    expect(
      body.errors.every((e) => e.row >= 1 && e.column.length > 0 && e.message.length > 10),
    ).toBe(true);
    expect(
      (await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=1`, axesSchema)).total,
    ).toBe(before);
  });

  it("commits a clean workbook in one go, converting its units to SI", async () => {
    const before = (await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=1`, axesSchema))
      .total;
    const res = await upload(engineer, cartoniaSite, "clean.xlsx", fixture("clean.xlsx"));
    expect(res.status).toBe(200);
    const body = importSchema.parse(await res.json());
    expect(body.imported).toBe(body.rowsValid);
    expect(body.imported).toBeGreaterThan(0);
    const after = await json(engineer, `/api/v1/sites/${cartoniaSite}/axes?limit=5000`, axesSchema);
    expect(after.total).toBe(before + body.imported);
  });

  it("refuses what is not a spreadsheet (415) and what is over 10 MB (413)", async () => {
    const png = await upload(engineer, cartoniaSite, "sheet.xlsx", fixture("not-a-sheet.png"));
    expect(png.status).toBe(415);
    expect((await png.json()).error).toMatch(/not an \.xlsx workbook or a CSV file/);
    const big = await upload(
      engineer,
      cartoniaSite,
      "big.csv",
      new Uint8Array(10 * 1024 * 1024 + 100).fill(65),
    );
    expect(big.status).toBe(413);
  });

  it("offers a template whose headers carry the unit in brackets", async () => {
    const csv = await request(engineer, "/api/v1/imports/template.csv");
    expect(csv.status).toBe(200);
    expect(await csv.text()).toContain("Holding torque [N·m]");
    const xlsx = await request(engineer, "/api/v1/imports/template.xlsx");
    expect(xlsx.headers.get("content-type")).toContain("spreadsheetml");
    expect(new Uint8Array(await xlsx.arrayBuffer()).slice(0, 2)).toEqual(
      new Uint8Array([0x50, 0x4b]),
    );
  });
});
