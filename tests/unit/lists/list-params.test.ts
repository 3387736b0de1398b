import { describe, expect, it } from "vitest";
import { listHref, listParamsSchema, pageWindow } from "@/lib/lists/list-params";

describe("list state in the URL", () => {
  const schema = listParamsSchema(["name", "createdAt"] as const, { sort: "name" });

  it("falls back to the defaults for bad values instead of failing", () => {
    expect(schema.parse({ sort: "drop table", dir: "sideways", page: "-3" })).toEqual({
      q: undefined,
      sort: "name",
      dir: "asc",
      page: 1,
    });
  });

  it("keeps good values", () => {
    expect(schema.parse({ q: " acme ", sort: "createdAt", dir: "desc", page: "4" })).toEqual({
      q: "acme",
      sort: "createdAt",
      dir: "desc",
      page: 4,
    });
  });

  it("clamps the page to the pages that exist", () => {
    expect(pageWindow(0, 5, 25)).toMatchObject({ page: 1, pageCount: 1, offset: 0 });
    expect(pageWindow(51, 9, 25)).toMatchObject({ page: 3, pageCount: 3, offset: 50 });
  });

  it("keeps other parameters and resets the page when the filter changes", () => {
    const current = { q: "line 2", sort: "name", page: "3", stage: "won" };
    expect(listHref("/cases", current, { q: "line 3" })).toBe(
      "/cases?q=line+3&sort=name&stage=won",
    );
    expect(listHref("/cases", current, { page: 4 })).toBe(
      "/cases?q=line+2&sort=name&page=4&stage=won",
    );
  });
});
