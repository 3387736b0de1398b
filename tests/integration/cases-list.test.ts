import { describe, expect, it } from "vitest";
import { listCasesPage } from "@/db/queries/case-list";
import { createCase, listCases } from "@/db/queries/cases";
import { listSites } from "@/db/queries/sites";
import { ForbiddenError } from "@/lib/errors";
import { caseListParamsSchema } from "@/lib/validations/case-lists";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const params = (raw: Record<string, string>) => caseListParamsSchema.parse(raw);

describe("the cases list, filtered, sorted and paged in SQL", () => {
  it("pages the caller's cases only, in the order asked, and every page joins up to the whole list", () => {
    const all = listCases(manager());
    const sorted = [...all].sort((a, b) => a.name.localeCompare(b.name) || a.id - b.id);
    const pages = [1, 2, 3].map((page) =>
      listCasesPage(manager(), params({ sort: "name", dir: "asc", page: String(page) }), 3),
    );
    expect(pages[0]).toMatchObject({ total: all.length, pageCount: Math.ceil(all.length / 3) });
    expect(pages.flatMap((p) => p.rows.map((r) => r.name))).toEqual(sorted.map((c) => c.name));
    // A page past the end shows the last one.
    expect(listCasesPage(manager(), params({ page: "99" }), 3).page).toBe(pages[0].pageCount);

    const mine = listCasesPage(engineer(), params({}), 100);
    expect(mine.rows.map((r) => r.id).sort()).toEqual(
      listCases(engineer())
        .map((c) => c.id)
        .sort(),
    );
    // Another engineer's list holds none of the cases outside their accounts.
    const theirs = new Set(listCases(engineer2()).map((c) => c.id));
    expect(listCasesPage(engineer2(), params({}), 100).rows.every((r) => theirs.has(r.id))).toBe(
      true,
    );
    expect(listCasesPage(engineer2(), params({}), 100).total).toBe(theirs.size);
    expect(() => listCasesPage(reviewer(), params({}))).toThrow(ForbiddenError);
  });

  it("filters by text (name, account, site, owner; % and _ taken literally) and by stage", () => {
    const site = listSites(manager()).find((s) => s.name === "North hall")!;
    const odd = createCase(engineer(), { name: "Odd 100%_name", siteId: site.id });
    createCase(engineer(), { name: "Odd 1000 name", siteId: site.id });
    expect(listCasesPage(engineer(), params({ q: "100%_" })).rows.map((r) => r.id)).toEqual([
      odd.id,
    ]);

    const byAccount = listCasesPage(manager(), params({ q: "webline" }), 100).rows;
    expect(byAccount.length).toBeGreaterThan(0);
    expect(byAccount.every((r) => r.accountName === "Webline Print Finishing")).toBe(true);

    const drafts = listCasesPage(manager(), params({ stage: "draft" }), 100);
    expect(drafts.total).toBe(listCases(manager()).filter((c) => c.stage === "draft").length);
    expect(drafts.rows.every((r) => r.stage === "draft")).toBe(true);
    // A stage that is not one is no filter.
    expect(listCasesPage(manager(), params({ stage: "nonsense" }), 100).total).toBe(
      listCases(manager()).length,
    );
  });

  it("sorts by axis count, largest first", () => {
    const rows = listCasesPage(manager(), params({ sort: "axes", dir: "desc" }), 100).rows;
    const counts = rows.map((r) => r.axisCount);
    expect(counts).toEqual([...counts].sort((a, b) => b - a));
  });
});
