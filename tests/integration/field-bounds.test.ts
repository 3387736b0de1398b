// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { POST as evaluateRoute } from "@/app/api/v1/evaluate/route";
import { FIELD_BOUNDS } from "@/lib/engine/schema-fields";
import { IMPORT_FIELDS } from "@/lib/import/fields";
import { siteInputSchema } from "@/lib/validations/installed-base";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

// Issue 13, finding 6: one bound per field, the same in the API, the forms and the import.
describe("FIELD_BOUNDS everywhere", () => {
  it("the API refuses ambientC -1000 and ratedCurrentA 1e308 with 422 naming the bound", async () => {
    const input = JSON.parse(
      fs.readFileSync(path.resolve("tests/fixtures/engine-case.json"), "utf8"),
    ) as { axes: { duty: Record<string, unknown>; motor: Record<string, unknown> }[] };
    input.axes[0].duty.ambientC = -1000;
    input.axes[0].motor.ratedCurrentA = 1e308;
    const res = await asRequestOf(caller("engineer@example.com"), () =>
      evaluateRoute(
        new Request("http://localhost/api/v1/evaluate", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify(input),
        }),
      ),
    );
    expect(res.status).toBe(422);
    const body = (await res.json()) as { problems: string[] };
    expect(body.problems).toContain("axes[0].duty.ambientC: must be at least -40 °C");
    expect(body.problems).toContain("axes[0].motor.ratedCurrentA: must be at most 100 A");
  });

  it("the site form and the import column take the same ambient bound object", () => {
    const site = siteInputSchema.safeParse({
      name: "Hall",
      currency: "EUR",
      tariffPerKWh: "0.2",
      hoursPerYear: 4000,
      ambientC: 81,
    });
    expect(site.error?.issues.map((i) => i.message)).toEqual(["must be at most 80 °C"]);
    const column = IMPORT_FIELDS.find((f) => f.key === "ambientC");
    expect(column?.bound).toBe(FIELD_BOUNDS.ambientC);
  });
});
