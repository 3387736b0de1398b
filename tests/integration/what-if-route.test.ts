import "../support/node-async-storage";
import Decimal from "decimal.js";
import { eq, ne, and, isNotNull } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as whatIfRoute } from "@/app/api/v1/proposals/[proposalId]/what-if/route";
import { listProposalsFor } from "@/db/queries/proposals";
import { db } from "@/db";
import { accounts, proposals, users } from "@/db/schema";
import type { CaseResult } from "@/lib/engine";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

const reviewer = () => caller("reviewer@example.com");

async function whatIf(body: unknown, who = reviewer(), id?: number) {
  const proposalId = id ?? sentProposalId();
  const res = await asRequestOf(who, () =>
    whatIfRoute(
      new Request(`http://localhost/api/v1/proposals/${proposalId}/what-if`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      }),
      { params: Promise.resolve({ proposalId: String(proposalId) }) },
    ),
  );
  return { status: res.status, json: (await res.json()) as CaseResult & Record<string, unknown> };
}

const sentProposalId = () => listProposalsFor(reviewer()).find((p) => p.stage === "sent")!.id;
const npv = (r: CaseResult) => new Decimal(r.scenarios.physics.npv);

// Each value driver of docs/model.md (The business case), moved one way, must move the NPV the
// way the model says: more savings or output up, costs of money and tax down.
describe("POST /api/v1/proposals/{id}/what-if", () => {
  it("moves the NPV the right way for every value driver", async () => {
    const base = (await whatIf({})).json;
    expect(base.scenarios.physics.npv).toBeDefined();
    const cases: [Record<string, unknown>, "up" | "down"][] = [
      [{ tariffPerKWh: "5" }, "up"],
      [{ runningHoursFactor: 2 }, "up"],
      [{ stepLossEventsFactor: 0.5 }, "down"],
      [{ stepLossEventsFactor: 2 }, "up"],
      [{ costPerEventFactor: 0.5 }, "down"],
      [{ extraOutputFactor: 2 }, "up"],
      [{ discountRatePct: 25 }, "down"],
      [{ horizonYears: 10 }, "up"],
      [{ taxRatePct: 40 }, "down"],
    ];
    for (const [body, way] of cases) {
      const { status, json } = await whatIf(body);
      expect(status, JSON.stringify(body)).toBe(200);
      const moved = npv(json).minus(npv(base));
      if (way === "up") expect(moved.gt(0), `${JSON.stringify(body)} raises the NPV`).toBe(true);
      else expect(moved.lt(0), `${JSON.stringify(body)} lowers the NPV`).toBe(true);
    }
  });

  it("names the field of each bad value", async () => {
    const { status, json } = await whatIf({
      stepLossEventsFactor: -1,
      costPerEventFactor: 11,
      taxRatePct: 100,
      horizonYears: 50,
    });
    expect(status).toBe(422);
    const text = JSON.stringify(json);
    expect(text).toContain("Step-loss events: use a factor of at least 0");
    expect(text).toContain("Cost per event: use a factor of at most 10");
    expect(text).toContain("Tax rate: use less than 100 %");
    expect(text).toContain("horizonYears");
  });

  it("leaves the stored proposal byte-identical", async () => {
    const id = sentProposalId();
    const before = db.select().from(proposals).where(eq(proposals.id, id)).get();
    await whatIf(
      {
        tariffPerKWh: "0.5",
        runningHoursFactor: 1.5,
        stepLossEventsFactor: 0.5,
        costPerEventFactor: 2,
        extraOutputFactor: 3,
        discountRatePct: 12,
        horizonYears: 7,
        taxRatePct: 25,
      },
      reviewer(),
      id,
    );
    const after = db.select().from(proposals).where(eq(proposals.id, id)).get();
    expect(JSON.stringify(after)).toBe(JSON.stringify(before));
  });

  it("answers 404 to a reviewer of another account", async () => {
    const id = sentProposalId();
    const own = reviewer();
    const other = db
      .select({ id: accounts.id })
      .from(accounts)
      .where(and(isNotNull(accounts.id), ne(accounts.id, own.accountId!)))
      .get()!;
    const email = `other-reviewer-${Math.random().toString(36).slice(2)}@example.com`;
    const row = db
      .insert(users)
      .values({
        email,
        name: "Other Reviewer",
        passwordHash: "x",
        role: "reviewer",
        accountId: other.id,
      })
      .returning()
      .get();
    const stranger = { id: row.id, email, name: row.name, role: row.role, accountId: other.id };
    const { status } = await whatIf({ horizonYears: 6 }, stranger, id);
    expect(status).toBe(404);
  });
});
