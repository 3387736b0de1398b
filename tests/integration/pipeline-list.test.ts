import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { pipeline, pipelineQuotesPage } from "@/db/queries/pipeline";
import { ForbiddenError } from "@/lib/errors";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";
import { PIPELINE_SORTS, pipelineListParamsSchema } from "@/lib/validations/pipeline";
import { caller } from "../support/callers";

const manager = () => caller("manager@example.com");
const engineer = () => caller("engineer@example.com");

describe("the pipeline's quote list pages and sorts on the server", () => {
  it("has the same quotes as the charts' whole filtered set, page after page, for every sort", () => {
    const all = pipeline(manager()).quotes;
    expect(all.length).toBeGreaterThanOrEqual(5);
    for (const sort of PIPELINE_SORTS)
      for (const dir of ["asc", "desc"] as const) {
        const first = pipelineQuotesPage(manager(), {}, { sort, dir, page: 1 }, 2);
        expect(first.total).toBe(all.length);
        const ids: number[] = [];
        for (let page = 1; page <= first.pageCount; page++)
          ids.push(
            ...pipelineQuotesPage(manager(), {}, { sort, dir, page }, 2).rows.map((q) => q.id),
          );
        expect(
          [...ids].sort((a, b) => a - b),
          `${sort} ${dir}`,
        ).toEqual(all.map((q) => q.id).sort((a, b) => a - b));
      }
  });

  it("sorts by revenue, investment and weighted revenue as amounts, and by stage in the stages' order", () => {
    const rows = pipelineQuotesPage(manager(), {}, { sort: "investment", dir: "desc" }, 1000).rows;
    for (let i = 1; i < rows.length; i++)
      expect(new Decimal(rows[i - 1].value).gte(rows[i].value)).toBe(true);
    const revenue = pipelineQuotesPage(manager(), {}, { sort: "revenue", dir: "asc" }, 1000).rows;
    for (let i = 1; i < revenue.length; i++)
      expect(new Decimal(revenue[i - 1].vendorRevenue).lte(revenue[i].vendorRevenue)).toBe(true);
    const chance = pipelineQuotesPage(manager(), {}, { sort: "chance", dir: "desc" }, 1000).rows;
    for (let i = 1; i < chance.length; i++)
      expect(chance[i - 1].probabilityPct).toBeGreaterThanOrEqual(chance[i].probabilityPct);
    const weighted = pipelineQuotesPage(manager(), {}, { sort: "weighted", dir: "asc" }, 1000).rows;
    for (let i = 1; i < weighted.length; i++)
      expect(new Decimal(weighted[i - 1].weighted).lte(weighted[i].weighted)).toBe(true);
    const stages = pipelineQuotesPage(manager(), {}, { sort: "stage", dir: "asc" }, 1000).rows.map(
      (q) => QUOTE_STAGES.indexOf(q.stage),
    );
    expect(stages).toEqual([...stages].sort((a, b) => a - b));
    const paybacks = pipelineQuotesPage(manager(), {}, { sort: "payback", dir: "desc" }, 1000).rows;
    const firstNever = paybacks.findIndex((q) => q.paybackYears === null);
    if (firstNever >= 0)
      expect(paybacks.slice(firstNever).every((q) => q.paybackYears === null)).toBe(true);
  });

  it("keeps the filters and the caller's scope, and the page past the end shows the last", () => {
    const stage = pipeline(manager()).quotes[0].stage;
    const filtered = pipelineQuotesPage(manager(), { stage }, {}, 1000);
    expect(filtered.rows.every((q) => q.stage === stage)).toBe(true);
    expect(filtered.total).toBe(pipeline(manager(), { stage }).quotes.length);
    const own = pipelineQuotesPage(engineer(), {}, {}, 1000);
    expect(own.rows.every((q) => q.ownerId === engineer().id)).toBe(true);
    expect(own.total).toBe(pipeline(engineer()).quotes.length);
    const last = pipelineQuotesPage(manager(), {}, { page: 999 }, 2);
    expect(last.page).toBe(last.pageCount);
    expect(() => pipelineQuotesPage(caller("reviewer@example.com"), {})).toThrow(ForbiddenError);
  });

  it("reads the list state from the URL and falls back on bad values", () => {
    expect(pipelineListParamsSchema.parse({ sort: "nonsense", dir: "up", page: "-3" })).toEqual({
      sort: "created",
      dir: "desc",
      page: 1,
    });
    // A link saved when the one value column was the customer's investment still sorts by it.
    expect(pipelineListParamsSchema.parse({ sort: "value", dir: "asc" })).toMatchObject({
      sort: "investment",
      dir: "asc",
    });
  });
});
