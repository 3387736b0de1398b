import { describe, expect, it } from "vitest";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import {
  evidenceKey,
  indexEvidence,
  type EvidenceEntry,
  type EvidenceSubject,
} from "@/lib/evidence/subjects";
import { evidencedReliance } from "@/lib/results/value-reliance";
import { rawCase } from "./fixture";

// The engine fixture with the middle axis's event cost built up from what it causes:
// 30 min of downtime at the case's 400/h, 2 scrap parts at 5, 0.5 h of restart at 85/h = 252.50.
function builtUpCase() {
  const raw = rawCase();
  raw.axes[1].reliability = {
    stepLossEventsPerYear: 4,
    event: { downtimeMinutes: 30, scrapParts: 2, scrapCostPerPart: "5", restartLaborHours: 0.5 },
  };
  return raw;
}

const CASE_ID = 7;
const raw = builtUpCase();
const input = caseInputSchema.parse(raw);
const result = evaluateCase(raw);
const physics = result.scenarios.physics;

const entry = (subjectType: EvidenceSubject, subjectId: string | number, field: string) =>
  ({
    subjectType,
    subjectId: Number(subjectId) || 0,
    field,
    note: "Maintenance log",
    givenOn: "2026-02-01",
    givenBy: "Plant lead",
  }) satisfies EvidenceEntry;

// The index keys by the ids as the engine input names them ("M1-Z"); entries from the database
// carry numbers, so the test builds the index by key directly.
function evidenceOf(...keys: [EvidenceSubject, string | number, string][]) {
  const index = indexEvidence([]);
  for (const [s, id, f] of keys) index[evidenceKey(s, id, f)] = entry(s, id, f);
  return index;
}

const M1Z = (field: string): [EvidenceSubject, string, string] => ["axis", "M1-Z", field];

describe("evidencedReliance", () => {
  it("with no source recorded, all typed value is unevidenced and the largest figures come first", () => {
    // By hand, per year: events 2·5.4·180 + 1·3.6·252.5 + 3·1.6·90 = 3285; maintenance 2·25 = 50;
    // added output 14000 (M1); five years, no escalation on these sources.
    const r = evidencedReliance(physics, result, input, {}, CASE_ID)!;
    expect(r.evidenced).toBe("0");
    expect(r.unevidenced).toBe("86675");
    expect(r.unevidencedPct).toBe(r.typedPct);
    expect(r.mostlyUnevidenced).toBe(true);
    expect(r.unevidencedFigures.slice(0, 2)).toEqual([
      "margin per output hour of machine Invented pick-and-place cell",
      "throughput gain the customer will use of machine Invented pick-and-place cell",
    ]);
    expect(r.unevidencedFigures).toContain("downtime cost of this case");
    expect(r.unevidencedFigures).toContain(
      "downtime per step-loss event on axis Vertical Z of Invented pick-and-place cell",
    );
  });

  it("a machine whose output figures have a source moves its value to the evidenced side", () => {
    const r = evidencedReliance(
      physics,
      result,
      input,
      evidenceOf(["machine", "M1", "throughputGainPct"], ["machine", "M1", "marginPerOutputHour"]),
      CASE_ID,
    )!;
    expect(r.evidenced).toBe("70000");
    expect(r.unevidenced).toBe("16675");
    expect(r.mostlyUnevidenced).toBe(false);
  });

  it("one axis fully evidenced equals the engine's event value of that axis alone", () => {
    const evidence = evidenceOf(
      M1Z("stepLossEventsPerYear"),
      M1Z("avoidedPct"),
      M1Z("downtimeMinutes"),
      M1Z("scrapParts"),
      M1Z("scrapCostPerPart"),
      M1Z("restartLaborHours"),
      ["case", CASE_ID, "downtimeCostPerHour"],
      ["case", CASE_ID, "laborRatePerHour"],
    );
    const r = evidencedReliance(physics, result, input, evidence, CASE_ID)!;
    // Independent of the split: the engine on the same case with the other axes' events at 0.
    const alone = builtUpCase();
    alone.axes[0].reliability.stepLossEventsPerYear = 0;
    alone.axes[2].reliability.stepLossEventsPerYear = 0;
    const aloneTotal = evaluateCase(alone).scenarios.physics.bySource.reliability.reduce(
      (s, y) => s + Number(y),
      0,
    );
    expect(Number(r.evidenced)).toBeCloseTo(aloneTotal, 9);
    expect(aloneTotal).toBe(4545); // 3.6 · 252.50 · 5, by hand
  });

  it("a built-up part stays unevidenced while the case's rate that prices it has no source", () => {
    const evidence = evidenceOf(
      M1Z("stepLossEventsPerYear"),
      M1Z("avoidedPct"),
      M1Z("downtimeMinutes"),
      M1Z("scrapParts"),
      M1Z("scrapCostPerPart"),
      M1Z("restartLaborHours"),
      ["case", CASE_ID, "downtimeCostPerHour"],
    );
    const r = evidencedReliance(physics, result, input, evidence, CASE_ID)!;
    // Downtime 3.6·200·5 = 3600 and scrap 3.6·10·5 = 180 evidenced; labour 3.6·42.5·5 = 765 not.
    expect(Number(r.evidenced)).toBeCloseTo(3780, 9);
    expect(r.unevidencedFigures).toContain("labour rate of this case");
    expect(r.unevidencedFigures).not.toContain("downtime cost of this case");
  });

  it("without a case, the case's own figures can have no source", () => {
    const r = evidencedReliance(
      physics,
      result,
      input,
      evidenceOf(["case", CASE_ID, "maintenanceSavingPerYear"]),
      null,
    )!;
    expect(r.unevidencedFigures).toContain("maintenance saving a year of this case");
  });

  it("names a field's figures of several subjects once, with their count", () => {
    const both = builtUpCase();
    both.machines[1].throughputGainPct = 5;
    both.machines[1].marginPerOutputHour = "20";
    const r = evidencedReliance(
      evaluateCase(both).scenarios.physics,
      evaluateCase(both),
      caseInputSchema.parse(both),
      evidenceOf(["axis", "M1-X", "stepLossEventsPerYear"]),
      CASE_ID,
    )!;
    expect(r.unevidencedFigures).toContain("margin per output hour of 2 machines");
    // Three axes avoid events; one has its events' source, two do not.
    expect(r.unevidencedFigures).toContain("step-loss events per year on 2 axes");
    expect(r.unevidencedFigures).toContain("avoided step-loss events on 3 axes");
  });
});
