import { describe, expect, it } from "vitest";
import { IMPORT_FIELDS } from "@/lib/import/fields";
import { fieldForHeader, matchHeaders } from "@/lib/import/headers";
import { templateHeaders } from "@/lib/import/template";

describe("matchHeaders: automatic match", () => {
  it("matches every template header to its field in the SI unit", () => {
    const { mapping, problems, ignored, missing } = matchHeaders(templateHeaders());
    expect(problems).toEqual([]);
    expect(ignored).toEqual([]);
    expect(missing).toEqual([]);
    expect(Object.values(mapping).map((m) => m.key)).toEqual(IMPORT_FIELDS.map((f) => f.key));
    expect(mapping[IMPORT_FIELDS.findIndex((f) => f.key === "holdingTorqueNm")]).toEqual({
      key: "holdingTorqueNm",
      unit: "N·m",
      factor: 1,
    });
  });

  it("ignores case, spaces and punctuation, and accepts the field key itself", () => {
    const { mapping } = matchHeaders([
      "MACHINE",
      "axis-label",
      " holding_torque (oz·in)",
      "holdingTorqueNm",
      "peakTorqueNm",
    ]);
    expect(mapping[0]).toEqual({ key: "machine", unit: "", factor: 1 });
    expect(mapping[1]).toEqual({ key: "label", unit: "", factor: 1 });
    expect(mapping[2]).toEqual({ key: "holdingTorqueNm", unit: "ozf·in", factor: 7.061552e-3 });
    expect(mapping[4]).toEqual({ key: "peakTorqueNm", unit: "N·m", factor: 1 });
  });

  it("reads the unit of each header: kgf·cm, lbf·ft, H, rev/s", () => {
    const { mapping, problems } = matchHeaders([
      "Load torque [kgf·cm]",
      "Peak torque [lbf·ft]",
      "Phase inductance [H]",
      "Speed [rev/s]",
    ]);
    expect(problems).toEqual([]);
    expect(Object.values(mapping).map((m) => [m.key, m.unit, m.factor])).toEqual([
      ["loadTorqueNm", "kgf·cm", 9.80665e-2],
      ["peakTorqueNm", "lbf·ft", 1.355818],
      ["phaseInductanceMh", "H", 1000],
      ["speedRpm", "rev/s", 60],
    ]);
  });

  it("takes unambiguous synonyms only: 'Qty' and 'Machine name' match, 'Motor current' does not", () => {
    expect(fieldForHeader("Qty")?.key).toBe("quantity");
    expect(fieldForHeader("Machine name")?.key).toBe("machine");
    expect(fieldForHeader("Rated phase current [A]")?.key).toBe("ratedCurrentA");
    expect(fieldForHeader("Motor current [A]")).toBeUndefined();
    expect(fieldForHeader("Current [A]")).toBeUndefined();
    expect(fieldForHeader("Torque [N·m]")).toBeUndefined();
  });

  it("lists unknown headers as ignored and required fields without a column as missing", () => {
    const result = matchHeaders(["Machine", "Notes", "", "Axis label"]);
    expect(result.ignored).toEqual([{ column: 1, header: "Notes" }]);
    expect(result.missing).toContain("holdingTorqueNm");
    expect(result.missing).not.toContain("machine");
    expect(result.missing).not.toContain("quantity");
  });

  it("reports an unknown unit of a known quantity, naming the units to use", () => {
    const result = matchHeaders(["Holding torque [furlongs]", "Rated current [mA]"]);
    expect(result.mapping).toEqual({});
    expect(result.problems).toEqual([
      {
        column: 0,
        header: "Holding torque [furlongs]",
        key: "holdingTorqueNm",
        message:
          'unit "furlongs" is not a torque unit; use one of N·m, mN·m, ozf·in, lbf·in, lbf·ft, kgf·cm, e.g. "Holding torque [N·m]"',
      },
      {
        column: 1,
        header: "Rated current [mA]",
        key: "ratedCurrentA",
        message:
          'unit "mA" does not fit Rated current; enter the values in A and head the column "Rated current [A]"',
      },
    ]);
    // A column with a unit problem is not also reported as missing.
    expect(result.missing).not.toContain("holdingTorqueNm");
  });

  it("reports a second column for the same field and keeps the first", () => {
    const result = matchHeaders(["Holding torque [N·m]", "Machine", "holding torque [oz·in]"]);
    expect(result.mapping[0]).toEqual({ key: "holdingTorqueNm", unit: "N·m", factor: 1 });
    expect(result.mapping[2]).toBeUndefined();
    expect(result.problems).toEqual([
      {
        column: 2,
        header: "holding torque [oz·in]",
        key: "holdingTorqueNm",
        message:
          'a second Holding torque column (the first is "Holding torque [N·m]"); delete one of them or map this one to another field',
      },
    ]);
  });
});

describe("matchHeaders: user mapping", () => {
  it("maps a header to the field chosen, with the unit from the header or else the SI unit", () => {
    const result = matchHeaders(["Motor", "Tq hold (oz-in)", "Tq load", "Motor current [A]"], {
      Motor: "machine",
      "Tq hold (oz-in)": "holdingTorqueNm",
      "Tq load": "loadTorqueNm",
      "Motor current [A]": "ratedCurrentA",
    });
    expect(result.problems).toEqual([]);
    expect(result.mapping).toEqual({
      0: { key: "machine", unit: "", factor: 1 },
      1: { key: "holdingTorqueNm", unit: "ozf·in", factor: 7.061552e-3 },
      2: { key: "loadTorqueNm", unit: "N·m", factor: 1 },
      3: { key: "ratedCurrentA", unit: "A", factor: 1 },
    });
  });

  it("overrides the automatic match and may leave a column out", () => {
    const result = matchHeaders(["Rated current [A]", "Drive current setting [A]"], {
      "Rated current [A]": null,
      "Drive current setting [A]": "ratedCurrentA",
    });
    expect(result.mapping).toEqual({ 1: { key: "ratedCurrentA", unit: "A", factor: 1 } });
    expect(result.ignored).toEqual([{ column: 0, header: "Rated current [A]" }]);
  });

  it("reports a mapping to a field that does not exist and a header the sheet lacks", () => {
    const result = matchHeaders(["Machine", "Colour"], {
      Colour: "paintColour",
      Weight: "quantity",
    });
    expect(result.problems.map((p) => [p.column, p.header, p.message])).toEqual([
      [
        1,
        "Colour",
        'the mapping assigns "paintColour", which is not an import field; choose one of the template\'s columns or leave the column out',
      ],
      [
        null,
        "Weight",
        'the mapping names a column "Weight" that the sheet does not have; pick the sheet that has it or remove it from the mapping',
      ],
    ]);
  });

  it("still checks the header's unit against the field chosen", () => {
    const result = matchHeaders(["Tq [furlongs]"], { "Tq [furlongs]": "peakTorqueNm" });
    expect(result.problems[0]?.message).toMatch(/^unit "furlongs" is not a torque unit/);
  });
});
