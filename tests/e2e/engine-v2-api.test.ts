import fs from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { eq, sql } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { openDatabase } from "@/db/client";
import { openQuoteFor } from "@/db/queries/quote-open";
import { cases, proposals, users } from "@/db/schema";
import { caseResultSchema, caseResultSchemaV1 } from "../support/case-result-schema";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl, request, signInOverHttp, type CookieJar } from "./support/http";

const fixture = (name: string) => fs.readFileSync(path.resolve("tests/fixtures", name), "utf8");

const problemsSchema = z.object({ error: z.string(), problems: z.array(z.string()) });
const sitesSchema = z.object({
  sites: z.array(z.object({ id: z.number(), name: z.string(), accountId: z.number() })),
});
const axisRow = z.object({
  id: z.number(),
  siteId: z.number(),
  machineId: z.number(),
  label: z.string(),
  speedRpm: z.number(),
  costPerEvent: z.string(),
  motion: z.record(z.string(), z.unknown()).nullable(),
  event: z.record(z.string(), z.unknown()).nullable(),
  resonance: z.record(z.string(), z.unknown()).nullable(),
});
const exportSchema = z.object({ axes: z.array(axisRow.extend({ machineName: z.string() })) });

let engineer: CookieJar;
let engineer2: CookieJar;
let reviewer: CookieJar;
let siteId: number;
let machineId: number;
let labSite: number;

function send(jar: CookieJar, method: string, url: string, body: unknown) {
  return request(jar, url, {
    method,
    headers: { "content-type": "application/json" },
    body: typeof body === "string" ? body : JSON.stringify(body),
  });
}

beforeAll(async () => {
  ({ jar: engineer } = await signInOverHttp("engineer@example.com", "loopshift-demo"));
  ({ jar: engineer2 } = await signInOverHttp("engineer2@example.com", "loopshift-demo"));
  ({ jar: reviewer } = await signInOverHttp("reviewer@example.com", "loopshift-demo"));
  const mine = sitesSchema.parse(await (await request(engineer, "/api/v1/sites")).json());
  siteId = mine.sites.find((s) => s.name === "North hall")!.id;
  const page = exportSchema.parse(
    await (await request(engineer, `/api/v1/sites/${siteId}/axes?limit=1`)).json(),
  );
  machineId = page.axes[0].machineId;
  const theirs = sitesSchema.parse(await (await request(engineer2, "/api/v1/sites")).json());
  labSite = theirs.sites.find((s) => s.name === "Assembly and test")!.id;
});

describe("POST /api/v1/evaluate with engine v2 inputs (docs/contracts.md (Case input), docs/model.md (Motion from the mechanism), docs/model.md (The business case))", () => {
  it("evaluates axes given by their mechanism and move, with an event build-up, as engine 2.0.0 with a motion block", async () => {
    const res = await send(
      engineer,
      "POST",
      "/api/v1/evaluate",
      fixture("engine-case-motion.json"),
    );
    expect(res.status).toBe(200);
    const result = caseResultSchema.parse(await res.json());
    expect(result.axes.map((a) => a.id)).toEqual(["PH1-Z", "PH1-X"]);
    for (const axis of result.axes) {
      expect(axis.motion!.speedRpm).toBeGreaterThan(0);
      expect(axis.motion!.peakTorqueNm).toBeGreaterThanOrEqual(axis.motion!.loadTorqueNm);
    }
    // The vertical screw holds its load at standstill (docs/model.md (Motion from the mechanism) holdTorqueNm, docs/contracts.md (Case result) HOLDING_LOAD).
    expect(result.axes[0].motion!.holdTorqueNm).toBeGreaterThan(0);
    expect(result.axes[0].warnings).toContain("HOLDING_LOAD");
  });

  it("answers 422 naming axes[0].duty.motion.leadMm for a screw without its lead", async () => {
    const input = JSON.parse(fixture("engine-case-motion.json"));
    delete input.axes[0].duty.motion.leadMm;
    const res = await send(engineer, "POST", "/api/v1/evaluate", input);
    expect(res.status).toBe(422);
    const body = problemsSchema.parse(await res.json());
    expect(body.problems).toEqual([
      "axes[0].duty.motion.leadMm: required for a screw: the lead in mm per screw turn",
    ]);
  });

  it("answers 422 naming axes[0].reliability.event when a cost per event comes with the build-up", async () => {
    const input = JSON.parse(fixture("engine-case-motion.json"));
    input.axes[0].reliability.costPerEvent = "120";
    const res = await send(engineer, "POST", "/api/v1/evaluate", input);
    expect(res.status).toBe(422);
    const { problems } = problemsSchema.parse(await res.json());
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(
      /^axes\[0\]\.reliability\.event: give either costPerEvent or event/,
    );
  });
});

