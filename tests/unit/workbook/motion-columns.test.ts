import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { AXES_FIRST_ROW, AXES_HEADER_ROWS } from "@/lib/workbook/axes-sheet";
import { buildWorkbookOf, sheetOf } from "./fixture-workbook";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;

describe("the Axes sheet lists the mechanism and move of axes sized from them", () => {
  it("shows the motion inputs and the derived figures for a motion axis, nothing for typed ones", async () => {
    const raw = structuredClone(fixtureCase) as Json;
    const duty = raw.axes[0].duty;
    for (const key of ["speedRpm", "loadTorqueNm", "peakTorqueNm", "movePct", "holdPct"])
      delete duty[key];
    duty.motion = {
      mechanism: "belt",
      radiusMm: 12,
      massKg: 3,
      motorInertiaKgM2: 3e-5,
      stroke: 250,
      moveTimeS: 0.5,
      dwellTimeS: 0.3,
    };
    const { workbook, result } = await buildWorkbookOf(raw);
    const sheet = sheetOf(workbook, "Axes");
    const header = sheet.getRow(AXES_HEADER_ROWS);
    const column = (title: string) => {
      let found = 0;
      header.eachCell((cell, col) => {
        if (cell.value === title) found = col;
      });
      if (!found) throw new Error(`no column "${title}"`);
      return found;
    };
    const motionRow = sheet.getRow(AXES_FIRST_ROW);
    const typedRow = sheet.getRow(AXES_FIRST_ROW + 1);
    expect(motionRow.getCell(column("Sized from")).value).toBe("belt");
    expect(typedRow.getCell(column("Sized from")).value).toBe("typed duty");
    expect(motionRow.getCell(column("Pulley or pinion radius (mm)")).value).toBe(12);
    expect(motionRow.getCell(column("Mechanism efficiency (%)")).value).toBe(95); // belt default
    const derived = result.axes[0].motion!;
    expect(motionRow.getCell(column("Load-to-rotor inertia ratio")).value).toBeCloseTo(
      derived.inertiaRatio!,
      12,
    );
    expect(motionRow.getCell(column("Speed (rpm)")).value).toBeCloseTo(derived.speedRpm, 12);
    expect(typedRow.getCell(column("Stroke (mm or °)")).value).toBeNull();
  });
});
