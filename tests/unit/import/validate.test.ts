import fc from "fast-check";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { axisInputOf, DEFAULT_RETROFIT_TERMS } from "@/db/queries/case-input";
import { axisInputSchema } from "@/lib/engine";
import { matchHeaders } from "@/lib/import/headers";
import { readWorkbook, type SheetData } from "@/lib/import/read";
import { IMPORT_FIELDS, nestedKey } from "@/lib/import/fields";
import { headerFor } from "@/lib/import/headers";
import { templateHeaders } from "@/lib/import/template";
import { validateRows, type ValidatedAxis } from "@/lib/import/validate";

const site = { hoursPerYear: 5000, ambientC: 30 };
const fixture = (name: string) => readFileSync(`tests/fixtures/import/${name}`);

async function validateFixture(name: string) {
  const { sheets } = await readWorkbook(fixture(name), name);
  return validateRows(sheets[0], matchHeaders(sheets[0].headers), site);
}

/** A sheet of the template's columns; each row gives only the cells that differ from a valid axis. */
const HEADERS = templateHeaders();
const NESTED_HEADERS = new Set(
  IMPORT_FIELDS.filter((f) => nestedKey(f.key) !== null).map((f) => headerFor(f)),
);
const VALID: Record<string, string> = {
  Machine: "Capper 1",
  "Axis label": "X feed",
  "Holding torque [N·m]": "1.26",
  "Rated current [A]": "2.8",
  "Phase resistance [Ω]": "0.9",
  "Phase inductance [mH]": "2.5",
  "Bus voltage [V]": "48",
  "Drive current setting [A]": "2.8",
  "Move time [%]": "40",
  "Hold time [%]": "35",
  "Speed [rpm]": "300",
  "Load torque [N·m]": "0.35",
  "Peak torque [N·m]": "0.6",
};
function sheetOf(...changes: Record<string, string>[]): SheetData {
  return {
    name: "Axes",
    headers: HEADERS,
    rows: changes.map((change) => HEADERS.map((h) => ({ ...VALID, ...change })[h] ?? "")),
  };
}
const check = (...changes: Record<string, string>[]) => {
  const sheet = sheetOf(...changes);
  return validateRows(sheet, matchHeaders(sheet.headers), site);
};
const messageFor = (change: Record<string, string>) => check(change).errors.map((e) => e.message);

describe("faults.csv: faults in several rows and columns, each at its spreadsheet row", () => {
  it("reports every faulty cell with the header as in the file and a message that says what to fix", async () => {
    const result = await validateFixture("faults.csv");
    expect(result.rowsRead).toBe(7);
    expect(result.rows.map((r) => r.sourceRow)).toEqual([2]);
    expect(result.machinesNamed).toEqual(["Capper 1", "Capper 2"]);
    expect(result.errors).toEqual([
      {
        row: 3,
        column: "Holding torque [N·m]",
        message: '"abc" is not a number; enter the holding torque in N·m',
      },
      {
        row: 3,
        column: "Step mode",
        message:
          '"quarter" is not a valid step mode; must be one of full, half, half-compensated, micro',
      },
      {
        row: 4,
        column: "Peak torque [N·m]",
        message:
          "peak torque (0.3 N·m) must be at least the load torque (0.45 N·m); correct one of them",
      },
      {
        row: 4,
        column: "Hold time [%]",
        message: "move % + hold % is 120; together they must be at most 100",
      },
      { row: 5, column: "Machine", message: "required: enter the machine name" },
      { row: 5, column: "Quantity", message: "must be at least 1 (received 0)" },
      {
        row: 5,
        column: "Microsteps",
        message: "2.5 is not a whole number; enter the microsteps as a whole number",
      },
      // Row 6 is blank: skipped, not counted.
      { row: 7, column: "Idle current [%]", message: "must be at most 100 (received 120)" },
      {
        row: 7,
        column: "Speed [rpm]",
        message:
          '"=A2*2" looks like a formula, and formulas are not evaluated; enter the speed in rpm as a plain number',
      },
      {
        row: 7,
        column: "Cost per step-loss event",
        message:
          '"€12" is not an amount; enter the cost per step-loss event as a number such as 12.50, in the site\'s currency, without a currency sign',
      },
      { row: 8, column: "Rated current [A]", message: "must be at least 0.01 A (received -5)" },
      {
        row: 9,
        column: "Phase inductance [mH]",
        message:
          '"2.5 mH" has text after the number; enter the number only — the unit belongs in the column header ("Phase inductance [mH]")',
      },
      {
        row: 9,
        column: "Bus voltage [V]",
        message:
          '"1,500" could be 1.5 or 1500; write the bus voltage in V with a decimal point and no thousands separator',
      },
    ]);
  });

  it("reads the valid row's decimal commas as decimals", async () => {
    const [row] = (await validateFixture("faults.csv")).rows;
    expect(row).toMatchObject({
      holdingTorqueNm: 1.26,
      loadTorqueNm: 0.35,
      costPerEvent: "250.00",
    });
  });
});

