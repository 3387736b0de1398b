import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { accounts, caseAxes, cases, sites } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import type { EventPricing } from "@/lib/results/event-cost-view";
import { getAxisOrThrow } from "./axes";
import { caseScope } from "./cases";

/**
 * The cases that price this axis's step-loss events: each case's downtime cost per hour and
 * labour rate (docs/model.md (The business case)), so the axis form can show the cost an event
 * built up from downtime, scrap and labour comes to in each. At most `limit`, by name.
 */
export function listAxisEventPricing(
  caller: SessionUser,
  axisId: number,
  limit = 5,
): EventPricing[] {
  getAxisOrThrow(caller, axisId);
  return db
    .select({
      caseName: cases.name,
      assumptions: cases.assumptions,
      currency: sites.currency,
    })
    .from(caseAxes)
    .innerJoin(cases, eq(cases.id, caseAxes.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .where(and(eq(caseAxes.axisId, axisId), caseScope(caller)))
    .orderBy(asc(cases.name), asc(cases.id))
    .limit(limit)
    .all()
    .map((row) => ({
      caseName: row.caseName,
      currency: row.currency,
      downtimeCostPerHour: row.assumptions.finance.downtimeCostPerHour,
      laborRatePerHour: row.assumptions.finance.laborRatePerHour,
    }));
}
