import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (
    await browser.newContext({ viewport: { width: 1400, height: 900 }, acceptDownloads: true })
  ).newPage();
  await signInWithForm(page, "engineer@example.com");
  await page.waitForURL("**/accounts");
});
afterAll(async () => {
  await browser?.close();
});

// The headline reads to the hundred; its <data> element carries the exact NPV.
const physicsNpv = () =>
  page
    .getByRole("article", { name: "Engineering estimate" })
    .getByTestId("headline-npv")
    .getAttribute("value");

describe("an engineer builds a case and freezes a proposal", () => {
  it("creates a case from a site, picks axes, suggests kits and sees the results", async () => {
    await page.goto(`${baseUrl()}/cases`);
    const form = page.getByRole("form", { name: "New case" });
    await form.getByLabel("Case name").fill("Invented outfeed retrofit");
    await form.getByLabel("Site").selectOption({ label: "Cartonia Packaging Plant — North hall" });
    await form.getByRole("button", { name: "Create case" }).click();
    await page.waitForURL(/\/cases\/\d+$/);
    await page.getByLabel("Label or machine contains").fill("Outfeed belt");
    await page.getByRole("button", { name: /^Select all visible/ }).click();
    await page.getByRole("button", { name: "Save selection" }).click();
    await page.getByText(/The case now holds \d+ axes\./).waitFor();
    await page.getByRole("button", { name: "Suggest kits" }).click();
    await page.getByText(/Kits suggested for \d+ of \d+ axes\./).waitFor();
    await page.getByRole("article", { name: "Engineering estimate" }).waitFor();
    await screenshot(page, "case-results");
  });

  it("a higher tariff moves the NPV with one request for the new figures; freezing makes version 1 with a workbook", async () => {
    const before = await physicsNpv();
    const caseReads: string[] = [];
    const countCaseReads = (request: { method(): string; url(): string }) => {
      if (request.method() === "GET" && request.url().includes("/api/v1/cases/"))
        caseReads.push(new URL(request.url()).pathname + new URL(request.url()).search);
    };
    page.on("request", countCaseReads);
    const tariff = page.getByLabel(/Electricity tariff/);
    await tariff.fill("0.60");
    await page.getByRole("button", { name: "Apply assumptions" }).click();
    await page.getByText("Assumptions saved; the results are recomputing.").waitFor();
    await expect.poll(physicsNpv, { timeout: 15_000 }).not.toBe(before);
    // Past the form's 400 ms debounce and any late second request: the input and the result
    // came in one GET.
    await page.waitForTimeout(1_500);
    page.off("request", countCaseReads);
    expect(caseReads).toEqual([
      expect.stringMatching(/^\/api\/v1\/cases\/\d+\/result\?include=input$/),
    ]);

    await page.getByRole("button", { name: "Freeze as proposal" }).click();
    await page.getByText("Frozen as proposal version 1.").waitFor();
    await page.getByRole("cell", { name: "v1", exact: true }).waitFor();
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Download workbook" }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/\.xlsx$/);
    await screenshot(page, "case-frozen");
  });
});
