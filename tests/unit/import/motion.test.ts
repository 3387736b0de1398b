import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { axisInputOf, DEFAULT_RETROFIT_TERMS } from "@/db/queries/case-input";
import { axisInputSchema } from "@/lib/engine";
import { matchHeaders } from "@/lib/import/headers";
import type { SheetData } from "@/lib/import/read";
import { validateRows, type ValidatedAxis } from "@/lib/import/validate";

const site = { hoursPerYear: 5000, ambientC: 30 };

// An invented NEMA 23 motor and drive; the duty comes from a vertical screw (docs/model.md (Motion from the mechanism)).
const MOTOR: Record<string, string> = {
  Machine: "Tray loader 1",
  "Axis label": "Z lift",
  "Holding torque [N·m]": "1.26",
  "Rated current [A]": "2.8",
  "Phase resistance [Ω]": "0.9",
  "Phase inductance [mH]": "2.5",
  "Bus voltage [V]": "48",
  "Drive current setting [A]": "2.8",
};
const SCREW: Record<string, string> = {
  Mechanism: "screw",
  "Screw lead [mm]": "10",
  "Moving mass [kg]": "6",
  "Incline [°]": "90",
  Stroke: "150",
  "Move duration [s]": "0.5",
  "Dwell after each move [s]": "1.5",
};
const TYPED_DUTY: Record<string, string> = {
  "Move time [%]": "40",
  "Hold time [%]": "35",
  "Speed [rpm]": "300",
  "Load torque [N·m]": "0.35",
  "Peak torque [N·m]": "0.6",
};

function sheet(headers: string[], ...rows: Record<string, string>[]): SheetData {
  return { name: "Axes", headers, rows: rows.map((row) => headers.map((h) => row[h] ?? "")) };
}
function check(headers: string[], ...rows: Record<string, string>[]) {
  const data = sheet(headers, ...rows);
  return validateRows(data, matchHeaders(data.headers), site);
}
const motionHeaders = (...extra: string[]) => [
  ...Object.keys(MOTOR),
  ...Object.keys(SCREW),
  ...extra,
];

// The path the cases take into the engine (db/queries/case-input.ts).
const engineAxis = ({ sourceRow, machineName: _m, ...axis }: ValidatedAxis) =>
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