describe("faults.xlsx: formula cells are kept as text and refused", () => {
  it("reports the formulas by their text, not their cached results", async () => {
    const { errors, rows } = await validateFixture("faults.xlsx");
    expect(rows.map((r) => r.sourceRow)).toEqual([2]);
    expect(errors.filter((e) => e.message.includes("formula"))).toEqual([
      {
        row: 7,
        column: "Speed [rpm]",
        message:
          '"=P2*2" looks like a formula, and formulas are not evaluated; enter the speed in rpm as a plain number',
      },
      {
        row: 8,
        column: "Holding torque [N·m]",
        message:
          '"=D2" looks like a formula, and formulas are not evaluated; enter the holding torque in N·m as a plain number',
      },
    ]);
    expect(errors.map((e) => e.row)).toEqual([3, 3, 4, 4, 5, 5, 5, 7, 7, 7, 8, 8]);
  });
});

describe("clean files convert every unit to SI (NIST SP 811 App. B.9 torque factors)", () => {
  it("clean.csv: 20 valid rows, oz·in, kgf·cm, H and rev/s converted; omitted columns defaulted", async () => {
    const result = await validateFixture("clean.csv");
    expect(result.errors).toEqual([]);
    expect(result.rowsRead).toBe(20);
    expect(result.rows).toHaveLength(20);
    expect(result.machinesNamed).toEqual([
      "Carton erector 2",
      "Filler, line 2",
      "Label applicator 1",
      "Palletiser 4",
    ]);
    const first = result.rows[0];
    // 382 ozf·in × 7.061 552 E−03; 8.5 and 14 kgf·cm × 9.806 65 E−02; 0.0034 H = 3.4 mH; 2.5 rev/s = 150 rpm.
    expect(first.holdingTorqueNm).toBeCloseTo(382 * 7.061552e-3, 12);
    expect(first.loadTorqueNm).toBeCloseTo(8.5 * 9.80665e-2, 12);
    expect(first.peakTorqueNm).toBeCloseTo(14 * 9.80665e-2, 12);
    expect(first.phaseInductanceMh).toBe(3.4);
    expect(first.speedRpm).toBe(150);
    expect(first).toMatchObject({
      machineName: "Carton erector 2",
      sourceRow: 2,
      hoursPerYear: 5000, // blank cell: the site's value
      ambientC: 30, // no column: the site's value
      rotorTeeth: 50,
      thermalResistanceKPerW: null,
      ratedTempRiseK: 80,
      insulationClass: "B",
      currentConvention: "peak",
      holdTorqueNm: 0,
      costPerEvent: "180.00",
      avoidedPct: 90,
    });
    // The blank line at row 12 is skipped; the eleventh axis is on row 13.
    expect(result.rows[10].sourceRow).toBe(13);
    expect(result.rows[3]).toMatchObject({ stepMode: "half", microsteps: 16, costPerEvent: "0" });
  });

  it("clean.xlsx: 20 valid rows, lbf·in and mN·m converted, rich text and hyperlink cells as text", async () => {
    const result = await validateFixture("clean.xlsx");
    expect(result.errors).toEqual([]);
    expect(result.rows).toHaveLength(20);
    expect(result.rows[0].holdingTorqueNm).toBeCloseTo(11.2 * 1.129848e-1, 12);
    expect(result.rows[2].holdTorqueNm).toBeCloseTo(0.15, 12);
    expect(result.rows[1].machineName).toBe("Tray sealer 1");
    expect(result.rows[2].label).toBe("Lift 3");
    expect(result.rows[0]).toMatchObject({
      thermalResistanceKPerW: 2.4,
      insulationClass: "F",
      currentConvention: "rms",
    });
    expect(result.rows[0]).toMatchObject({ hoursPerYear: 5000, ambientC: 30 });
    expect(result.rows[1]).toMatchObject({
      hoursPerYear: 6000,
      ambientC: 38,
      costPerEvent: "95.5",
    });
  });
});

