import { getTableColumns } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { axes } from "@/db/schema/installed-base";
import { IMPORT_FIELDS } from "@/lib/import/fields";

const NOT_IMPORTED = ["id", "siteId", "machineId", "referenceMotorId", "pullOutCurve", "createdAt"];

describe("import fields and the axes table", () => {
  const columns = getTableColumns(axes);

  it("one field per axes column except ids, the reference motor and the pull-out curve, plus the machine name", () => {
    const axisKeys = Object.keys(columns).filter((k) => !NOT_IMPORTED.includes(k));
    expect(
      IMPORT_FIELDS.map((f) => f.key)
        .filter((k) => k !== "machine")
        .sort(),
    ).toEqual(axisKeys.sort());
    expect(IMPORT_FIELDS[0]).toMatchObject({ key: "machine", required: true });
  });

  it("a field is required exactly when its column is NOT NULL without a default, site values aside", () => {
    for (const field of IMPORT_FIELDS) {
      if (field.key === "machine" || field.siteDefault) continue;
      const column = columns[field.key];
      expect({ key: field.key, required: field.required }).toEqual({
        key: field.key,
        required: column.notNull && !column.hasDefault,
      });
    }
  });

  it("the defaults are the table's defaults (ENGINE.md §2)", () => {
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
    for (const field of IMPORT_FIELDS.filter((f) => f.type === "enum")) {
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
