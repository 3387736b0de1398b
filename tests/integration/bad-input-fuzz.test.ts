// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { saveAxisAction, updateSiteAction } from "@/server/installed-base/actions";
import { setAxisRetrofitAction, updateAssumptionsAction } from "@/server/cases/actions";
import { addVendorCommentAction } from "@/server/proposals/actions";
import { GET as axisGet, PUT as axisPut } from "@/app/api/v1/axes/[axisId]/route";
import { GET as caseGet } from "@/app/api/v1/cases/[caseId]/route";
import { POST as evaluatePost } from "@/app/api/v1/evaluate/route";
import { GET as siteAxesGet, POST as siteAxesPost } from "@/app/api/v1/sites/[siteId]/axes/route";
import { POST as importPost } from "@/app/api/v1/sites/[siteId]/imports/route";
import { db } from "@/db";
import { listSites } from "@/db/queries/sites";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

// Issue 13, finding 6: generated bad input across the API and the actions — bodies, query
// strings, ids and uploads — never answers 500, never throws out of an action, and writes
// nothing. Over 1,000 inputs in all (fast-check, fixed seed so a failure replays).
const engineer = () => caller("engineer@example.com");

// Ids that are not ids: everything parseId refuses, as a route segment and as an action argument.
const badIdText = fc.oneof(
  fc.constantFrom("", "0", "-1", "1.5", "1e3", "0x10", " 1", "1 ", "+1", "01", "NaN", "Infinity"),
  fc.string().filter((s) => !/^[1-9][0-9]{0,15}$/.test(s)),
);
const badIdValue: fc.Arbitrary<unknown> = fc.oneof(
  badIdText,
  fc.constantFrom(true, false, null, undefined, [2], { id: 1 }, 0, -1, 1.5, NaN, Infinity),
  fc.double().filter((n) => !Number.isSafeInteger(n) || n < 1),
);
const anyBody = fc.oneof(
  fc.jsonValue().map((v) => JSON.stringify(v)),
  fc.string(),
  fc.constantFrom("null", "{", "[]", '{"axes":null}', '{"currency":"EUR","axes":[{}]}'),
);

function tableCounts(): Record<string, number> {
  const client = db.$client;
  const tables = client
    .prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'")
    .all() as { name: string }[];
  return Object.fromEntries(
    tables.map(({ name }) => [
      name,
      (client.prepare(`SELECT count(*) AS n FROM "${name}"`).get() as { n: number }).n,
    ]),
  );
}

const json = (body: string) =>
  new Request("http://localhost/x", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body,
  });
const params = <K extends string>(key: K, value: string) => ({
  params: Promise.resolve({ [key]: value } as Record<K, string>),
});

describe("generated bad input", () => {
  it("answers no 500, throws out of no action and writes nothing (1,000+ inputs)", async () => {
    const site = listSites(engineer())[0];
    const before = tableCounts();
    let calls = 0;
    const status = async (call: () => Promise<Response>) => {
      calls++;
      const res = await asRequestOf(engineer(), call);
      expect(res.status).not.toBe(500);
      expect(res.status).toBeGreaterThanOrEqual(400);
    };
    const action = async (call: () => Promise<{ ok: boolean }>) => {
      calls++;
      const result = await asRequestOf(engineer(), call);
      expect(result.ok).toBe(false);
    };
    const runs = { numRuns: 130, seed: 13 };

    await fc.assert(
      fc.asyncProperty(badIdText, anyBody, async (id, body) => {
        await status(() => caseGet(new Request("http://localhost/x"), params("caseId", id)));
        await status(() => axisGet(new Request("http://localhost/x"), params("axisId", id)));
        await status(() => axisPut(json(body), params("axisId", id)));
        await status(() => siteAxesPost(json(body), params("siteId", id)));
      }),
      runs,
    );
    await fc.assert(
      fc.asyncProperty(anyBody, async (body) => {
        await status(() => evaluatePost(json(body)));
        await status(() => siteAxesPost(json(body), params("siteId", String(site.id))));
      }),
      runs,
    );
    // Query strings of the axes table: anything unknown falls back to a default (200), never 500.
    await fc.assert(
      fc.asyncProperty(fc.string(), fc.string(), async (key, value) => {
        calls++;
        const url = `http://localhost/x?${encodeURIComponent(key)}=${encodeURIComponent(value)}&page=${encodeURIComponent(value)}&sort=${encodeURIComponent(key)}`;
        const res = await asRequestOf(engineer(), () =>
          siteAxesGet(new Request(url), params("siteId", String(site.id))),
        );
        expect(res.status).not.toBe(500);
      }),
      runs,
    );
    // Uploads: random bytes, and a dry run that is neither true nor false.
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 2048 }), fc.string(), async (bytes, dryRun) => {
        const form = new FormData();
        form.set("file", new File([bytes], "upload.xlsx"));
        form.set("dryRun", dryRun === "true" || dryRun === "false" ? "maybe" : dryRun);
        await status(() =>
          importPost(
            new Request("http://localhost/x", { method: "POST", body: form }),
            params("siteId", String(site.id)),
          ),
        );
      }),
      runs,
    );
    await fc.assert(
      fc.asyncProperty(badIdValue, fc.anything(), async (id, values) => {
        await action(() => updateSiteAction(id as number, values));
        await action(() => saveAxisAction(id as number, values));
        await action(() => updateAssumptionsAction(id as number, values));
        await action(() => setAxisRetrofitAction(id as number, id as number, values));
        await action(() => addVendorCommentAction(id as number, { body: "hello" }));
      }),
      runs,
    );

    expect(calls).toBeGreaterThanOrEqual(1000);
    expect(tableCounts()).toEqual(before);
  }, 300_000);
});
