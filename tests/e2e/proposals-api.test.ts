import Decimal from "decimal.js";
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { caseInputSchema } from "@/lib/engine/schema";
import { caseResultSchema } from "../support/case-result-schema";
import { request, signInOverHttp, type CookieJar } from "./support/http";

const stage = z.enum(["ready", "sent", "changes", "accepted", "declined", "replaced"]);
const money = z.string().regex(/^-?\d+(\.\d+)?$/);
// What every caller gets for a proposal: its account, stage, value and version.
const reviewerProposal = z.object({
  id: z.number().int(),
  accountId: z.number().int(),
  accountName: z.string(),
  caseName: z.string(),
  version: z.number().int().positive(),
  stage,
  value: money,
  currency: z.string(),
  sentAt: z.string().nullable(),
});
const vendorProposal = reviewerProposal.extend({
  caseId: z.number().int(),
  ownerId: z.number().int(),
  ownerName: z.string(),
  weighted: money,
  probabilityPct: z.number(),
  expectedCloseOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  maxDiscountPct: z.number(),
});
const pipelineSchema = z.object({
  stages: z.array(
    z.object({
      stage,
      currency: z.string(),
      count: z.number().int(),
      value: money,
      weighted: money,
    }),
  ),
  quotes: z.array(vendorProposal),
});

let reviewer: CookieJar;
let engineer: CookieJar;
let manager: CookieJar;
let admin: CookieJar;

async function json<T>(jar: CookieJar, path: string, schema: z.ZodType<T>, init?: RequestInit) {
  const res = await request(jar, path, init);
  expect(res.status, `${init?.method ?? "GET"} ${path}`).toBe(200);
  return schema.parse(await res.json());
}

const post = (body: unknown): RequestInit => ({
  method: "POST",
  headers: { "content-type": "application/json" },
  body: JSON.stringify(body),
});

beforeAll(async () => {
  [reviewer, engineer, manager, admin] = await Promise.all(
    ["reviewer", "engineer", "manager", "admin"].map(async (who) => {
      const { jar, error } = await signInOverHttp(`${who}@example.com`, "loopshift-demo");
      expect(error).toBeNull();
      return jar;
    }),
  );
});