describe("per-cell rules", () => {
  it("numbers: a plain number, an exponent, and a decimal comma when unambiguous", () => {
    const rows = check(
      { "Holding torque [N·m]": " 1,5 " },
      { "Holding torque [N·m]": "0,450" },
      { "Holding torque [N·m]": "12,75" },
      { "Holding torque [N·m]": "1.2e0" },
      { "Holding torque [N·m]": "+2" },
    ).rows;
    expect(rows.map((r) => r.holdingTorqueNm)).toEqual([1.5, 0.45, 12.75, 1.2, 2]);
  });

  it("numbers: grouped thousands read as the forms read them; an ambiguous comma is refused by name", () => {
    // The same reader as the forms and the server's schemas (lib/validations/typed-number.ts).
    const rows = check(
      { "Speed [rpm]": "1.234,5" },
      { "Speed [rpm]": "1,234.5" },
      { "Speed [rpm]": "1 234,5" },
    ).rows;
    expect(rows.map((r) => r.speedRpm)).toEqual([1234.5, 1234.5, 1234.5]);
    expect(messageFor({ "Speed [rpm]": "1,200" })).toEqual([
      '"1,200" could be 1.2 or 1200; write the speed in rpm with a decimal point and no thousands separator',
    ]);
    expect(messageFor({ "Bus voltage [V]": "1'234" })).toEqual([
      '"1\'234" has a thousands separator; enter the bus voltage in V without one, with a decimal point',
    ]);
  });

  it("bounds: greater than 0, at least 0, at most 100, at most 8784 hours, ambient −40…80 °C", () => {
    // The engine's FIELD_BOUNDS, with their units (issue 13).
    expect(messageFor({ "Holding torque [N·m]": "0" })).toEqual([
      "must be at least 0.001 N·m (received 0)",
    ]);
    expect(messageFor({ "Load torque [N·m]": "-0.1" })).toEqual([
      "must be at least 0 (received -0.1)",
    ]);
    expect(messageFor({ "Avoided step-loss events [%]": "101" })).toEqual([
      "must be at most 100 (received 101)",
    ]);
    expect(messageFor({ "Hours per year [h]": "9000" })).toEqual([
      "must be at most 8784 h (the hours of a leap year) (received 9000)",
    ]);
    expect(messageFor({ "Ambient temperature [°C]": "-50" })).toEqual([
      "must be at least -40 °C (received -50)",
    ]);
  });

  it("whole numbers: quantity, rotor teeth and microsteps at least 1", () => {
    expect(messageFor({ "Rotor teeth": "0" })).toEqual(["must be at least 1 (received 0)"]);
    expect(messageFor({ Quantity: "1.5" })).toEqual([
      "1.5 is not a whole number; enter the quantity as a whole number",
    ]);
  });

  it("choices: any case, spaces or underscores for the hyphen; anything else lists the choices", () => {
    const [row] = check({
      "Step mode": "Half Compensated",
      "Current convention": "RMS",
      "Insulation class": "h",
    }).rows;
    expect(row).toMatchObject({
      stepMode: "half-compensated",
      currentConvention: "rms",
      insulationClass: "H",
    });
    expect(messageFor({ "Current convention": "avg" })).toEqual([
      '"avg" is not a valid current convention; must be one of peak, rms',
    ]);
  });

  it("money: a decimal string by pattern, normalised, never a float", () => {
    const rows = check(
      { "Cost per step-loss event": "12,50" },
      { "Cost per step-loss event": "+007.5" },
      { "Cost per step-loss event": "7." },
      { "Cost per step-loss event": "0.1000000000000000055511151231257827" },
    ).rows;
    expect(rows.map((r) => r.costPerEvent)).toEqual([
      "12.50",
      "7.5",
      "7",
      "0.1000000000000000055511151231257827",
    ]);
    expect(messageFor({ "Cost per step-loss event": "-3" })).toEqual([
      "must be at least 0 (received -3)",
    ]);
    expect(check({ "Cost per step-loss event": "1.234,50" }).rows[0].costPerEvent).toBe("1234.50");
    expect(messageFor({ "Cost per step-loss event": "1,250" })).toEqual([
      '"1,250" could be 1.25 or 1250; write the cost per step-loss event with a decimal point and no thousands separator',
    ]);
    expect(messageFor({ "Cost per step-loss event": "12 €" })[0]).toMatch(
      /^"12 €" is not an amount; enter/,
    );
    expect(messageFor({ "Cost per step-loss event": "=B2" })[0]).toMatch(
      /^"=B2" looks like a formula/,
    );
  });

  it("required cells and names: blank is refused with the field named; names are trimmed and at most 120 characters", () => {
    expect(messageFor({ "Axis label": "  " })).toEqual(["required: enter the axis label"]);
    expect(messageFor({ "Speed [rpm]": "" })).toEqual([
      "required: enter the speed in rpm, or fill the Mechanism and motion columns to derive it",
    ]);
    expect(messageFor({ Machine: "x".repeat(121) })).toEqual([
      "is 121 characters long; shorten the machine name to at most 120 characters",
    ]);
    expect(check({ Machine: "  Capper   3 " }).rows[0].machineName).toBe("Capper 3");
  });

  it("cross-field: the peak-torque check reads in the column's units", () => {
    const sheet: SheetData = {
      name: "Axes",
      headers: [...HEADERS.filter((h) => !h.startsWith("Peak torque")), "Peak torque [oz·in]"],
      rows: [
        [...HEADERS.filter((h) => !h.startsWith("Peak torque")).map((h) => VALID[h] ?? ""), "40"],
      ],
    };
    const { errors } = validateRows(sheet, matchHeaders(sheet.headers), site);
    expect(errors).toEqual([
      {
        row: 2,
        column: "Peak torque [oz·in]",
        message:
          "peak torque (40 ozf·in = 0.282462 N·m) must be at least the load torque (0.35 N·m); correct one of them",
      },
    ]);
  });

  it("move % + hold % of exactly 100 passes, rounding as the user reads it", () => {
    expect(check({ "Move time [%]": "60.1", "Hold time [%]": "39.9" }).errors).toEqual([]);
  });
});

