import { describe, expect, it } from "vitest";
import { AXIS_WARNINGS, MACHINE_WARNINGS } from "@/lib/engine";
import { namesById } from "@/lib/results/case-view";
import {
  caseCautions,
  explainAnyWarning,
  explainWarning,
  WARNING_SENTENCES,
  warningCaution,
} from "@/lib/results/warnings";
import { input, result } from "./fixture";

describe("warnings in words", () => {
  it("explains every warning code of docs/contracts.md (Case result) in one plain sentence", () => {
    for (const code of [...AXIS_WARNINGS, ...MACHINE_WARNINGS]) {
      const sentence = WARNING_SENTENCES[code];
      expect(sentence, code).toMatch(/^[A-Z].*\.$/);
      // One sentence: no full stop before the last character.
      expect(sentence.slice(0, -1), code).not.toMatch(/\.\s/);
      expect(sentence, code).not.toMatch(/[A-Z]{2,}_/);
    }
    expect(Object.keys(WARNING_SENTENCES).sort()).toEqual(
      [...AXIS_WARNINGS, ...MACHINE_WARNINGS].sort(),
    );
  });

  it("a holding load carries the brake, safe-stop and encoder-loss caution", () => {
    const caution = warningCaution("HOLDING_LOAD")!;
    expect(caution).toMatch(/brake/);
    expect(caution).toMatch(/safe-stop/);
    expect(caution).toMatch(/encoder/);
    expect(explainWarning("HOLDING_LOAD").safety).toBe(true);
  });

  it("windings over their class or in thermal runaway carry the hot-surface caution and say the figures are estimates", () => {
    for (const code of [
      "OL_WINDING_OVER_CLASS",
      "CL_WINDING_OVER_CLASS",
      "OL_THERMAL_RUNAWAY",
      "CL_THERMAL_RUNAWAY",
    ] as const) {
      const caution = warningCaution(code)!;
      expect(caution, code).toMatch(/burn on touch/);
      expect(caution, code).toMatch(/estimates from datasheet values, not measurements/);
    }
  });

  it("warnings about figures rather than safety carry no extra caution", () => {
    expect(warningCaution("SAVING_OUTSIDE_BAND")).toBeNull();
    expect(explainWarning("THROUGHPUT_CAPPED").safety).toBe(false);
  });

  it("a code the engine adds later still reads as a sentence", () => {
    expect(explainAnyWarning("SOMETHING_NEW").sentence).toMatch(/^[A-Z].*\.$/);
  });

  it("the case's cautions name the vertical axis that holds a load, and always include electrical work and estimates", () => {
    const cautions = caseCautions(result, namesById(input).axis);
    expect(cautions.map((c) => c.id)).toEqual(["electrical-work", "holding-load", "estimates"]);
    expect(cautions.find((c) => c.id === "holding-load")!.axes).toEqual(["Vertical Z"]);
    expect(cautions[0].text).toMatch(/lock out/);
  });

  it("a hot winding adds the hot-surface caution to the case", () => {
    const cautions = caseCautions({
      axes: [{ id: "A", warnings: ["CL_THERMAL_RUNAWAY"] }],
    });
    expect(cautions.find((c) => c.id === "hot-winding")?.axes).toEqual(["A"]);
  });
});
