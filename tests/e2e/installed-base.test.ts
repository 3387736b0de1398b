import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1360, height: 900 } })).newPage();
  await signInWithForm(page, "engineer@example.com");
  await page.waitForURL("**/accounts");
});
afterAll(async () => {
  await browser?.close();
});

async function openSite(account: string, site: string) {
  await page.goto(`${baseUrl()}/accounts`);
  await page.getByRole("link", { name: account }).click();
  await page.getByRole("link", { name: site }).click();
  await page.getByRole("heading", { level: 1, name: site }).waitFor();
}

describe("an engineer works through the installed base", () => {
  it("goes from accounts to a site and pages, sorts and filters its axes", async () => {
    await openSite("Webline Print Finishing", "Finishing works");
    await expect(page.getByText(/Page 1 of \d+/).isVisible()).resolves.toBe(true);
    await page.getByRole("link", { name: /Speed \[rpm\]/ }).click();
    await page.waitForURL(/sort=speedRpm/);
    await page.getByLabel("Label or machine contains").fill("knife");
    await page.getByRole("button", { name: "Apply" }).click();
    await page.waitForURL(/q=knife/);
    const labels = await page
      .locator("table[aria-label], table")
      .first()
      .locator("tbody tr td:first-child")
      .allTextContents();
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.every((l) => l === "Knife positioner")).toBe(true);
    await screenshot(page, "site-axes-filtered");
  });

  it("adds an axis with torque in oz·in; a bad value is named beside its field and nothing is saved", async () => {
    await openSite("Cartonia Packaging Plant", "North hall");
    await page.getByRole("link", { name: "Add axis" }).click();
    const form = page.getByRole("form", { name: "Add an axis" });
    await form.getByLabel("Axis label", { exact: true }).fill("Invented reel lift");
    await form.getByLabel("Holding torque", { exact: true }).fill("180");
    await form.getByLabel("Unit of holding torque").selectOption("ozf·in");
    await form.getByLabel("Rated current [A]").fill("2.8");
    await form.getByLabel("Phase resistance [Ω]").fill("0.9");
    await form.getByLabel("Phase inductance [mH]").fill("3.2");
    await form.getByLabel("Bus voltage [V]").fill("48");
    await form.getByLabel("Drive current setting [A]").fill("2.8");
    await form.getByLabel("Move time [%]").fill("70");
    await form.getByLabel("Hold time [%]").fill("50");
    await form.getByLabel("Speed [rpm]").fill("300");
    await form.getByLabel("Load torque", { exact: true }).fill("0.25");
    await form.getByLabel("Peak torque", { exact: true }).fill("0.45");
    await form.getByRole("button", { name: "Save axis" }).click();
    await page.getByText("move % + hold % is 120; together they must be at most 100").waitFor();
    await screenshot(page, "axis-form-error");
    await form.getByLabel("Hold time [%]").fill("20");
    await form.getByRole("button", { name: "Save axis" }).click();
    await page.waitForURL(/\/sites\/\d+$/);
    await page.getByLabel("Label or machine contains").fill("Invented reel lift");
    await page.getByRole("button", { name: "Apply" }).click();
    await page.getByRole("cell", { name: "Invented reel lift", exact: true }).waitFor();
    // 180 ozf·in × 7.061552E-03 N·m (NIST SP 811) = 1.27 N·m
    await expect(
      page.getByRole("cell", { name: "1.27", exact: true }).count(),
    ).resolves.toBeGreaterThan(0);
  });

  it("imports a spreadsheet: faults are marked in the preview, a clean file commits and shows in the history", async () => {
    await openSite("Cartonia Packaging Plant", "South hall");
    await page.setInputFiles("#import-file", path.resolve("tests/fixtures/import/faults.csv"));
    await page.getByText("Fix the marked cells in your file").waitFor();
    const marked = page.locator("[data-cell-error]");
    expect(await marked.count()).toBeGreaterThanOrEqual(3);
    await expect(
      page.getByRole("button", { name: /^Import \d+ rows$/ }).isDisabled(),
    ).resolves.toBe(true);
    await page.locator("[data-cell-error]").first().scrollIntoViewIfNeeded();
    await screenshot(page, "import-preview-faults");

    await page.setInputFiles("#import-file", path.resolve("tests/fixtures/import/clean.csv"));
    await page.getByText("All rows are valid.").waitFor();
    await page.getByRole("button", { name: "Import 20 rows" }).click();
    await page.getByText(/Imported 20 axis rows/).waitFor();
    await page.getByText(/^Import history \(\d+\)$/).click();
    await page.getByRole("cell", { name: "clean.csv" }).waitFor();
    await screenshot(page, "import-done");
  });
});

describe("a reviewer sees none of the installed base", () => {
  it("gets the not-found page for accounts and sites", async () => {
    const context = await browser.newContext();
    const p = await context.newPage();
    await signInWithForm(p, "reviewer@example.com");
    await p.waitForURL("**/review");
    expect((await p.goto(`${baseUrl()}/accounts`))?.status()).toBe(404);
    expect((await p.goto(`${baseUrl()}/sites/1`))?.status()).toBe(404);
    await context.close();
  });
});
