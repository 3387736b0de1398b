import { and, desc, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditLog } from "@/db/schema";
import { listAxesForExport } from "@/db/queries/axes";
import { createCase, getCaseOrThrow, listCases } from "@/db/queries/cases";
import { listCaseAxes, setCaseAxes, setCaseAxesRetrofit } from "@/db/queries/case-axes";
import { listKits } from "@/db/queries/catalogue";
import { listSites } from "@/db/queries/sites";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { bulkRetrofitSchema } from "@/lib/validations/case";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const siteNamed = (name: string) => listSites(manager()).find((s) => s.name === name)!;

// A fresh case of the engineer's on North hall with the site's first six axes picked.
function newCase(who = engineer()) {
  const site = siteNamed("North hall");
  const row = createCase(who, {
    name: `Bulk ${Math.random().toString(36).slice(2)}`,
    siteId: site.id,
  });
  const picked = listAxesForExport(who, site.id, 0, 6).axes.map((a) => a.id);
  setCaseAxes(who, row.id, picked);
  return { id: row.id, name: row.name, axisIds: picked, currency: site.currency };
}

const termsOf = (caseId: number) =>
  new Map(
    listCaseAxes(manager(), caseId).map((a) => [
      a.axisId,
      {
        kitId: a.kitId,
        discountPct: a.discountPct,
        installHours: a.installHours,
        commissioningCost: a.commissioningCost,
      },
    ]),
  );

const bulkAudits = (caseId: number) =>
  db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.action, "case.bulk-retrofit"), eq(auditLog.targetId, String(caseId))))
    .orderBy(desc(auditLog.id))
    .all();

const parse = (values: Record<string, unknown>) => bulkRetrofitSchema.parse(values);

function messagesOf(values: Record<string, unknown>) {
  const parsed = bulkRetrofitSchema.safeParse(values);
  expect(parsed.success).toBe(false);
  return parsed.error!.issues.map((i) => i.message);
}

