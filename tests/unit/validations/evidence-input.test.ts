import { describe, expect, it } from "vitest";
import { evidenceInputSchema } from "@/lib/validations/evidence";

const valid = {
  subjectType: "machine",
  subjectId: "12",
  field: "marginPerOutputHour",
  note: " Controller's costing sheet 2026 ",
  givenOn: "2026-02-28",
  givenBy: "A. Lindqvist, controller",
};

describe("evidenceInputSchema", () => {
  it("takes a note, a calendar day and a name for a figure of its subject", () => {
    expect(evidenceInputSchema.parse(valid)).toEqual({
      ...valid,
      subjectId: 12,
      note: "Controller's costing sheet 2026",
    });
  });

  it("refuses a day that is not on the calendar, blanks, and a figure the subject does not have", () => {
    const issues = (v: object) =>
      evidenceInputSchema.safeParse({ ...valid, ...v }).error?.issues.map((i) => i.path.join("."));
    expect(issues({ givenOn: "2026-02-29" })).toEqual(["givenOn"]);
    expect(issues({ givenOn: "28/02/2026" })).toEqual(["givenOn"]);
    expect(issues({ note: "  ", givenBy: "" })).toEqual(["note", "givenBy"]);
    // Step-loss events are an axis's figure, not a machine's.
    expect(issues({ field: "stepLossEventsPerYear" })).toEqual(["field"]);
    expect(issues({ subjectType: "site" })).toContain("subjectType");
  });
});
