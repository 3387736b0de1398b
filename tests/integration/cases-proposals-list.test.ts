import { describe, expect, it } from "vitest";
import { listAxesForExport } from "@/db/queries/axes";
import { createCase, getCaseOrThrow } from "@/db/queries/cases";
import { setCaseAxes, setCaseAxesRetrofit } from "@/db/queries/case-axes";
import { listProposalsPage } from "@/db/queries/proposal-list";
import { listProposals } from "@/db/queries/proposal-versions";
import { listSites } from "@/db/queries/sites";
import { freezeProposal } from "@/server/cases/freeze";
import { bulkRetrofitSchema } from "@/lib/validations/case";
import { proposalListParamsSchema } from "@/lib/validations/case-lists";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const manager = () => caller("manager@example.com");

const params = (raw: Record<string, string>) => proposalListParamsSchema.parse(raw);

// A case frozen three times, its install hours changed between the versions.
function caseWithThreeVersions() {
  const site = listSites(manager()).find((s) => s.name === "North hall")!;
  const c = createCase(engineer(), { name: "Three versions", siteId: site.id });
  const axisIds = listAxesForExport(engineer(), site.id, 0, 3).axes.map((a) => a.id);
  setCaseAxes(engineer(), c.id, axisIds);
  for (const hours of [2, 3, 4]) {
    setCaseAxesRetrofit(
      engineer(),
      c.id,
      bulkRetrofitSchema.parse({ axisIds, installHours: hours }),
    );
    freezeProposal(hours === 3 ? manager() : engineer(), c.id);
  }
  return getCaseOrThrow(engineer(), c.id);
}

describe("a case's proposal versions, filtered, sorted and paged in SQL", () => {
  it("pages newest first with what changed against the version before, as the full list says", () => {
    const found = caseWithThreeVersions();
    const full = new Map(listProposals(engineer(), found.id).map((p) => [p.version, p]));
    const first = listProposalsPage(found, params({}), 2);
    const second = listProposalsPage(found, params({ page: "2" }), 2);
    expect(first).toMatchObject({ total: 3, pageCount: 2, page: 1 });
    const rows = [...first.rows, ...second.rows];
    expect(rows.map((r) => r.version)).toEqual([3, 2, 1]);
    for (const r of rows) expect(r).toEqual(full.get(r.version));
    expect(listProposalsPage(found, params({ dir: "asc" }), 2).rows.map((r) => r.version)).toEqual([
      1, 2,
    ]);
  });

  it("filters by stage and by version or who froze it", () => {
    const found = caseWithThreeVersions();
    // Freezing a newer version replaces the older open quotes.
    expect(
      listProposalsPage(found, params({ stage: "replaced" })).rows.map((r) => r.version),
    ).toEqual([2, 1]);
    expect(listProposalsPage(found, params({ q: "v2" })).rows.map((r) => r.version)).toEqual([2]);
    expect(
      listProposalsPage(found, params({ q: "sales manager" })).rows.map((r) => r.version),
    ).toEqual([2]);
    expect(listProposalsPage(found, params({ q: "nobody" })).total).toBe(0);
    expect(listProposalsPage(found, params({ stage: "bogus" })).total).toBe(3);
  });
});