// An invented NEMA 23 axis on 48 V moved by a vertical screw, as a vendor's system would send it.
const screwAxis = () => ({
  machineId,
  label: `Z lift ${Math.random().toString(36).slice(2, 8)}`,
  holdingTorqueNm: 1.26,
  ratedCurrentA: 2.8,
  phaseResistanceOhm: 0.9,
  phaseInductanceMh: 3.2,
  busVoltageV: 48,
  currentSettingA: 2.8,
  hoursPerYear: 6000,
  stepLossEventsPerYear: 3,
  motion: {
    mechanism: "screw",
    leadMm: 25,
    massKg: 5,
    inclineDeg: 90,
    motorInertiaKgM2: { value: 480, unit: "g·cm²" },
    stroke: 120,
    moveTimeS: 0.6,
    dwellTimeS: 1.5,
  },
  event: { downtimeMinutes: 25, scrapParts: 4, scrapCostPerPart: "6.50", restartLaborHours: 0.5 },
  resonance: { fromRpm: 400, toRpm: 700, deratePct: 30 },
});

describe("axes over the JSON API with motion, event and resonance", () => {
  it("creates one (201), reads it back with motion in SI units, and lists it with the site's axes", async () => {
    const res = await send(engineer, "POST", `/api/v1/sites/${siteId}/axes`, screwAxis());
    expect(res.status).toBe(201);
    const created = axisRow.parse(await res.json());
    expect(created.siteId).toBe(siteId);
    // NIST SP 811 (2008) via the SI prefixes: 480 g·cm² = 480 E−07 kg·m².
    expect(created.motion!.motorInertiaKgM2 as number).toBeCloseTo(4.8e-5, 15);
    expect(created.event).toEqual({
      downtimeMinutes: 25,
      scrapParts: 4,
      scrapCostPerPart: "6.50",
      restartLaborHours: 0.5,
    });
    expect(created.resonance).toEqual({ fromRpm: 400, toRpm: 700, deratePct: 30 });
    const got = await request(engineer, `/api/v1/axes/${created.id}`);
    expect(got.status).toBe(200);
    expect(axisRow.parse(await got.json())).toEqual(created);
    const all = exportSchema.parse(
      await (await request(engineer, `/api/v1/sites/${siteId}/axes?limit=5000`)).json(),
    );
    expect(all.axes.find((a) => a.id === created.id)?.motion).toEqual(created.motion);
  });

  it("replaces one with PUT: an object left out is removed, typed duty returns", async () => {
    const created = axisRow.parse(
      await (await send(engineer, "POST", `/api/v1/sites/${siteId}/axes`, screwAxis())).json(),
    );
    const { motion: _m, event: _e, resonance: _r, ...typed } = screwAxis();
    const res = await send(engineer, "PUT", `/api/v1/axes/${created.id}`, {
      ...typed,
      label: created.label,
      movePct: 30,
      holdPct: 60,
      speedRpm: 400,
      loadTorqueNm: 0.3,
      peakTorqueNm: 0.5,
      costPerEvent: "150",
    });
    expect(res.status).toBe(200);
    expect(axisRow.parse(await res.json())).toMatchObject({
      motion: null,
      event: null,
      resonance: null,
      speedRpm: 400,
      costPerEvent: "150",
    });
  });

  it("answers 422 naming each problem's path: a screw without its lead, both a cost and an event, duty missing without motion", async () => {
    const bad = screwAxis();
    delete (bad.motion as { leadMm?: number }).leadMm;
    const res = await send(engineer, "POST", `/api/v1/sites/${siteId}/axes`, {
      ...bad,
      costPerEvent: "120",
      resonance: { fromRpm: 700, toRpm: 400, deratePct: 30 },
    });
    expect(res.status).toBe(422);
    const { problems } = problemsSchema.parse(await res.json());
    expect(problems).toEqual(
      expect.arrayContaining([
        "motion.leadMm: required for a screw: the lead in mm per screw turn",
        "resonance.toRpm: must be at least fromRpm (700)",
      ]),
    );
    const { motion: _m, ...noMotion } = screwAxis();
    const both = await send(engineer, "POST", `/api/v1/sites/${siteId}/axes`, {
      ...noMotion,
      costPerEvent: "120",
    });
    expect(both.status).toBe(422);
    expect(problemsSchema.parse(await both.json()).problems).toEqual(
      expect.arrayContaining([
        "speedRpm: required: expected a number (or give motion to derive it)",
        "event: give either costPerEvent or event (the cost built from downtime, scrap and labour), not both",
      ]),
    );
  });

  it("another engineer's site and axis answer 404, a reviewer 403", async () => {
    const created = axisRow.parse(
      await (await send(engineer, "POST", `/api/v1/sites/${siteId}/axes`, screwAxis())).json(),
    );
    expect((await request(engineer2, `/api/v1/axes/${created.id}`)).status).toBe(404);
    expect((await send(engineer2, "PUT", `/api/v1/axes/${created.id}`, screwAxis())).status).toBe(
      404,
    );
    expect(
      (await send(engineer, "POST", `/api/v1/sites/${labSite}/axes`, screwAxis())).status,
    ).toBe(404);
    // A machine of another site named in the body is not found either.
    expect(
      (await send(engineer2, "POST", `/api/v1/sites/${labSite}/axes`, screwAxis())).status,
    ).toBe(404);
    expect((await request(reviewer, `/api/v1/axes/${created.id}`)).status).toBe(403);
    expect((await send(reviewer, "POST", `/api/v1/sites/${siteId}/axes`, screwAxis())).status).toBe(
      403,
    );
  });
});

