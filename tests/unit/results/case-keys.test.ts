import { QueryClient } from "@tanstack/react-query";
import { describe, expect, it } from "vitest";
import { caseKeys, invalidateCase } from "@/lib/hooks/use-case-result";

describe("case query keys", () => {
  it("nest the result under its case, so one invalidation refreshes both", async () => {
    expect(caseKeys.result("c1").slice(0, caseKeys.detail("c1").length)).toEqual([
      ...caseKeys.detail("c1"),
    ]);
    const client = new QueryClient();
    client.setQueryData(caseKeys.detail("c1"), { id: "c1" });
    client.setQueryData(caseKeys.result("c1"), { engineVersion: "1" });
    client.setQueryData(caseKeys.result("c2"), { engineVersion: "1" });
    await invalidateCase(client, "c1");
    expect(caseKeys.detail(7)).toEqual(caseKeys.detail("7"));
    const state = (key: readonly unknown[]) => client.getQueryState(key)?.isInvalidated;
    expect(state(caseKeys.detail("c1"))).toBe(true);
    expect(state(caseKeys.result("c1"))).toBe(true);
    expect(state(caseKeys.result("c2"))).toBe(false);
    // The data stays for the screen while the refetch runs.
    expect(client.getQueryData(caseKeys.result("c1"))).toEqual({ engineVersion: "1" });
  });
});
