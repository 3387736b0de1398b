import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { HeadlineCards } from "@/components/results/headline-cards";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { evidenceKey, indexEvidence, type EvidenceIndex } from "@/lib/evidence/subjects";
import { headlineReliance } from "@/lib/results/headline-reliance";
import { evidencedReliance, typedValueFigures, valueReliance } from "@/lib/results/value-reliance";
import { rawCase } from "./fixture";

// The headline's note on typed figures: once above the three scenario cards, about the
// engineering estimate, and true of the trade-claim scenarios beside it.
const CASE_ID = 7;
const raw = rawCase();
const input = caseInputSchema.parse(raw);
const result = evaluateCase(raw);

/** A source for each of the given typed figures, by evidence key. */
function sourced(keys: string[]): EvidenceIndex {
  const index = indexEvidence([]);
  for (const key of keys) {
    const [subjectType, subjectId, field] = key.split(":") as ["axis", string, string];
    index[evidenceKey(subjectType, subjectId, field)] = {
      subjectType,
      subjectId: Number(subjectId) || 0,
      field,
      note: "Maintenance log",
      givenOn: "2026-02-01",
      givenBy: "Plant lead",
    };
  }
  return index;
}

const count = (html: string, text: string) => html.split(text).length - 1;

const cards = (evidence?: { caseId: number; index: EvidenceIndex }) =>
  renderToStaticMarkup(createElement(HeadlineCards, { result, input, evidence }));

describe("the headline's note on typed figures", () => {
  it("with no source recorded, warns once above the three cards, naming the figures", () => {
    const html = cards({ caseId: CASE_ID, index: {} });
    expect(count(html, 'data-testid="unevidenced-warning"')).toBe(1);
    expect(count(html, "Mostly typed figures without a source.")).toBe(1);
    // Three cards, and the note before the first of them.
    expect(count(html, "<article")).toBe(3);
    expect(html.indexOf("unevidenced-warning")).toBeLessThan(html.indexOf("<article"));

    const physics = evidencedReliance(result.scenarios.physics, result, input, {}, CASE_ID)!;
    expect(physics.unevidencedFigures.length).toBeGreaterThan(4);
    const note = headlineReliance(result, input, { caseId: CASE_ID, index: {} })!;
    expect(note).toMatchObject({ tone: "caution", unevidenced: true });
    expect(note.text).toMatch(
      new RegExp(
        `^In the engineering estimate, the basis of the proposal, ${physics.unevidencedPct} % of the value over the horizon rests on typed figures with no recorded source: ${physics.unevidencedFigures[0]}; ${physics.unevidencedFigures[1]}; ${physics.unevidencedFigures[2]}; ${physics.unevidencedFigures[3]}; and ${physics.unevidencedFigures.length - 4} more\\.`,
      ),
    );
    // The trade-claim scenarios rest mostly on them too, and their shares are given as such.
    expect(note.text).toContain(" In the other scenarios: ");
    expect(note.text).toContain("% in the low trade claim (25 % saved); ");
    expect(note.text).not.toMatch(/half or less/);
    expect(note.text).toMatch(
      /Record where each comes from .* before relying on the net present value\.$/,
    );
  });

  it("asks the customer's reviewer to ask for the sources, rather than to record them", () => {
    const note = headlineReliance(result, input, {
      caseId: CASE_ID,
      index: {},
      audience: "reviewer",
    })!;
    expect(note.text).toMatch(
      /Ask your supplier where each comes from before relying on the net present value\.$/,
    );
    expect(note.text).not.toMatch(/Record where/);
  });

  it("words a report's warning for whoever holds it: neither a form to fill nor a supplier to ask", () => {
    const note = headlineReliance(result, input, {
      caseId: CASE_ID,
      index: {},
      audience: "report",
    })!;
    expect(note.text).toMatch(
      /Check where each comes from before relying on the net present value\.$/,
    );
    expect(note.text).not.toMatch(/Record where|Ask your supplier/);
  });

  it("with every typed figure sourced, states the sourced share once and warns of nothing", () => {
    const all = sourced(typedValueFigures(result, input, CASE_ID).map((f) => f.key));
    const html = cards({ caseId: CASE_ID, index: all });
    expect(html).not.toContain("unevidenced-warning");
    expect(html).not.toContain("without a source");
    expect(count(html, "rests on figures whose source is recorded")).toBe(1);
    const physics = evidencedReliance(result.scenarios.physics, result, input, all, CASE_ID)!;
    expect(headlineReliance(result, input, { caseId: CASE_ID, index: all })).toMatchObject({
      tone: "plain",
      text: expect.stringContaining(`${physics.evidencedPct} % rests on figures whose source`),
    });
  });

  it("without sources to weigh, says once that the value is mostly typed", () => {
    const html = cards();
    expect(count(html, "Mostly typed figures.")).toBe(1);
    expect(html).not.toContain("unevidenced-warning");
    expect(html).not.toContain("without a source");
    expect(headlineReliance(result, null)).toMatchObject({ tone: "caution", unevidenced: false });
  });

  it("says so where a trade-claim scenario rests on typed figures for half or less", () => {
    // Only a maintenance saving of 35 a year is typed: a little over the engine's energy and
    // cooling value in the estimate and the low claim, well under it in a high claim of 90 %.
    const edited = rawCase();
    edited.band = { lowPct: 25, highPct: 90 };
    edited.machines[0].throughputGainPct = 0;
    for (const axis of edited.axes) {
      if (axis.reliability) axis.reliability.stepLossEventsPerYear = 0;
      axis.retrofit.maintenanceSavingPerYear = "0";
    }
    edited.axes[0].retrofit.maintenanceSavingPerYear = "17.5"; // two axes of this kind
    const r = evaluateCase(edited);
    const parsed = caseInputSchema.parse(edited);
    const physics = valueReliance(r.scenarios.physics)!;
    const high = valueReliance(r.scenarios.bandHigh)!;
    expect(physics.mostlyTyped).toBe(true);
    expect(high.mostlyTyped).toBe(false);

    const weighed = headlineReliance(r, parsed, { caseId: CASE_ID, index: {} })!;
    expect(weighed.text).toContain(
      `; ${high.typedPct} % in the high trade claim (90 % saved), half or less.`,
    );
    const plain = headlineReliance(r, parsed)!;
    expect(plain.text).toMatch(/^In the engineering estimate, the basis of the proposal, \d+ %/);
    expect(plain.text).toContain(
      `${high.typedPct} % in the high trade claim (90 % saved), half or less.`,
    );
  });
});