describe("importing an axis by its mechanism and move (docs/model.md (Motion from the mechanism))", () => {
  it("builds the motion object; the typed duty columns may be absent, and the engine gets motion instead", () => {
    const result = check(motionHeaders(), { ...MOTOR, ...SCREW });
    expect(result.errors).toEqual([]);
    const [row] = result.rows;
    expect(row.motion).toMatchObject({
      mechanism: "screw",
      leadMm: 10,
      massKg: 6,
      inclineDeg: 90,
      stroke: 150,
      moveTimeS: 0.5,
      dwellTimeS: 1.5,
    });
    // Placeholders the engine never receives.
    expect([row.movePct, row.holdPct, row.speedRpm, row.loadTorqueNm, row.peakTorqueNm]).toEqual([
      0, 0, 0, 0, 0,
    ]);
    const input = engineAxis(row);
    expect(input.duty.motion).toEqual(row.motion);
    expect(input.duty).not.toHaveProperty("speedRpm");
    expect(axisInputSchema.safeParse(input).success).toBe(true);
  });

  it("rows with and without a mechanism share a sheet; a row without one still needs its typed duty", () => {
    const headers = motionHeaders(...Object.keys(TYPED_DUTY));
    const result = check(
      headers,
      { ...MOTOR, ...SCREW },
      { ...MOTOR, "Axis label": "X feed", ...TYPED_DUTY },
      { ...MOTOR, "Axis label": "Y feed", ...TYPED_DUTY, "Speed [rpm]": "" },
    );
    expect(result.rows.map((r) => [r.label, r.motion?.mechanism ?? null])).toEqual([
      ["Z lift", "screw"],
      ["X feed", null],
    ]);
    expect(result.errors).toEqual([
      {
        row: 4,
        column: "Speed [rpm]",
        message:
          "required: enter the speed in rpm, or fill the Mechanism and motion columns to derive it",
      },
    ]);
  });

  it("without a Mechanism column the typed duty columns stay required columns (row 1)", () => {
    const headers = Object.keys(MOTOR);
    const result = check(headers, MOTOR);
    expect(result.errors.filter((e) => e.row === 1).map((e) => e.column)).toEqual([
      "Move time",
      "Hold time",
      "Speed",
      "Load torque",
      "Peak torque",
    ]);
    expect(result.rows).toEqual([]);
  });

  it("a screw without its lead is refused at the lead column with the engine's message", () => {
    const result = check(motionHeaders(), { ...MOTOR, ...SCREW, "Screw lead [mm]": "" });
    expect(result.errors).toEqual([
      {
        row: 2,
        column: "Screw lead [mm]",
        message: "required for a screw: the lead in mm per screw turn",
      },
    ]);
    // No lead column at all: the message names the field.
    const headers = motionHeaders().filter((h) => h !== "Screw lead [mm]");
    expect(check(headers, { ...MOTOR, ...SCREW }).errors).toEqual([
      {
        row: 2,
        column: "Screw lead",
        message: "required for a screw: the lead in mm per screw turn",
      },
    ]);
  });

  it("a belt needs its pulley radius; stroke and move duration are required with any mechanism", () => {
    const headers = motionHeaders("Pulley or pinion radius [mm]");
    const result = check(headers, {
      ...MOTOR,
      ...SCREW,
      Mechanism: "belt",
      Stroke: "",
      "Move duration [s]": "",
    });
    expect(result.errors.map((e) => [e.column, e.message])).toEqual(
      expect.arrayContaining([
        ["Pulley or pinion radius [mm]", expect.stringMatching(/^required for a belt/)],
        ["Stroke", "required with a mechanism: enter the stroke"],
        ["Move duration [s]", "required with a mechanism: enter the move duration in s"],
      ]),
    );
  });

  it("motion figures without a mechanism are refused at their column", () => {
    const result = check(motionHeaders(...Object.keys(TYPED_DUTY)), {
      ...MOTOR,
      ...TYPED_DUTY,
      "Screw lead [mm]": "10",
    });
    expect(result.errors).toEqual([
      {
        row: 2,
        column: "Screw lead [mm]",
        message:
          "motion figures need a mechanism: fill the Mechanism column (belt, rack, screw or rotary) or leave the motion columns blank",
      },
    ]);
  });

  it("an unknown mechanism lists the four the engine knows", () => {
    const result = check(motionHeaders(), { ...MOTOR, ...SCREW, Mechanism: "cam" });
    expect(result.errors).toEqual([
      {
        row: 2,
        column: "Mechanism",
        message: '"cam" is not a valid mechanism; must be one of belt, rack, screw, rotary',
      },
    ]);
  });

  it("an incline outside 0…90 gets the engine's bound at the incline column", () => {
    const result = check(motionHeaders(), { ...MOTOR, ...SCREW, "Incline [°]": "120" });
    expect(result.errors).toEqual([
      { row: 2, column: "Incline [°]", message: expect.stringMatching(/^must be at most 90\b/) },
    ]);
  });

  // NIST SP 811 (2008) App. B.9: 1 lb·in² = 2.926 397 E−04 kg·m², 1 ozf·in·s² = 7.061 552 E−03
  // kg·m²; 1 g·cm² = 1 E−07 kg·m² and 1 kg·cm² = 1 E−04 kg·m² by the SI prefixes.
  it.each([
    ["g·cm²", "480", 4.8e-5],
    ["kg·cm²", "0.48", 4.8e-5],
    ["lb·in²", "0.164", 0.164 * 2.926397e-4],
    ["oz·in·s²", "0.0068", 0.0068 * 7.061552e-3],
    ["kg·m²", "0.000048", 4.8e-5],
  ])("converts the rotor inertia given in %s to kg·m²", (unit, typed, kgM2) => {
    const header = `Rotor inertia [${unit}]`;
    const result = check(motionHeaders(header), { ...MOTOR, ...SCREW, [header]: typed });
    expect(result.errors).toEqual([]);
    expect(result.rows[0].motion?.motorInertiaKgM2).toBeCloseTo(kgM2, 15);
  });

  it("an inertia header in a unit that is not one is an error of row 1 that lists the accepted units", () => {
    const header = "Load inertia [kg·mm]";
    const result = check(motionHeaders(header), { ...MOTOR, ...SCREW });
    expect(result.errors[0]).toMatchObject({ row: 1, column: header });
    expect(result.errors[0].message).toMatch(
      /is not an inertia unit; use one of kg·m², kg·cm², g·cm², ozf·in·s², lb·in²/,
    );
  });

  it("Return move reads yes or no", () => {
    const header = "Return move";
    expect(
      check(motionHeaders(header), { ...MOTOR, ...SCREW, [header]: "no" }).rows[0].motion,
    ).toMatchObject({ returnMove: false });
    expect(check(motionHeaders(header), { ...MOTOR, ...SCREW, [header]: "maybe" }).errors).toEqual([
      { row: 2, column: header, message: '"maybe" is not yes or no; enter yes or no' },
    ]);
  });
});

