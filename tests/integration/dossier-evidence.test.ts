// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import type { ReactNode } from "react";
import { prerender } from "react-dom/static";
import { describe, expect, it } from "vitest";
import VendorDossierPage from "@/app/(app)/dossiers/[proposalId]/page";
import ReviewDossierPage from "@/app/(review)/review/proposals/[proposalId]/dossier/page";
import { listCases } from "@/db/queries/cases";
import { clearEvidence, listProposalEvidence, saveEvidence } from "@/db/queries/evidence";
import { frozenSubjects } from "@/lib/evidence/subjects";
import { recordCheckoutSession } from "@/db/queries/payments";
import { getProposalSnapshotOrThrow } from "@/db/queries/proposals";
import { listProposals } from "@/db/queries/proposal-versions";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { evidencedReliance, typedValueFigures } from "@/lib/results/value-reliance";
import { evidenceInputSchema } from "@/lib/validations/evidence";
import { recordPaymentEvent } from "@/server/payments/record-event";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";
import { withInertRouter } from "../support/render-page";

// Issue 16: the paid dossier weighs the recorded sources of the frozen figures as the proposal
// pages do — the vendor's people through their case, the customer's reviewer through the
// proposal sent to them — warns once above the scenario cards, and lists the sources read only.
const engineer = () => caller("engineer@example.com");
const reviewer = () => caller("reviewer@example.com");

// Sent to the seeded reviewer (db/demo/cases.ts), as in dossier-reviewer.test.ts.
const target = listCases(engineer()).find((c) => c.name === "North hall cartoners, phase 1")!;
const proposal = listProposals(engineer(), target.id).at(-1)!;

function pay(proposalId: number) {
  recordCheckoutSession(engineer(), proposalId, {
    id: "cs_test_dossier_evidence",
    amountMinor: 49000,
    amount: "490.00",
    currency: "EUR",
  });
  const paid = recordPaymentEvent({
    id: "evt_dossier_evidence",
    type: "checkout.session.completed",
    session: {
      id: "cs_test_dossier_evidence",
      paymentStatus: "paid",
      amountTotal: 49000,
      currency: "eur",
    },
  });
  expect(paid.outcome).toBe("granted");
}

/** The page as the browser gets it, the streamed report included (prerender waits for it). */
async function render(page: ReactNode): Promise<string> {
  const { prelude } = await prerender(withInertRouter(page));
  // React separates adjacent text with empty comments; a reader sees none.
  return (await new Response(prelude).text()).replaceAll("<!-- -->", "");
}

const params = () => ({ params: Promise.resolve({ proposalId: String(proposal.id) }) });
const vendorPage = async () =>
  render(await asRequestOf(engineer(), () => VendorDossierPage(params())));
const reviewerPage = async () =>
  render(await asRequestOf(reviewer(), () => ReviewDossierPage(params())));

const count = (html: string, text: string) => html.split(text).length - 1;
// React escapes apostrophes and ampersands in text.
const escaped = (text: string) => text.replaceAll("&", "&amp;").replaceAll("'", "&#x27;");

describe("the dossier's headline and the recorded sources of the frozen figures", () => {
  // The dossier's figures: the engine on the frozen input.
  const { input: frozen } = getProposalSnapshotOrThrow(engineer(), proposal.id);
  const input = caseInputSchema.parse(frozen);
  const result = evaluateCase(frozen);
  const figures = typedValueFigures(result, input, target.id);

  it("with no source recorded, warns once, naming the figures, for the vendor and the reviewer", async () => {
    pay(proposal.id);
    // The demo records sources for this case (db/demo/evidence.ts): take them away first.
    const seeded = listProposalEvidence(engineer(), target.id, frozenSubjects(input));
    expect(seeded.length).toBeGreaterThan(0);
    for (const { subjectType, subjectId, field } of seeded)
      expect(clearEvidence(engineer(), { subjectType, subjectId, field })).toBe(true);
    const none = evidencedReliance(result.scenarios.physics, result, input, {}, target.id)!;
    // The demo case rests mostly on typed figures: the warning is expected.
    expect(none.mostlyUnevidenced).toBe(true);

    const vendor = await vendorPage();
    expect(count(vendor, 'data-testid="unevidenced-warning"')).toBe(1);
    expect(count(vendor, "Mostly typed figures without a source.")).toBe(1);
    expect(vendor).toContain(escaped(none.unevidencedFigures[0]!));
    expect(vendor).toContain("Check where each comes from before relying");
    expect(vendor).not.toContain("Record where each comes from");
    // The typed figures listed, read only: a report links to no form.
    expect(vendor).toContain("Typed figures and their sources");
    expect(vendor).toContain(
      `${figures.length} of ${figures.length} typed figures the value rests on have no recorded source.`,
    );
    expect(vendor).not.toContain("Record it");

    const review = await reviewerPage();
    expect(count(review, 'data-testid="unevidenced-warning"')).toBe(1);
    expect(review).toContain(escaped(none.unevidencedFigures[0]!));
    expect(review).toContain("Ask your supplier where each comes from");
    expect(review).not.toContain("Record where each comes from");
  });

  it("with sources recorded for the frozen figures, warns of nothing and shows the sources", async () => {
    // A source for every typed figure the frozen proposal's value rests on, by the ids it was
    // frozen with.
    for (const f of figures) {
      const [subjectType, subjectId, field] = f.key.split(":");
      saveEvidence(
        engineer(),
        evidenceInputSchema.parse({
          subjectType,
          subjectId: Number(subjectId),
          field,
          note: "Shift log, weeks 1 to 12",
          givenOn: "2026-11-02",
          givenBy: "Line supervisor",
        }),
      );
    }
    for (const html of [await vendorPage(), await reviewerPage()]) {
      expect(html).not.toContain("unevidenced-warning");
      expect(html).not.toContain("without a source");
      expect(count(html, "rests on figures whose source is recorded")).toBe(1);
      expect(html).toContain("Every typed figure the value rests on has a recorded source.");
      expect(html).toContain("Source: Shift log, weeks 1 to 12 — Line supervisor, 2026-11-02");
    }
    // Another tenant's engineer gets the page's 404, not the report or its sources.
    await expect(
      asRequestOf(caller("engineer2@example.com"), () => VendorDossierPage(params())),
    ).rejects.toThrow(/NEXT_HTTP_ERROR_FALLBACK;404/);
  });
});
