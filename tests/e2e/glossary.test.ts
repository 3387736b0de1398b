import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { CASE_STAGES } from "@/db/schema/cases";
import { QUOTE_STAGES } from "@/db/schema/quotes";
import {
  LOOP_STATUS_LABELS,
  PAYBACK_STATUS_LABELS,
  QUOTE_STAGE_LABELS,
  SCENARIO_LABELS,
  isGlossaryTerm,
  type TermKind,
} from "@/lib/glossary";
import { launchBrowser, signInWithForm } from "./support/browser";
import { baseUrl, request, signInOverHttp } from "./support/http";

// Every status, stage and scenario name a page prints is marked with its kind (data-term) and
// must be the glossary's word for it; no element may show a stored key such as "modelled" alone.

let browser: Browser;
const RAW_KEYS = [
  ...CASE_STAGES,
  ...QUOTE_STAGES,
  ...Object.keys(LOOP_STATUS_LABELS),
  // "never" is also the plain word a headline payback prints, so only the other two are keys.
  ...Object.keys(PAYBACK_STATUS_LABELS).filter((key) => key !== "never"),
  ...Object.keys(SCENARIO_LABELS),
];

type Printed = { kind: string; text: string };

async function signedInPage(email: string, home: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
  const page = await context.newPage();
  await signInWithForm(page, email);
  await page.waitForURL(`**${home}`);
  return page;
}

/** The marked terms of the page, and any element whose whole text is a raw stored key. */
async function readTerms(page: Page): Promise<{ terms: Printed[]; rawKeys: string[] }> {
  return page.evaluate((keys) => {
    const terms = [...document.querySelectorAll<HTMLElement>("[data-term]")].map((el) => ({
      kind: el.dataset.term ?? "",
      text: (el.textContent ?? "").trim(),
    }));
    const rawKeys = [...document.querySelectorAll<HTMLElement>("main *")]
      .filter((el) => el.children.length === 0)
      .map((el) => (el.textContent ?? "").trim())
      .filter((text) => keys.includes(text));
    return { terms, rawKeys };
  }, RAW_KEYS);
}

/** Reads a page and fails on any marked term that is not the glossary's, or on a bare key. */
async function expectGlossaryTerms(page: Page, path: string, mustShow: TermKind[]) {
  await page.goto(`${baseUrl()}${path}`);
  await page.waitForLoadState("networkidle");
  const { terms, rawKeys } = await readTerms(page);
  for (const t of terms)
    expect(isGlossaryTerm(t.kind as TermKind, t.text), `${path}: ${t.kind} "${t.text}"`).toBe(true);
  for (const kind of mustShow)
    expect(
      terms.some((t) => t.kind === kind),
      `${path} shows a ${kind}`,
    ).toBe(true);
  expect(rawKeys, `${path} prints a stored key`).toEqual([]);
  return terms;
}

let engineerCaseId: number;
let vendorProposalId: number;
let reviewerProposalId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const engineer = await signInOverHttp("engineer@example.com", "loopshift-demo");
  const { proposals } = (await (await request(engineer.jar, "/api/v1/proposals")).json()) as {
    proposals: { id: number; caseId: number; stage: string }[];
  };
  const sent = proposals.find((p) => p.stage === "sent") ?? proposals[0];
  vendorProposalId = sent.id;
  engineerCaseId = sent.caseId;
  const reviewer = await signInOverHttp("reviewer@example.com", "loopshift-demo");
  const forReviewer = (await (await request(reviewer.jar, "/api/v1/proposals")).json()) as {
    proposals: { id: number }[];
  };
  reviewerProposalId = forReviewer.proposals[0].id;
});
afterAll(async () => {
  await browser?.close();
});

describe("every status, stage and scenario name on screen is a glossary term", () => {
  it("on the engineer's case list, case, proposal and pipeline pages", async () => {
    const page = await signedInPage("engineer@example.com", "/accounts");
    await expectGlossaryTerms(page, "/cases", ["case-stage"]);

    await page.goto(`${baseUrl()}/cases/${engineerCaseId}`);
    await page.getByRole("article", { name: SCENARIO_LABELS.physics }).waitFor();
    const caseTerms = await expectGlossaryTerms(page, `/cases/${engineerCaseId}`, [
      "case-stage",
      "quote-stage",
      "scenario",
    ]);
    expect(caseTerms.filter((t) => t.kind === "scenario").length).toBeGreaterThanOrEqual(3);

    await expectGlossaryTerms(page, `/proposals/${vendorProposalId}`, ["quote-stage"]);

    await expectGlossaryTerms(page, "/pipeline", ["quote-stage"]);
    const stageOptions = await page.locator('#f-stage option:not([value=""])').allTextContents();
    expect(stageOptions.length).toBeGreaterThan(0);
    for (const o of stageOptions) expect(Object.values(QUOTE_STAGE_LABELS)).toContain(o.trim());
    await page.context().close();
  });

  it("on the reviewer's list and proposal pages", async () => {
    const page = await signedInPage("reviewer@example.com", "/review");
    await expectGlossaryTerms(page, "/review", ["quote-stage"]);
    await page.goto(`${baseUrl()}/review/proposals/${reviewerProposalId}`);
    await page.getByRole("article", { name: SCENARIO_LABELS.physics }).waitFor();
    await expectGlossaryTerms(page, `/review/proposals/${reviewerProposalId}`, [
      "quote-stage",
      "scenario",
    ]);
    await page.context().close();
  });
});