describe("importing the build-up of a step-loss event (docs/model.md (The business case))", () => {
  const EVENT: Record<string, string> = {
    "Downtime per step-loss event [min]": "20",
    "Scrap parts per step-loss event": "3",
    "Cost per scrap part": "4.80",
    "Restart labour per step-loss event [h]": "0.5",
  };
  const headers = [...Object.keys(MOTOR), ...Object.keys(TYPED_DUTY), ...Object.keys(EVENT)];

  it("any event column filled builds the event; the engine then gets no cost per event", () => {
    const result = check(headers, { ...MOTOR, ...TYPED_DUTY, ...EVENT });
    expect(result.errors).toEqual([]);
    expect(result.rows[0].event).toEqual({
      downtimeMinutes: 20,
      scrapParts: 3,
      scrapCostPerPart: "4.80",
      restartLaborHours: 0.5,
    });
    const input = engineAxis(result.rows[0]);
    expect(input.reliability).not.toHaveProperty("costPerEvent");
    expect(input.reliability?.event).toEqual(result.rows[0].event);
    expect(axisInputSchema.safeParse(input).success).toBe(true);
    // Only some columns filled: the rest take the engine's defaults (0).
    const partial = check(headers, {
      ...MOTOR,
      ...TYPED_DUTY,
      "Scrap parts per step-loss event": "2",
    });
    expect(partial.rows[0].event).toEqual({
      downtimeMinutes: 0,
      scrapParts: 2,
      scrapCostPerPart: "0",
      restartLaborHours: 0,
    });
  });

  it("a cost per event beside the build-up is refused at the cost column, as the engine refuses both", () => {
    const withCost = [...headers, "Cost per step-loss event"];
    const result = check(withCost, {
      ...MOTOR,
      ...TYPED_DUTY,
      ...EVENT,
      "Cost per step-loss event": "250",
    });
    expect(result.rows).toEqual([]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ row: 2, column: "Cost per step-loss event" });
    expect(result.errors[0].message).toMatch(
      /^give either the cost per step-loss event or its build-up/,
    );
  });

  it("a negative scrap count is refused at its column", () => {
    const result = check(headers, {
      ...MOTOR,
      ...TYPED_DUTY,
      "Scrap parts per step-loss event": "-1",
    });
    expect(result.errors).toEqual([
      {
        row: 2,
        column: "Scrap parts per step-loss event",
        message: "must be at least 0 (received -1)",
      },
    ]);
  });
});

describe("agreement with the engine on motion rows (property)", () => {
  it("a motion row the importer accepts is never one the engine refuses", () => {
    const headers = motionHeaders(
      "Pulley or pinion radius [mm]",
      "Mechanism efficiency [%]",
      "Gear ratio",
      "Acceleration share [%]",
      "Cycling share [%]",
      "Rotor inertia [g·cm²]",
      "Process torque [N·m]",
    );
    const cell = fc.oneof(
      { arbitrary: fc.constant(null), weight: 10 },
      { arbitrary: fc.constantFrom("", "0", "-1", "1", "10", "50", "60", "100", "120"), weight: 3 },
      { arbitrary: fc.double({ min: -100, max: 1000, noNaN: true }).map(String), weight: 1 },
    );
    const motionColumns = headers.filter((h) => !(h in MOTOR) && h !== "Mechanism");
    let accepted = 0;
    fc.assert(
      fc.property(
        fc.constantFrom("belt", "rack", "screw", "rotary"),
        fc.array(cell, { minLength: motionColumns.length, maxLength: motionColumns.length }),
        (mechanism, cells) => {
          const change = Object.fromEntries(
            motionColumns.flatMap((h, i) => (cells[i] === null ? [] : [[h, cells[i]]])),
          );
          const row = {
            ...MOTOR,
            ...SCREW,
            "Pulley or pinion radius [mm]": "15",
            Mechanism: mechanism,
            ...change,
          };
          for (const axis of check(headers, row).rows) {
            accepted++;
            const parsed = axisInputSchema.safeParse(engineAxis(axis));
            if (!parsed.success)
              throw new Error(JSON.stringify({ row, issues: parsed.error.issues }));
          }
        },
      ),
      { numRuns: 300 },
    );
    expect(accepted).toBeGreaterThan(20);
  });
});