describe("bulk edit of a case's axes", () => {
  it("sets the filled-in terms on the selected axes only, leaves blank ones and other axes as they were, and writes one audit row", () => {
    const c = newCase();
    const before = termsOf(c.id);
    const chosen = c.axisIds.slice(0, 3);
    const result = setCaseAxesRetrofit(
      engineer(),
      c.id,
      parse({ axisIds: chosen, discountPct: 12, installHours: "", commissioningCost: "350.50" }),
    );
    expect(result.changed).toBe(3);
    const after = termsOf(c.id);
    for (const id of chosen)
      expect(after.get(id)).toEqual({
        ...before.get(id),
        discountPct: 12,
        commissioningCost: "350.50",
      });
    for (const id of c.axisIds.slice(3)) expect(after.get(id)).toEqual(before.get(id));

    const audits = bulkAudits(c.id);
    expect(audits).toHaveLength(1);
    expect(audits[0].actorEmail).toBe("engineer@example.com");
    expect(audits[0].detail).toBe(
      `${c.name}: 3 axes; discount 12 %, commissioning cost 350.50 ${c.currency}`,
    );
  });

  it("puts an active kit of the catalogue on every selected axis in one step", () => {
    const c = newCase();
    const kit = listKits(manager())
      .filter((k) => k.currency === c.currency)
      .at(-1)!;
    setCaseAxesRetrofit(
      engineer(),
      c.id,
      parse({ axisIds: c.axisIds, kitId: kit.id, installHours: 4 }),
    );
    for (const t of termsOf(c.id).values()) {
      expect(t.kitId).toBe(kit.id);
      expect(t.installHours).toBe(4);
    }
    expect(bulkAudits(c.id)[0].detail).toBe(`${c.name}: 6 axes; kit ${kit.code}, install hours 4`);
  });

  it("names the field in every validation message", () => {
    const axisIds = [1, 2];
    expect(messagesOf({ axisIds, discountPct: 120 })).toEqual(["Discount % must be at most 100"]);
    expect(messagesOf({ axisIds, discountPct: -1 })).toEqual(["Discount % must be at least 0"]);
    expect(messagesOf({ axisIds, installHours: -2 })[0]).toMatch(
      /^Install hours must be at least 0/,
    );
    expect(messagesOf({ axisIds, installHours: 20_000 })[0]).toMatch(
      /^Install hours must be at most/,
    );
    expect(messagesOf({ axisIds, commissioningCost: "lots" })).toEqual([
      "Enter the commissioning cost as a number such as 120.00",
    ]);
    expect(messagesOf({ axisIds, kitId: "K-1" })).toEqual(["Kit must be a kit of the catalogue"]);
    expect(messagesOf({ axisIds })).toEqual([
      "Fill in at least one of kit, discount %, install hours or commissioning cost to set",
    ]);
    expect(messagesOf({ axisIds: [], discountPct: 5 })).toEqual(["Select at least one axis"]);
  });

  it("reads numbers as a person types them, with a decimal comma, and refuses '1,234' by name", () => {
    const axisIds = [1, 2];
    expect(
      parse({ axisIds, discountPct: "2,5", installHours: "0,75", commissioningCost: "12,50" }),
    ).toMatchObject({
      discountPct: 2.5,
      installHours: 0.75,
      commissioningCost: "12.50",
    });
    // "1,234" is a thousand in one country and a little over one in another: asked, not guessed.
    expect(messagesOf({ axisIds, installHours: "1,234" })).toEqual([
      "Install hours: write 1234 or 1.234 — '1,234' could mean either",
    ]);
    expect(messagesOf({ axisIds, commissioningCost: "1,250" })).toEqual([
      "Commissioning cost: write 1250 or 1.250 — '1,250' could mean either",
    ]);
    // Blank text leaves the term as it is on each axis.
    expect(parse({ axisIds, discountPct: "", installHours: " 3 " })).toMatchObject({
      installHours: 3,
    });
  });

  it("refuses the whole step for a kit not in the catalogue or retired, and writes nothing", () => {
    const c = newCase();
    const before = termsOf(c.id);
    const stamp = getCaseOrThrow(engineer(), c.id).updatedAt;
    // The demo catalogue holds a retired kit of this currency.
    const retired = listKits(manager(), { includeRetired: true }).find(
      (k) => !k.active && k.currency === c.currency,
    )!;
    expect(retired.active).toBe(false);

    expect(() =>
      setCaseAxesRetrofit(
        engineer(),
        c.id,
        parse({ axisIds: c.axisIds, discountPct: 20, kitId: retired.id }),
      ),
    ).toThrow(
      new ConflictError(`Kit ${retired.code} is retired: choose an active kit of the catalogue`),
    );
    expect(() =>
      setCaseAxesRetrofit(
        engineer(),
        c.id,
        parse({ axisIds: c.axisIds, discountPct: 20, kitId: 99_999_999 }),
      ),
    ).toThrow(new NotFoundError("Kit: no such kit in the catalogue"));
    // An axis of the site that is not in the case spoils the step too.
    const outside = listAxesForExport(engineer(), siteNamed("North hall").id, 6, 1).axes[0].id;
    expect(() =>
      setCaseAxesRetrofit(
        engineer(),
        c.id,
        parse({ axisIds: [...c.axisIds, outside], discountPct: 20 }),
      ),
    ).toThrow(NotFoundError);

    expect(termsOf(c.id)).toEqual(before);
    expect(getCaseOrThrow(engineer(), c.id).updatedAt).toBe(stamp);
    expect(bulkAudits(c.id)).toEqual([]);
  });

  it("is one transaction: when the audit row cannot be written, no axis has changed", () => {
    const c = newCase();
    const before = termsOf(c.id);
    // A trigger on this connection only, refusing the step's audit row.
    db.run(
      sql.raw(
        `CREATE TEMP TRIGGER refuse_bulk_audit BEFORE INSERT ON audit_log WHEN NEW.action = 'case.bulk-retrofit' BEGIN SELECT RAISE(ABORT, 'audit refused'); END`,
      ),
    );
    try {
      expect(() =>
        setCaseAxesRetrofit(
          engineer(),
          c.id,
          parse({ axisIds: c.axisIds, discountPct: 7, installHours: 9 }),
        ),
      ).toThrow(/audit refused/);
    } finally {
      db.run(sql.raw("DROP TRIGGER refuse_bulk_audit"));
    }
    expect(termsOf(c.id)).toEqual(before);
  });
});

describe("who may bulk edit a case", () => {
  it("another engineer's case is not found, a reviewer is refused, a manager may", () => {
    const c = newCase();
    const before = termsOf(c.id);
    const step = parse({ axisIds: c.axisIds, discountPct: 3 });
    // engineer2 does not work on the engineer's North hall account.
    expect(listCases(engineer2()).map((x) => x.id)).not.toContain(c.id);
    expect(() => setCaseAxesRetrofit(engineer2(), c.id, step)).toThrow(
      new NotFoundError("No such case"),
    );
    expect(() => setCaseAxesRetrofit(reviewer(), c.id, step)).toThrow(ForbiddenError);
    expect(() => setCaseAxesRetrofit(engineer(), 99_999_999, step)).toThrow(NotFoundError);
    expect(termsOf(c.id)).toEqual(before);

    setCaseAxesRetrofit(manager(), c.id, step);
    expect([...termsOf(c.id).values()].every((t) => t.discountPct === 3)).toBe(true);
    expect(bulkAudits(c.id)[0].actorEmail).toBe("manager@example.com");
  });
});