describe("proposals over HTTP, scoped by the caller", () => {
  it("gives a reviewer only the proposals sent to their account, and 404 on every route for any other id", async () => {
    const mine = await json(
      reviewer,
      "/api/v1/proposals",
      z.object({ proposals: z.array(reviewerProposal) }),
    );
    expect(mine.proposals.length).toBeGreaterThan(0);
    const accountIds = new Set(mine.proposals.map((p) => p.accountId));
    expect(accountIds.size).toBe(1);
    expect(mine.proposals.every((p) => p.sentAt !== null)).toBe(true);
    // No vendor-internal figure reaches a reviewer.
    expect(mine.proposals[0]).not.toHaveProperty("weighted");

    const all = await json(manager, "/api/v1/pipeline", pipelineSchema);
    const notMine = all.quotes.filter((q) => !mine.proposals.some((p) => p.id === q.id));
    expect(notMine.some((q) => !accountIds.has(q.accountId))).toBe(true);
    expect(notMine.some((q) => accountIds.has(q.accountId) && q.sentAt === null)).toBe(true);
    for (const id of [...notMine.map((q) => q.id), 999_999]) {
      for (const [method, path, body] of [
        ["GET", `/api/v1/proposals/${id}`],
        ["GET", `/api/v1/proposals/${id}/workbook`],
        ["GET", `/api/v1/proposals/${id}/comments`],
        ["POST", `/api/v1/proposals/${id}/comments`, { body: "hello" }],
        ["POST", `/api/v1/proposals/${id}/what-if`, { horizonYears: 6 }],
        ["POST", `/api/v1/proposals/${id}/decision`, { decision: "accept", comment: "" }],
      ] as const) {
        const res = await request(reviewer, path, body ? post(body) : { method });
        expect(res.status, `${method} ${path}`).toBe(404);
      }
    }
    // Routes a reviewer may never use refuse by role, whichever the id.
    for (const [method, path] of [
      ["POST", `/api/v1/proposals/${mine.proposals[0].id}/send`],
      ["PATCH", `/api/v1/proposals/${mine.proposals[0].id}`],
      ["POST", `/api/v1/proposals/${mine.proposals[0].id}/discount-approval`],
      ["GET", "/api/v1/pipeline"],
      ["GET", "/api/v1/admin/outbox"],
    ] as const) {
      const res = await request(reviewer, path, {
        method,
        headers: { "content-type": "application/json" },
        body: method === "GET" ? undefined : "{}",
      });
      expect(res.status, `${method} ${path}`).toBe(403);
    }
  });

  it("serves a reviewer's own proposal with its frozen input and result, its workbook, and a sandbox that changes nothing", async () => {
    const { proposals } = await json(
      reviewer,
      "/api/v1/proposals",
      z.object({ proposals: z.array(reviewerProposal) }),
    );
    const detailSchema = reviewerProposal.extend({
      input: caseInputSchema,
      result: caseResultSchema,
    });
    const id = proposals[0].id;
    const before = await json(reviewer, `/api/v1/proposals/${id}`, detailSchema);
    const whatIf = await json(
      reviewer,
      `/api/v1/proposals/${id}/what-if`,
      caseResultSchema,
      post({ tariffPerKWh: "0.45", horizonYears: 9 }),
    );
    expect(whatIf.scenarios.physics.cashFlows).toHaveLength(10);
    expect(whatIf.scenarios.physics.npv).not.toBe(before.result.scenarios.physics.npv);
    const after = await json(reviewer, `/api/v1/proposals/${id}`, detailSchema);
    expect(after).toEqual(before);

    const bad = await request(
      reviewer,
      `/api/v1/proposals/${id}/what-if`,
      post({ horizonYears: 0, discountRatePct: "eight" }),
    );
    expect(bad.status).toBe(422);
    const issues = ((await bad.json()) as { issues: { path: string[]; message: string }[] }).issues;
    expect(issues.map((i) => i.path[0]).sort()).toEqual(["discountRatePct", "horizonYears"]);

    const workbook = await request(reviewer, `/api/v1/proposals/${id}/workbook`);
    expect(workbook.status).toBe(200);
    expect(workbook.headers.get("content-type")).toMatch(/spreadsheetml/);
  });

  it("keeps the pipeline's stage totals equal to the sum of its quotes, and an engineer's to their own quotes", async () => {
    for (const jar of [manager, engineer]) {
      const data = await json(jar, "/api/v1/pipeline", pipelineSchema);
      for (const s of data.stages) {
        const rows = data.quotes.filter((q) => q.stage === s.stage && q.currency === s.currency);
        expect(s.count).toBe(rows.length);
        expect(rows.reduce((a, q) => a.plus(q.value), new Decimal(0)).eq(s.value)).toBe(true);
        expect(rows.reduce((a, q) => a.plus(q.weighted), new Decimal(0)).eq(s.weighted)).toBe(true);
      }
    }
    const { proposals } = await json(
      engineer,
      "/api/v1/proposals",
      z.object({ proposals: z.array(vendorProposal) }),
    );
    const own = await json(engineer, "/api/v1/pipeline", pipelineSchema);
    const ownerIds = new Set(own.quotes.map((q) => q.ownerId));
    expect(ownerIds.size).toBe(1);
    expect(own.quotes.every((q) => proposals.some((p) => p.id === q.id))).toBe(true);
    const filtered = await json(manager, "/api/v1/pipeline?stage=declined", pipelineSchema);
    expect(filtered.quotes.every((q) => q.stage === "declined")).toBe(true);
  });

  it("lets administrators read the outbox, newest first, and nobody else", async () => {
    const outbox = z.array(
      z.object({
        id: z.number(),
        to: z.string(),
        subject: z.string(),
        text: z.string(),
        html: z.string(),
        createdAt: z.string(),
      }),
    );
    const messages = await json(admin, "/api/v1/admin/outbox", outbox);
    const stamps = messages.map((m) => m.createdAt);
    expect([...stamps].sort().reverse()).toEqual(stamps);
    expect((await request(manager, "/api/v1/admin/outbox")).status).toBe(403);
    expect((await request(null, "/api/v1/admin/outbox")).status).toBe(401);
  });
});
