import { describe, expect, it } from "vitest";
import { warningGroups } from "@/lib/results/axis-rows";
import { namesById } from "@/lib/results/case-view";
import { windingTemperatures } from "@/lib/results/thermal";
import { caseCautions } from "@/lib/results/warnings";
import { input, rawCase, result } from "./fixture";
import { caseInputSchema, evaluateCase } from "@/lib/engine";

// The engine fixture (tests/fixtures/engine-case.json) names two machines and three axes; the
// names expected below are read from it, so the checks follow the fixture rather than restate it.
const machineName = (id: string) => input.machines.find((m) => m.id === id)!.name;

describe("machine names beside axis names (lib/results/case-view.ts)", () => {
  it("names an axis with its machine, and never shows a record id for a missing name", () => {
    const names = namesById(input);
    expect(names.axisWithMachine("M1-Z")).toBe(`Vertical Z (${machineName("M1")})`);
    expect(names.axisWithMachine("M2-FEED")).toBe(`Web feed (${machineName("M2")})`);
    const bare = namesById(null);
    expect(bare.axis("M1-Z")).toBe("Unnamed axis");
    expect(bare.machine("M1")).toBe("Unnamed machine");
    expect(bare.axisWithMachine("M1-Z", "M1")).toBe("Unnamed axis (Unnamed machine)");
  });

  it("the winding-temperature chart names each bar's axis with its machine", () => {
    const rows = windingTemperatures(result, input);
    expect(rows.map((r) => r.name)).toEqual(
      input.axes.map((a) => `${a.label} (${machineName(a.machineId)})`),
    );
    expect(rows.map((r) => r.machineName)).toEqual(input.axes.map((a) => machineName(a.machineId)));
  });

  it("the cautions name the held axis with its machine, so two 'Vertical Z' are told apart", () => {
    const raw = rawCase();
    const twin = structuredClone(raw.axes.find((a: { id: string }) => a.id === "M1-Z"));
    raw.axes.push({ ...twin, id: "M2-Z", machineId: "M2" });
    const parsed = caseInputSchema.parse(raw);
    const names = namesById(parsed);
    const cautions = caseCautions(evaluateCase(raw), (id) => names.axisWithMachine(id));
    expect(cautions.find((c) => c.id === "holding-load")!.axes).toEqual([
      `Vertical Z (${machineName("M1")})`,
      `Vertical Z (${machineName("M2")})`,
    ]);
  });
});

describe("repeated warnings grouped (lib/results/axis-rows.ts)", () => {
  it("states each warning once with every axis it concerns, and keeps the safety ones first", () => {
    const raw = rawCase();
    const twin = structuredClone(raw.axes.find((a: { id: string }) => a.id === "M1-Z"));
    raw.axes.push({ ...twin, id: "M2-Z", machineId: "M2" });
    const evaluated = evaluateCase(raw);
    const groups = warningGroups(evaluated, caseInputSchema.parse(raw));
    const codes = groups.map((g) => g.code);
    // One line per warning, however many axes carry it.
    expect(new Set(codes).size).toBe(codes.length);
    const perAxis = evaluated.axes.flatMap((a) => a.warnings);
    expect(new Set(codes)).toEqual(
      new Set([...perAxis, ...evaluated.machines.flatMap((m) => m.warnings)]),
    );
    const holding = groups.find((g) => g.code === "HOLDING_LOAD")!;
    expect(holding.concerns).toEqual([
      `Vertical Z (${machineName("M1")})`,
      `Vertical Z (${machineName("M2")})`,
    ]);
    // The brake and safe-stop caution stays with it, and safety warnings lead.
    expect(holding.safety).toBe(true);
    expect(holding.caution).toMatch(/brake and a safe-stop concept/);
    const firstFigureOnly = groups.findIndex((g) => !g.safety);
    if (firstFigureOnly >= 0)
      expect(groups.slice(firstFigureOnly).every((g) => !g.safety)).toBe(true);
  });
});
