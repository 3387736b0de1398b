import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { caseResultSchema } from "../support/case-result-schema";
import { request, signInOverHttp, type CookieJar } from "./support/http";

const fixture = fs.readFileSync(path.resolve("tests/fixtures/engine-case.json"), "utf8");
let jar: CookieJar;

beforeAll(async () => {
  ({ jar } = await signInOverHttp("engineer@example.com", "loopshift-demo"));
});

function post(body: string) {
  return request(jar, "/api/v1/evaluate", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body,
  });
}

describe("POST /api/v1/evaluate (docs/contracts.md)", () => {
  it("returns the CaseResult of docs/contracts.md (Case result) for a signed-in user", async () => {
    const res = await post(fixture);
    expect(res.status).toBe(200);
    const result = caseResultSchema.parse(await res.json());
    const input = JSON.parse(fixture);
    expect(result.axes.map((a) => a.id)).toEqual(input.axes.map((a: { id: string }) => a.id));
    expect(result.scenarios.physics.cashFlows).toHaveLength(input.finance.horizonYears + 1);
  });

  it("answers 422 naming the JSON path of every problem", async () => {
    const input = JSON.parse(fixture);
    input.axes[0].duty.peakTorqueNm = 0.1;
    delete input.finance.tariffPerKWh;
    const res = await post(JSON.stringify(input));
    expect(res.status).toBe(422);
    const body = z
      .object({ error: z.string(), problems: z.array(z.string()) })
      .parse(await res.json());
    expect(body.problems).toContain(
      "axes[0].duty.peakTorqueNm: must be at least loadTorqueNm (0.25)",
    );
    expect(body.problems.some((p) => p.startsWith("finance.tariffPerKWh:"))).toBe(true);
  });

  it("answers 422 for a body that is not JSON", async () => {
    const res = await post("{ not json");
    expect(res.status).toBe(422);
    expect((await res.json()).error).toBe("The request is not valid");
  });

  it("refuses a body above 20 MB with 413", async () => {
    const res = await post(`{"pad":"${"x".repeat(20 * 1024 * 1024 + 10)}"}`);
    expect(res.status).toBe(413);
    expect((await res.json()).error).toMatch(/larger than 20 MB/);
  });
});
