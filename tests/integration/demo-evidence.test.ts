import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { HeadlineCards } from "@/components/results/headline-cards";
import { db } from "@/db";
import { listAudit } from "@/db/queries/audit";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import { listCaseEvidence, listReviewedProposalEvidence } from "@/db/queries/evidence";
import { getVisibleQuoteOrThrow } from "@/db/queries/proposals";
import { proposals } from "@/db/schema";
import { caseInputSchema, evaluateCase, type CaseResult } from "@/lib/engine";
import { frozenSubjects, indexEvidence, type EvidenceIndex } from "@/lib/evidence/subjects";
import { evidencedReliance } from "@/lib/results/value-reliance";
import { caller } from "../support/callers";

// The demo scenario shows both states of the headline's evidence warning (db/demo/evidence.ts):
// the packaging plant's cartoner case, the one the reviewer is sent, records where most of its
// typed figures come from and shows no warning; the other demo cases record nothing and warn.
const engineer = () => caller("engineer@example.com");
const reviewer = () => caller("reviewer@example.com");
const LEAD = "North hall cartoners, phase 1";

const caseNamed = (name: string) => listCases(engineer()).find((c) => c.name === name)!;

/** The case's headline as its page draws it: from its live input, or from a frozen proposal. */
function headline(
  caseId: number,
  index: EvidenceIndex,
  audience: "vendor" | "reviewer",
  frozen?: { input: unknown; result: CaseResult },
) {
  const input = caseInputSchema.parse(frozen?.input ?? buildCaseInput(engineer(), caseId));
  const result = frozen?.result ?? evaluateCase(input);
  const split = evidencedReliance(result.scenarios.physics, result, input, index, caseId);
  const html = renderToStaticMarkup(
    createElement(HeadlineCards, { result, input, evidence: { caseId, index, audience } }),
  );
  return { split: split!, html };
}

describe("the demo scenario's recorded sources", () => {
  it("the lead case is mostly evidenced and shows no warning; the others still warn", () => {
    const lead = caseNamed(LEAD);
    const entries = listCaseEvidence(engineer(), lead.id);
    expect(entries.length).toBeGreaterThan(0);
    for (const e of entries) {
      expect(e.note.length).toBeGreaterThan(10);
      expect(e.givenOn).toMatch(/^\d{4}-\d{2}-\d{2}$/);
      expect(e.givenBy).not.toBe("");
    }
    const { split, html } = headline(lead.id, indexEvidence(entries), "vendor");
    expect(split.mostlyTyped, "the lead case rests mostly on typed figures").toBe(true);
    expect(split.mostlyUnevidenced).toBe(false);
    expect(split.evidencedPct).toBeGreaterThan(50);
    expect(html).not.toContain("without a source");
    expect(html).toContain("rests on figures whose source is recorded");

    const others = listCases(engineer()).filter((c) => c.id !== lead.id && c.axisCount > 0);
    expect(others.length).toBeGreaterThan(0);
    for (const other of others) {
      expect(listCaseEvidence(engineer(), other.id), other.name).toEqual([]);
      const warned = headline(other.id, {}, "vendor");
      if (warned.split.mostlyTyped)
        expect(warned.html, other.name).toContain("Mostly typed figures without a source.");
    }
    expect(
      others.some((c) => headline(c.id, {}, "vendor").split.mostlyUnevidenced),
      "another demo case still shows the warning",
    ).toBe(true);
  });

  it("the reviewer's proposals show one evidenced, one warned, and the seed writes no audit lines", () => {
    const visible = db
      .select()
      .from(proposals)
      .all()
      .flatMap((p) => {
        try {
          return [{ proposal: p, quote: getVisibleQuoteOrThrow(reviewer(), p.id) }];
        } catch {
          return [];
        }
      });
    const states = visible.map(({ proposal, quote }) => {
      const index = indexEvidence(
        listReviewedProposalEvidence(reviewer(), proposal.id, frozenSubjects(proposal.input)),
      );
      const { html } = headline(quote.caseId, index, "reviewer", proposal);
      return { name: quote.caseName, warns: html.includes("without a source") };
    });
    expect(states).toContainEqual({ name: LEAD, warns: false });
    expect(
      states.some((s) => s.warns),
      "a proposal the reviewer sees still warns",
    ).toBe(true);

    expect(
      listAudit(caller("admin@example.com")).filter((a) => a.action === "evidence.save"),
    ).toEqual([]);
  });
});
