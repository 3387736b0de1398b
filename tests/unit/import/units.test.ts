import { describe, expect, it } from "vitest";
import { importField, type ImportField } from "@/lib/import/fields";
import { resolveColumnUnit, splitHeader, supportedUnits, toSi } from "@/lib/import/units";

const field = (key: string) => importField(key) as ImportField;
const holding = field("holdingTorqueNm");
const inductance = field("phaseInductanceMh");
const speed = field("speedRpm");

const inNm = (unit: string, value: number) => {
  const resolved = resolveColumnUnit(holding, unit);
  if (resolved === undefined) throw new Error(`unit ${unit} not resolved`);
  return toSi(value, resolved.factor);
};

describe("header text `Label [unit]`", () => {
  it("splits square brackets, round brackets and headers without a unit", () => {
    expect(splitHeader("Holding torque [N·m]")).toEqual({ label: "Holding torque", unit: "N·m" });
    expect(splitHeader("  Holding torque  ( oz-in ) ")).toEqual({
      label: "Holding torque",
      unit: "oz-in",
    });
    expect(splitHeader("Holding torque")).toEqual({ label: "Holding torque", unit: null });
    expect(splitHeader("Holding torque []")).toEqual({ label: "Holding torque", unit: null });
  });
});

describe("torque units to N·m (NIST SP 811, 2008, App. B.9, factors for torque)", () => {
  it("N·m is the SI unit; mN·m is 10⁻³ N·m (SI prefix milli)", () => {
    expect(inNm("N·m", 1.26)).toBe(1.26);
    expect(inNm("Nm", 1.26)).toBe(1.26);
    expect(inNm("N m", 1.26)).toBe(1.26);
    expect(inNm("mN·m", 150)).toBeCloseTo(0.15, 12);
  });
  it("NIST SP 811 App. B.9: 1 ozf·in = 7.061 552 E−03 N·m, also written oz·in and oz-in", () => {
    expect(inNm("ozf·in", 1)).toBe(7.061552e-3);
    expect(inNm("oz·in", 1)).toBe(7.061552e-3);
    expect(inNm("oz-in", 1)).toBe(7.061552e-3);
    expect(inNm("oz in", 100)).toBeCloseTo(0.7061552, 12);
  });
  it("NIST SP 811 App. B.9: 1 lbf·in = 1.129 848 E−01 N·m", () => {
    expect(inNm("lbf·in", 1)).toBe(1.129848e-1);
    expect(inNm("lbf-in", 10)).toBeCloseTo(1.129848, 12);
  });
  it("NIST SP 811 App. B.9: 1 lbf·ft = 1.355 818 E+00 N·m", () => {
    expect(inNm("lbf·ft", 1)).toBe(1.355818);
    expect(inNm("lb-ft", 2)).toBeCloseTo(2.711636, 12);
  });
  it("NIST SP 811 App. B.9: 1 kgf·m = 9.806 65 N·m exactly, so 1 kgf·cm = 9.806 65 E−02 N·m", () => {
    expect(inNm("kgf·cm", 1)).toBe(9.80665e-2);
    expect(inNm("kg-cm", 10)).toBeCloseTo(0.980665, 12);
  });
  it("refuses what is not a torque unit", () => {
    expect(resolveColumnUnit(holding, "furlongs")).toBeUndefined();
    expect(resolveColumnUnit(holding, "N")).toBeUndefined();
    expect(resolveColumnUnit(holding, "mH")).toBeUndefined();
  });
  it("lists the engine's six torque units for messages", () => {
    expect(supportedUnits(holding)).toEqual([
      "N·m",
      "mN·m",
      "ozf·in",
      "lbf·in",
      "lbf·ft",
      "kgf·cm",
    ]);
  });
});

describe("inductance to mH (NIST SP 811 ch. 4: milli = 10⁻³)", () => {
  it("mH stays, 1 H = 1000 mH, spelled in any case", () => {
    expect(resolveColumnUnit(inductance, "mH")).toEqual({ unit: "mH", factor: 1 });
    expect(resolveColumnUnit(inductance, "H")).toEqual({ unit: "H", factor: 1000 });
    expect(toSi(0.0025, 1000)).toBe(2.5);
    expect(toSi(2.5, 1000)).toBe(2500);
    expect(resolveColumnUnit(inductance, "µH")).toBeUndefined();
  });
});

describe("speed to rpm (NIST SP 811 ch. 5: 1 min = 60 s)", () => {
  it("rpm stays, 1 rev/s = 60 rpm", () => {
    expect(resolveColumnUnit(speed, "rpm")).toEqual({ unit: "rpm", factor: 1 });
    expect(resolveColumnUnit(speed, "r/min")).toEqual({ unit: "rpm", factor: 1 });
    expect(resolveColumnUnit(speed, "rev/s")).toEqual({ unit: "rev/s", factor: 60 });
    expect(toSi(2.5, 60)).toBe(150);
    expect(resolveColumnUnit(speed, "rad/s")).toBeUndefined();
  });
});

describe("fields without a conversion take their one unit only", () => {
  it("accepts the unit and its plain spellings, refuses another unit of the same kind", () => {
    expect(resolveColumnUnit(field("ratedCurrentA"), "A")).toEqual({ unit: "A", factor: 1 });
    expect(resolveColumnUnit(field("ratedCurrentA"), "mA")).toBeUndefined();
    expect(resolveColumnUnit(field("phaseResistanceOhm"), "Ohm")).toEqual({ unit: "Ω", factor: 1 });
    expect(resolveColumnUnit(field("eddyWPerHz2"), "W/Hz^2")).toEqual({ unit: "W/Hz²", factor: 1 });
    expect(resolveColumnUnit(field("ambientC"), "degC")).toEqual({ unit: "°C", factor: 1 });
    expect(resolveColumnUnit(field("ambientC"), "°F")).toBeUndefined();
  });
  it("a header without a unit is in the field's SI unit", () => {
    expect(resolveColumnUnit(holding, null)).toEqual({ unit: "N·m", factor: 1 });
    expect(resolveColumnUnit(field("ratedCurrentA"), null)).toEqual({ unit: "A", factor: 1 });
  });
});
