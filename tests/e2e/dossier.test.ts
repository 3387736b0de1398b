import fs from "node:fs";
import ExcelJS from "exceljs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SCREENSHOT_DIR, launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { seriousAxeViolations } from "./support/axe";
import { baseUrl, request, signInOverHttp } from "./support/http";

let browser: Browser;
let page: Page;
let reviewerPage: Page;
let dossierUrl: string;
let proposalId: number;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string) {
  const context = await browser.newContext({
    viewport: { width: 1400, height: 900 },
    acceptDownloads: true,
  });
  const p = await context.newPage();
  await signInWithForm(p, email);
  await p.waitForURL(/\/(accounts|admin|review)$/);
  return p;
}

async function downloadedSheetNames(p: Page) {
  const download = p.waitForEvent("download");
  await p.getByRole("link", { name: "Download the workbook (.xlsx)" }).click();
  const file = await download;
  expect(file.suggestedFilename()).toMatch(/-dossier\.xlsx$/);
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(fs.readFileSync((await file.path())!) as unknown as ArrayBuffer);
  return workbook.worksheets.map((w) => w.name);
}

describe("the paid dossier in Chromium", () => {
  it("an administrator sets the dossier's price", async () => {
    const admin = await signedIn("admin@example.com");
    await admin.goto(`${baseUrl()}/admin/payments`);
    await admin.getByText("TEST MODE").first().waitFor();
    const form = admin.getByRole("form", { name: "Dossier price" });
    await form.getByLabel("Price per dossier").fill("12.345");
    await form.getByRole("button", { name: "Save the price" }).click();
    await admin.getByText(/Enter an amount such as 490 or 490\.00/).waitFor();
    await form.getByLabel("Price per dossier").fill("390.00");
    await form.getByRole("button", { name: "Save the price" }).click();
    await admin.getByText("Saved. New checkouts use this price.").waitFor();
    await screenshot(admin, "dossier-admin-price");
    await admin.context().close();
  });

  it("an engineer freezes a proposal and finds its dossier locked, with the price", async () => {
    page = await signedIn("engineer@example.com");
    await page.goto(`${baseUrl()}/cases`);
    const form = page.getByRole("form", { name: "New case" });
    await form.getByLabel("Case name").fill("Invented infeed dossier");
    await form.getByLabel("Site").selectOption({ label: "Cartonia Packaging Plant — North hall" });
    await form.getByRole("button", { name: "Create case" }).click();
    await page.waitForURL(/\/cases\/\d+$/);
    await page.getByRole("button", { name: /^Select all visible/ }).click();
    await page.getByRole("button", { name: "Save selection" }).click();
    await page.getByText(/The case now holds \d+ axes\./).waitFor();
    await page.getByRole("button", { name: "Suggest kits" }).click();
    await page.getByText(/Kits suggested for \d+ of \d+ axes\./).waitFor();
    await page.getByRole("button", { name: "Freeze as proposal" }).click();
    await page.getByText("Frozen as proposal version 1.").waitFor();
    await page.getByRole("link", { name: "Dossier", exact: true }).click();
    await page.waitForURL(/\/dossiers\/\d+$/);
    dossierUrl = page.url();
    proposalId = Number(new URL(dossierUrl).pathname.split("/").at(-1));
    await page.getByRole("heading", { name: "This dossier is locked" }).waitFor();
    await page.getByText("€390.00").waitFor();
    await screenshot(page, "dossier-locked");
  });

  it("the customer's reviewer, sent the proposal, finds its dossier not available yet and nothing to buy", async () => {
    const { jar } = await signInOverHttp("engineer@example.com", "loopshift-demo");
    const sent = await request(jar, `/api/v1/proposals/${proposalId}/send`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: "reviewer@example.com", name: "Demo Finance Reviewer" }),
    });
    expect(sent.status).toBe(200);
    reviewerPage = await signedIn("reviewer@example.com");
    await reviewerPage.goto(`${baseUrl()}/review/proposals/${proposalId}`);
    await reviewerPage
      .getByRole("heading", { name: "Invented infeed dossier, version 1" })
      .waitFor();
    expect(await reviewerPage.getByRole("link", { name: "Open the dossier" }).count()).toBe(0);
    await reviewerPage.goto(`${baseUrl()}/review/proposals/${proposalId}/dossier`);
    await reviewerPage.getByRole("heading", { name: "The dossier is not available yet" }).waitFor();
    expect(await reviewerPage.getByRole("button", { name: /Buy/ }).count()).toBe(0);
    expect(await reviewerPage.getByText("€390.00").count()).toBe(0);
    await screenshot(reviewerPage, "review-dossier-locked");
  });

  it("a declined card leaves the dossier locked with a clear message", async () => {
    await page.getByRole("button", { name: "Buy the dossier" }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await page.getByText("390.00 EUR").first().waitFor();
    await screenshot(page, "checkout");
    await page.getByLabel("Card number").fill("4000 0000 0000 0002");
    await page.getByLabel("Expiry (MM/YY)").fill("12/39");
    await page.getByLabel("Security code").fill("123");
    await page.getByRole("button", { name: /^Pay / }).click();
    await page.getByRole("alert").getByText("Your card was declined").waitFor();
    await screenshot(page, "checkout-declined");
    await page.getByRole("link", { name: "Cancel and go back" }).click();
    await page.getByText("Nothing was charged and the dossier stays locked.").waitFor();
    await page.getByRole("link", { name: "Back to the dossier" }).click();
    await page.getByRole("heading", { name: "This dossier is locked" }).waitFor();
  });

  it("the test card pays; the report opens and the workbook downloads", async () => {
    await page.getByRole("button", { name: "Buy the dossier" }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await page.getByLabel("Card number").fill("4242 4242 4242 4242");
    await page.getByLabel("Expiry (MM/YY)").fill("12/39");
    await page.getByLabel("Security code").fill("123");
    await page.getByRole("button", { name: /^Pay / }).click();
    await page.waitForURL(/\/paid\?session_id=cs_test_/);
    await page.getByText("Payment received: the dossier is unlocked").waitFor();
    // The one page only a purchase reaches, so the read-only accessibility sweep cannot.
    expect(await seriousAxeViolations(page), "axe-core, paid page").toEqual([]);
    await screenshot(page, "dossier-paid");
    await page.getByRole("link", { name: "Open the dossier" }).click();
    await page.waitForURL(dossierUrl);
    await page.getByRole("heading", { name: "Uncertainty: P10, P50 and P90" }).waitFor();
    await page.getByRole("heading", { name: "Payback over tariff and running hours" }).waitFor();
    await page.getByText("NPV over 1,000 draws").waitFor();
    await screenshot(page, "dossier-report");
    // Views a reader sees on screen, section by section, for a closer look.
    for (const [name, heading] of [
      ["top", "Uncertainty: P10, P50 and P90"],
      ["grid", "Payback over tariff and running hours"],
      ["sensitivity", "Sensitivity at ±10, ±20 and ±30 %"],
      ["axes", "Each axis: currents, losses and temperatures"],
    ] as const) {
      await page.getByRole("heading", { name: heading }).scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${SCREENSHOT_DIR}/dossier-report-${name}.png` });
    }

    expect(await downloadedSheetNames(page)).toContain("Uncertainty");

    // The page streams: its first part holds the skeleton of the report, and the report, computed
    // afterwards, follows in the same response (React's Suspense fallback, then the content).
    const html = await (await page.request.get(page.url())).text();
    const skeletonAt = html.indexOf("Computing the dossier");
    const reportAt = html.indexOf("Uncertainty: P10, P50 and P90");
    expect(skeletonAt).toBeGreaterThan(-1);
    expect(reportAt).toBeGreaterThan(skeletonAt);

    await page.emulateMedia({ media: "print" });
    await screenshot(page, "dossier-report-print");
    await page.emulateMedia({ media: "screen" });
  });

  it("the buyer's receipt is in the administrators' outbox, once, with the link to the dossier", async () => {
    const admin = await signedIn("admin@example.com");
    await admin.goto(`${baseUrl()}/admin/outbox`);
    const receipts = admin
      .getByTestId("outbox-message")
      .filter({ hasText: "Receipt for the dossier of Invented infeed dossier, version 1" });
    await receipts.first().waitFor();
    expect(await receipts.count()).toBe(1);
    const receipt = receipts.first();
    expect(await receipt.textContent()).toContain("to engineer@example.com");
    // Only the newest message starts open; open this one whatever came after it.
    await receipt.evaluate((el) => ((el as HTMLDetailsElement).open = true));
    const button = receipt.frameLocator("iframe").getByRole("link", { name: "Open the dossier" });
    await button.waitFor();
    expect(await button.getAttribute("href")).toBe(dossierUrl);
    await receipt.scrollIntoViewIfNeeded();
    await admin.screenshot({ path: `${SCREENSHOT_DIR}/dossier-receipt-outbox.png` });
    await admin.context().close();
  });

  it("the customer's reviewer opens the paid dossier from their proposal and downloads its workbook", async () => {
    await reviewerPage.goto(`${baseUrl()}/review/proposals/${proposalId}`);
    await reviewerPage.getByRole("link", { name: "Open the dossier" }).waitFor();
    await reviewerPage.screenshot({ path: `${SCREENSHOT_DIR}/review-proposal-dossier-link.png` });
    await reviewerPage.getByRole("link", { name: "Open the dossier" }).click();
    await reviewerPage.waitForURL(`**/review/proposals/${proposalId}/dossier`);
    await reviewerPage.getByRole("heading", { name: "Uncertainty: P10, P50 and P90" }).waitFor();
    await reviewerPage.getByText("NPV over 1,000 draws").waitFor();
    // Ranges and seed are shown, not edited: the supplier sets them.
    expect(await reviewerPage.getByRole("button", { name: "Save and rebuild" }).count()).toBe(0);
    await screenshot(reviewerPage, "review-dossier-report");
    await reviewerPage.screenshot({ path: `${SCREENSHOT_DIR}/review-dossier-report-top.png` });
    expect(await downloadedSheetNames(reviewerPage)).toContain("Uncertainty");
    await reviewerPage.context().close();
  });
});