describe("a proposal issued with engine 1.0.0 (tests/fixtures/proposal-v1.json)", () => {
  const V1 = JSON.parse(fixture("proposal-v1.json"));
  // The server's own database file: the proposal is stored as v1 stored it, beside the demo's.
  const db = openDatabase(inject("databasePath"));
  let proposalId: number;

  beforeAll(() => {
    const owner = db.select().from(users).where(eq(users.email, "engineer@example.com")).get()!;
    const target = db.select().from(cases).where(eq(cases.ownerId, owner.id)).get()!;
    proposalId = db.transaction((tx) => {
      const [{ last }] = tx
        .select({ last: sql<number>`max(${proposals.version})` })
        .from(proposals)
        .where(eq(proposals.caseId, target.id))
        .all();
      const [row] = tx
        .insert(proposals)
        .values({
          caseId: target.id,
          version: (last ?? 0) + 1,
          input: V1.input,
          result: V1.result,
          engineVersion: V1.engineVersion,
          createdById: owner.id,
        })
        .returning()
        .all();
      openQuoteFor(tx, row, target.ownerId);
      return row.id;
    });
  });
  afterAll(() => db.$client.close());

  it("reads with its frozen result and engine version 1.0.0", async () => {
    const res = await request(engineer, `/api/v1/proposals/${proposalId}`);
    expect(res.status).toBe(200);
    const body = z
      .object({ engineVersion: z.string(), result: caseResultSchemaV1 })
      .parse(await res.json());
    expect(body.engineVersion).toBe("1.0.0");
    expect(body.result).toEqual(V1.result);
    expect((await request(engineer, `/proposals/${proposalId}`)).status).toBe(200);
  });

  it("its workbook downloads as a valid .xlsx naming engine 1.0.0", async () => {
    const res = await request(engineer, `/api/v1/proposals/${proposalId}/workbook`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("spreadsheetml");
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(await res.arrayBuffer());
    const rows: unknown[][] = [];
    workbook.eachSheet((sheet) =>
      sheet.eachRow((r) => rows.push((r.values as unknown[]).slice(1))),
    );
    expect(rows.some((r) => r[0] === "Engine version" && r[1] === "1.0.0")).toBe(true);
  });

  it("its sandbox computes with engine 2.0.0 and stores nothing", async () => {
    const res = await send(engineer, "POST", `/api/v1/proposals/${proposalId}/what-if`, {
      horizonYears: 6,
    });
    expect(res.status).toBe(200);
    const sandbox = z.object({ engineVersion: z.string() }).parse(await res.json());
    expect(sandbox.engineVersion).toBe("2.0.0");
    const again = z
      .object({ engineVersion: z.string(), result: z.object({ engineVersion: z.string() }) })
      .parse(await (await request(engineer, `/api/v1/proposals/${proposalId}`)).json());
    expect([again.engineVersion, again.result.engineVersion]).toEqual(["1.0.0", "1.0.0"]);
  });
});

describe("the case assumptions form with inflation, tax rate and depreciation (docs/model.md (The business case))", () => {
  let browser: Browser;
  let page: Page;
  beforeAll(async () => {
    browser = await launchBrowser();
    page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
    await signInWithForm(page, "engineer@example.com");
    await page.waitForURL("**/accounts");
  });
  afterAll(async () => {
    await browser?.close();
  });

  it("refuses a tax rate of 100 % beside its field, then saves the three and the case input carries them", async () => {
    const { cases: list } = z
      .object({ cases: z.array(z.object({ id: z.number(), stage: z.string() })) })
      .parse(await (await request(engineer, "/api/v1/cases")).json());
    const caseId = list[0].id;
    await page.goto(`${baseUrl()}/cases/${caseId}`);
    const form = page.getByRole("form", { name: "Assumptions" });
    await form.getByLabel(/^Tax rate/).fill("100");
    await form.getByRole("button", { name: "Apply assumptions" }).click();
    await form.getByText("must be less than 100").waitFor();
    await form.getByLabel(/^Tax rate/).fill("25");
    await form.getByLabel(/^Inflation/).fill("2.5");
    await form.getByLabel(/^Depreciation/).fill("7");
    await form.getByRole("button", { name: "Apply assumptions" }).click();
    await page.getByText("Assumptions saved; the results are recomputing.").waitFor();
    await screenshot(page, "case-assumptions-v2");
    const { input } = z
      .object({ input: z.object({ finance: z.record(z.string(), z.unknown()) }) })
      .parse(await (await request(engineer, `/api/v1/cases/${caseId}`)).json());
    expect(input.finance).toMatchObject({
      taxRatePct: 25,
      inflationPct: 2.5,
      depreciationYears: 7,
    });
  });
});
