import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { caseInputSchema } from "@/lib/engine/schema";
import { caseResultSchema } from "../support/case-result-schema";
import { request, signInOverHttp, type CookieJar } from "./support/http";

const stage = z.enum(["draft", "modelled", "proposed", "won", "lost"]);
const caseSchema = z.object({
  id: z.number().int(),
  accountId: z.number().int(),
  siteId: z.number().int(),
  ownerId: z.number().int(),
  name: z.string(),
  stage,
  accountName: z.string(),
  siteName: z.string(),
  ownerName: z.string(),
  axisCount: z.number().int(),
  latestVersion: z.number().int().nullable(),
  assumptions: z.object({
    finance: z.object({ tariffPerKWh: z.string() }),
    margins: z.object({ openLoopRequiredPct: z.number(), closedLoopRequiredPct: z.number() }),
  }),
  createdAt: z.string(),
  updatedAt: z.string(),
});
const casesSchema = z.object({ cases: z.array(caseSchema) });
// The case with the input the engine receives, itself checked by the engine's own schema.
const caseDetailSchema = caseSchema.extend({ input: caseInputSchema });
const proposalSchema = z.object({
  id: z.number().int(),
  caseId: z.number().int(),
  version: z.number().int().positive(),
  engineVersion: z.string(),
  createdById: z.number().int(),
  createdAt: z.string(),
  input: caseInputSchema,
  result: caseResultSchema,
});
const proposalsSchema = z.object({
  proposals: z.array(
    z.object({
      id: z.number().int(),
      version: z.number().int(),
      createdByName: z.string(),
      npv: z.string(),
      capex: z.string(),
      changes: z.array(z.string()).min(1),
    }),
  ),
});

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

let engineer: CookieJar;
let engineer2: CookieJar;
let reviewer: CookieJar;
let mine: z.infer<typeof caseSchema>;
let theirs: z.infer<typeof caseSchema>;

async function json<T>(jar: CookieJar, url: string, schema: z.ZodType<T>, status = 200) {
  const res = await request(jar, url);
  expect(res.status, url).toBe(status);
  return schema.parse(await res.json());
}

beforeAll(async () => {
  ({ jar: engineer } = await signInOverHttp("engineer@example.com", "loopshift-demo"));
  ({ jar: engineer2 } = await signInOverHttp("engineer2@example.com", "loopshift-demo"));
  ({ jar: reviewer } = await signInOverHttp("reviewer@example.com", "loopshift-demo"));
  const { cases } = await json(engineer, "/api/v1/cases", casesSchema);
  mine = cases.find((c) => c.stage === "proposed")!;
  theirs = (await json(engineer2, "/api/v1/cases", casesSchema)).cases.find(
    (c) => c.accountName === "Pipetteworks Lab Automation",
  )!;
});

