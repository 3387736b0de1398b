import { getTableColumns } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { axes } from "@/db/schema/installed-base";
import { IMPORT_FIELDS, nestedKey } from "@/lib/import/fields";

// The JSON columns motion and event are filled from the `motion.*` and `event.*` fields; the
// resonance band is not imported.
const NOT_IMPORTED = [
  "id",
  "siteId",
  "machineId",
  "referenceMotorId",
  "pullOutCurve",
  "createdAt",
  "motion",
  "event",
  "resonance",
];
const FLAT_FIELDS = IMPORT_FIELDS.filter((f) => nestedKey(f.key) === null);

describe("import fields and the axes table", () => {
  const columns = getTableColumns(axes);

  it("one field per axes column except ids, the reference motor, the pull-out curve and the JSON objects, plus the machine name", () => {
    const axisKeys = Object.keys(columns).filter((k) => !NOT_IMPORTED.includes(k));
    expect(
      FLAT_FIELDS.map((f) => f.key)
        .filter((k) => k !== "machine")
        .sort(),
    ).toEqual(axisKeys.sort());
    expect(IMPORT_FIELDS[0]).toMatchObject({ key: "machine", required: true });
  });

  it("a field is required (or required without a mechanism) exactly when its column is NOT NULL without a default, site values aside", () => {
    for (const field of FLAT_FIELDS) {
      if (field.key === "machine" || field.siteDefault) continue;
      const column = columns[field.key as keyof typeof columns];
      expect({
        key: field.key,
        required: field.required || field.requiredUnlessMotion === true,
      }).toEqual({
        key: field.key,
        required: column.notNull && !column.hasDefault,
      });
    }
  });

  it("the figures docs/model.md (Motion from the mechanism) derives from motion are the ones required only without a mechanism", () => {
    expect(IMPORT_FIELDS.filter((f) => f.requiredUnlessMotion).map((f) => f.key)).toEqual([
      "movePct",
      "holdPct",
      "speedRpm",
      "loadTorqueNm",
      "peakTorqueNm",
    ]);
  });

  it("the defaults are the table's defaults (docs/contracts.md (Case input))", () => {
    for (const field of IMPORT_FIELDS) {
      if (field.default === undefined) continue;
      const column = columns[field.key as keyof typeof columns];
      expect({ key: field.key, default: field.default }).toEqual({
        key: field.key,
        default: column.default,
      });
    }
  });

  it("the site supplies hours per year and ambient temperature when a row leaves them blank", () => {
    expect(IMPORT_FIELDS.filter((f) => f.siteDefault).map((f) => f.key)).toEqual([
      "hoursPerYear",
      "ambientC",
    ]);
  });

  it("choices are the table's enums", () => {
    for (const field of FLAT_FIELDS.filter((f) => f.type === "enum")) {
      const column = columns[field.key as keyof typeof columns] as { enumValues?: string[] };
      expect([...(field.choices ?? [])].sort()).toEqual([...(column.enumValues ?? [])].sort());
    }
  });

  it("every field has a label and a help sentence", () => {
    for (const field of IMPORT_FIELDS) {
      expect(field.label).toMatch(/^[A-Z]/);
      expect(field.help).toMatch(/^[A-Z].*\.$/);
    }
  });
});