describe("header faults", () => {
  it("a missing required column is an error of row 1 named by the field's label, and no row is valid", () => {
    const sheet = sheetOf({});
    const keep = sheet.headers.map((h) => h !== "Holding torque [N·m]");
    const trimmed = {
      ...sheet,
      headers: sheet.headers.filter((_, i) => keep[i]),
      rows: sheet.rows.map((r) => r.filter((_, i) => keep[i])),
    };
    const result = validateRows(trimmed, matchHeaders(trimmed.headers), site);
    expect(result.errors).toEqual([
      {
        row: 1,
        column: "Holding torque",
        message:
          'required column is missing; add a column headed "Holding torque [N·m]" or map one of the columns to Holding torque',
      },
    ]);
    expect(result.rowsRead).toBe(1);
    expect(result.rows).toEqual([]);
  });

  it("an unknown unit is an error of row 1 under the header text; cell faults are still reported", () => {
    const sheet = sheetOf({ "Rated current [A]": "x" });
    const headers = sheet.headers.map((h) =>
      h === "Standstill load torque [N·m]" ? "Standstill load torque [furlongs]" : h,
    );
    const result = validateRows({ headers, rows: sheet.rows }, matchHeaders(headers), site);
    expect(result.errors.map((e) => [e.row, e.column])).toEqual([
      [1, "Standstill load torque [furlongs]"],
      [2, "Rated current [A]"],
    ]);
    expect(result.rows).toEqual([]);
  });
});