describe("business cases over HTTP", () => {
  it("lists the engineer's cases: those of the accounts they own or are shared on", async () => {
    const { cases } = await json(engineer, "/api/v1/cases", casesSchema);
    expect(new Set(cases.map((c) => c.accountName))).toEqual(
      new Set(["Cartonia Packaging Plant", "Webline Print Finishing"]),
    );
    expect(mine.latestVersion).toBe(1);
    expect(theirs).toBeDefined();
  });

  it("gives a case with the full CaseInput the engine receives, and that input's result", async () => {
    const found = await json(engineer, `/api/v1/cases/${mine.id}`, caseDetailSchema);
    expect(found.input.axes.length).toBeGreaterThan(0);
    expect(found.input.finance.tariffPerKWh).toBe(found.assumptions.finance.tariffPerKWh);
    const res = await request(engineer, `/api/v1/cases/${mine.id}/result`, {
      headers: { "accept-encoding": "gzip" },
    });
    expect(res.status).toBe(200);
    // Sent as it was written once for this input, not compressed again per request.
    expect(res.headers.get("cache-control")).toBe("no-store, no-transform");
    expect(res.headers.get("content-encoding")).toBeNull();
    const result = caseResultSchema.parse(await res.json());
    expect(result.currency).toBe(found.input.currency);
    expect(result.axes.map((a) => a.id)).toEqual(found.input.axes.map((a) => a.id));

    // The case page's single request: the same input and the same result in one body.
    const both = (await (
      await request(engineer, `/api/v1/cases/${mine.id}/result?include=input`)
    ).json()) as { input: unknown; result: unknown };
    // Exactly the input the case's own GET gives (its raw JSON: `found` went through the
    // engine's schema, which fills defaults such as a motion axis's standstill load).
    const raw = (await (await request(engineer, `/api/v1/cases/${mine.id}`)).json()) as {
      input: unknown;
    };
    expect(both.input).toEqual(raw.input);
    expect(caseInputSchema.parse(both.input)).toEqual(found.input);
    expect(caseResultSchema.parse(both.result)).toEqual(result);
    // Value by source split by machine: each scenario's machines and case-wide part add up to
    // the scenario's value by source (to the cent), machines named as in the input.
    const split = (await (
      await request(engineer, `/api/v1/cases/${mine.id}/result?include=value-by-machine`)
    ).json()) as {
      result: typeof result;
      valueByMachine: Record<
        string,
        {
          machines: { name: string; bySource: Record<string, string[]> }[];
          caseWide: Record<string, string[]>;
        }
      >;
    };
    expect(caseResultSchema.parse(split.result)).toEqual(result);
    for (const [key, scenario] of Object.entries(result.scenarios)) {
      const part = split.valueByMachine[key];
      expect(part.machines.map((m) => m.name)).toEqual(found.input.machines.map((m) => m.name));
      for (const [source, years] of Object.entries(scenario.bySource))
        years.forEach((year, t) => {
          const added = part.machines.reduce(
            (acc, m) => acc + Number(m.bySource[source][t]),
            Number(part.caseWide[source][t]),
          );
          expect(Math.abs(added - Number(year)), `${key} ${source} ${t}`).toBeLessThan(0.005);
        });
    }
    const wrong = await request(engineer, `/api/v1/cases/${mine.id}/result?include=everything`);
    expect(wrong.status).toBe(422);
    expect(JSON.stringify(await wrong.json())).toContain(
      "include: the accepted values are input and value-by-machine",
    );
  });

  it("freezes the next proposal version (201), lists it with its changes, and serves both workbooks", async () => {
    const res = await request(engineer, `/api/v1/cases/${mine.id}/proposals`, { method: "POST" });
    expect(res.status).toBe(201);
    const proposal = proposalSchema.parse(await res.json());
    expect(proposal.version).toBe(2);
    expect(proposal.caseId).toBe(mine.id);
    const { proposals } = await json(
      engineer,
      `/api/v1/cases/${mine.id}/proposals`,
      proposalsSchema,
    );
    expect(proposals.map((p) => p.version)).toEqual([1, 2]);
    expect(proposals[0].changes).toEqual(["First version"]);

    for (const url of [
      `/api/v1/cases/${mine.id}/workbook`,
      `/api/v1/proposals/${proposal.id}/workbook`,
    ]) {
      const xlsx = await request(engineer, url);
      expect(xlsx.status, url).toBe(200);
      expect(xlsx.headers.get("content-type")).toBe(XLSX);
      expect(xlsx.headers.get("content-disposition")).toMatch(/^attachment; filename=".+\.xlsx"$/);
      // An .xlsx is a zip archive: it starts with the "PK" signature.
      expect(new Uint8Array(await xlsx.arrayBuffer()).slice(0, 2)).toEqual(
        new Uint8Array([0x50, 0x4b]),
      );
    }
  });

  it("answers 404 for another engineer's case and proposal on every route, like for missing ids", async () => {
    const { proposals } = await json(
      engineer,
      `/api/v1/cases/${mine.id}/proposals`,
      proposalsSchema,
    );
    const refused: [CookieJar, string, string][] = [
      [engineer, "GET", `/api/v1/cases/${theirs.id}`],
      [engineer, "GET", `/api/v1/cases/${theirs.id}/result`],
      [engineer, "GET", `/api/v1/cases/${theirs.id}/proposals`],
      [engineer, "POST", `/api/v1/cases/${theirs.id}/proposals`],
      [engineer, "GET", `/api/v1/cases/${theirs.id}/workbook`],
      [engineer2, "GET", `/api/v1/proposals/${proposals[0].id}/workbook`],
      [engineer, "GET", `/api/v1/cases/999999`],
      [engineer, "GET", `/api/v1/cases/999999/result`],
      [engineer, "POST", `/api/v1/cases/999999/proposals`],
      [engineer, "GET", `/api/v1/cases/not-a-number/workbook`],
      [engineer, "GET", `/api/v1/proposals/999999/workbook`],
    ];
    for (const [jar, method, url] of refused) {
      const res = await request(jar, url, { method });
      expect(res.status, `${method} ${url}`).toBe(404);
      expect(await res.json()).toEqual({ error: expect.any(String) });
    }
    // Nothing was frozen on the other engineer's case by the refused POST.
    const after = await json(engineer2, `/api/v1/cases/${theirs.id}`, caseDetailSchema);
    expect(after.latestVersion).toBe(theirs.latestVersion);
  });

  it("keeps reviewers and the signed-out away from working cases (403, 401)", async () => {
    for (const url of [
      "/api/v1/cases",
      `/api/v1/cases/${mine.id}`,
      `/api/v1/cases/${mine.id}/result`,
      `/api/v1/cases/${mine.id}/workbook`,
    ]) {
      expect((await request(reviewer, url)).status, url).toBe(403);
      expect((await request(null, url)).status, url).toBe(401);
    }
    expect(
      (await request(reviewer, `/api/v1/cases/${mine.id}/proposals`, { method: "POST" })).status,
    ).toBe(403);
  });
});
