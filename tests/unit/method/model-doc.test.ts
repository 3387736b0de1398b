import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { methodMarkdown } from "@/lib/method/markdown";
import {
  METHOD_CAUTIONS,
  METHOD_DEFAULTS,
  METHOD_SECTIONS,
  METHOD_SOURCES,
} from "@/lib/method/model";
import { equationParts, inlineParts } from "@/lib/method/types";

describe("the method page and docs/model.md", () => {
  it("docs/model.md is the method page's text as generated (run npm run docs:model)", () => {
    const onDisk = fs.readFileSync(path.resolve("docs/model.md"), "utf8");
    expect(onDisk).toBe(methodMarkdown());
  });

  it("covers every part of the model a reader asks about", () => {
    expect(METHOD_SECTIONS.map((s) => s.id)).toEqual([
      "overview",
      "torque-at-speed",
      "loops",
      "motion",
      "currents",
      "temperature",
      "energy",
      "margins",
      "holding",
      "business-case",
    ]);
    const text = JSON.stringify(METHOD_SECTIONS);
    for (const term of [
      "field weakening",
      "fundamental",
      "resonance",
      "RMS",
      "inertia ratio",
      "9.80665",
      "two passes",
      "thermal runaway",
      "cooler",
      "6,000 rpm",
      "idle current",
      "depreciation",
      "IRR",
      "pays back even with free energy",
      "pays back without any avoided step-loss events",
      "Value by source",
      "throughput gain and idle current",
    ]) {
      expect(text, term).toContain(term);
    }
  });

  it("names the published sources of the check values and marks the rest as such", () => {
    const sources = METHOD_SOURCES.map((s) => s.source).join(" | ");
    for (const source of [
      "NIST SP 811",
      "IEC 60085",
      "IEC 60028",
      "CGPM 1901",
      "numpy-financial",
      "LibreOffice Calc",
      "from memory",
      "common practice",
    ]) {
      expect(sources, source).toContain(source);
    }
    // the defaults of docs/model.md that it calls common practice say so.
    const margins = METHOD_DEFAULTS.filter((d) => d.setting.startsWith("Required margin"));
    expect(margins.every((d) => d.basis.startsWith("common practice"))).toBe(true);
  });

  it("carries the safety cautions and defers to local codes and licensed practice", () => {
    const cautions = METHOD_CAUTIONS.join(" ");
    expect(cautions).toMatch(/lock out/);
    expect(cautions).toMatch(/brake and a safe-stop concept/);
    expect(cautions).toMatch(/burn on touch/);
    expect(cautions).toMatch(/licensed practice/);
  });

  it("reads sub- and superscripts and an equation's gloss from the plain notation", () => {
    expect(inlineParts("T_{m}(n)^{2}")).toEqual([
      { kind: "text", text: "T" },
      { kind: "sub", text: "m" },
      { kind: "text", text: "(n)" },
      { kind: "sup", text: "2" },
    ]);
    expect(equationParts("E = k·ω        back-EMF")).toEqual({
      formula: "E = k·ω",
      gloss: "back-EMF",
    });
    expect(equationParts("a = b,   c = d")).toEqual({ formula: "a = b,   c = d", gloss: null });
  });
});