describe("agreement with the engine's input schema (docs/contracts.md (Case input))", () => {
  // The same row → AxisInput mapping the cases use (db/queries/case-input.ts), so the property
  // covers the path an imported axis really takes into the engine.
  const asEngineAxis = ({ sourceRow, machineName: _machine, ...axis }: ValidatedAxis) =>
    axisInputOf(
      {
        ...axis,
        id: sourceRow,
        siteId: 1,
        machineId: 1,
        referenceMotorId: null,
        pullOutCurve: null,
        resonance: null,
        createdAt: "",
      },
      { id: "k1", name: "Invented kit", price: "400" },
      DEFAULT_RETROFIT_TERMS,
    );

  it("every row of the clean fixtures is a valid engine axis", async () => {
    for (const name of ["clean.csv", "clean.xlsx"]) {
      for (const axis of (await validateFixture(name)).rows) {
        expect(axisInputSchema.safeParse(asEngineAxis(axis)).success).toBe(true);
      }
    }
  });

  it("a row the importer accepts is never one the engine refuses (property)", () => {
    // Mostly the valid value (null), sometimes an edge or a random number, so that many rows pass.
    const cell = fc.oneof(
      { arbitrary: fc.constant(null), weight: 24 },
      {
        arbitrary: fc.constantFrom(
          "",
          "0",
          "-1",
          "1",
          "2.5",
          "16",
          "99.9",
          "100",
          "100.5",
          "8784",
          "9000",
          "-40",
          "81",
        ),
        weight: 2,
      },
      {
        arbitrary: fc
          .double({ min: -200, max: 10_000, noNaN: true, noDefaultInfinity: true })
          .map(String),
        weight: 1,
      },
    );
    // Typed duty only: motion and event cells need a mechanism or build a cost (motion.test.ts).
    const numericHeaders = HEADERS.filter(
      (h) =>
        /\[|Quantity|Rotor teeth|Microsteps|Step-loss events/.test(h) && !NESTED_HEADERS.has(h),
    );
    let accepted = 0;
    fc.assert(
      fc.property(
        fc.array(cell, { minLength: numericHeaders.length, maxLength: numericHeaders.length }),
        (cells) => {
          const change = Object.fromEntries(
            numericHeaders.flatMap((h, i) => (cells[i] === null ? [] : [[h, cells[i]]])),
          );
          for (const axis of check(change).rows) {
            accepted++;
            const parsed = axisInputSchema.safeParse(asEngineAxis(axis));
            if (!parsed.success)
              throw new Error(JSON.stringify({ change, issues: parsed.error.issues }));
          }
        },
      ),
      { numRuns: 300 },
    );
    expect(accepted).toBeGreaterThan(20);
  });
});

describe("10,000 rows (correctness only; the time belongs to npm run bench)", () => {
  it("validates a generated 10,000-row CSV: every row valid, row numbers kept", async () => {
    const values = HEADERS.map((h) => VALID[h] ?? "");
    const lines = [HEADERS.join(",")];
    for (let i = 0; i < 10_000; i++) {
      const row = [...values];
      row[0] = `Machine ${i % 37}`;
      row[1] = `Axis ${i}`;
      lines.push(row.join(","));
    }
    const { sheets } = await readWorkbook(Buffer.from(lines.join("\r\n")), "ten-thousand.csv");
    const result = validateRows(sheets[0], matchHeaders(sheets[0].headers), site);
    expect(result.errors).toEqual([]);
    expect(result.rowsRead).toBe(10_000);
    expect(result.rows).toHaveLength(10_000);
    expect(result.rows[9_999]).toMatchObject({
      label: "Axis 9999",
      machineName: "Machine 9",
      sourceRow: 10_001,
    });
    expect(result.machinesNamed).toHaveLength(37);
  });
});
