import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  await signInWithForm(page, "engineer@example.com");
  await page.waitForURL("**/accounts");
});
afterAll(async () => {
  await browser?.close();
});

const approvalBadges = () => page.getByText("Needs approval", { exact: true });

describe("an engineer edits a case's axes in bulk, renames it and copies it", () => {
  it("selects three axes and gives them a 20 % discount in one step; the rows above the threshold are flagged", async () => {
    await page.goto(`${baseUrl()}/cases`);
    const form = page.getByRole("form", { name: "New case" });
    await form.getByLabel("Case name").fill("Invented bulk edit case");
    await form.getByLabel("Site").selectOption({ label: "Cartonia Packaging Plant — North hall" });
    await form.getByRole("button", { name: "Create case" }).click();
    await page.waitForURL(/\/cases\/\d+$/);
    await page.getByLabel("Label or machine contains").fill("Outfeed belt");
    await page.getByRole("button", { name: /^Select all visible/ }).click();
    await page.getByRole("button", { name: "Save selection" }).click();
    await page.getByText(/The case now holds 14 axes\./).waitFor();

    await page
      .getByText(/Discounts above 15 % need a manager’s approval/)
      .first()
      .waitFor();
    const rows = page.getByRole("checkbox", { name: /^Select Outfeed belt of / });
    await expect.poll(() => rows.count()).toBe(14);
    for (const i of [0, 1, 2]) await rows.nth(i).check();
    await page.getByLabel("Discount % for selected axes").fill("20");
    await page.getByRole("button", { name: "Apply to selected axes" }).click();
    await page.getByText("Set discount 20 % on 3 axes.").waitFor();
    await expect.poll(() => approvalBadges().count()).toBe(3);

    // A bad value refuses the whole step, naming the field.
    await page.getByRole("checkbox", { name: "Select all axes on this page" }).check();
    await page.getByLabel("Discount % for selected axes").fill("120");
    await page.getByLabel("Install hours for selected axes").fill("5");
    await page.getByRole("button", { name: "Apply to selected axes" }).click();
    await page
      .getByRole("form", { name: "Set terms for selected axes" })
      .getByText("Discount % must be at most 100")
      .waitFor();
    expect(await approvalBadges().count()).toBe(3);
    await screenshot(page, "case-bulk-edit");
  });

  it("renames the case with notes, then duplicates it into a draft with the same axes and discounts", async () => {
    await page.getByText("Edit name and notes").click();
    const details = page.getByRole("form", { name: "Name and notes" });
    await details.getByLabel("Case name").fill("");
    await details.getByRole("button", { name: "Save name and notes" }).click();
    await details.getByText("Enter a name for the case").waitFor();
    await details.getByLabel("Case name").fill("Invented bulk edit case, renamed");
    await details.getByLabel("Notes").fill("Only during the summer stop.");
    await details.getByRole("button", { name: "Save name and notes" }).click();
    await page.getByRole("heading", { name: "Invented bulk edit case, renamed" }).waitFor();
    await page.getByText("Only during the summer stop.", { exact: true }).waitFor();

    await page.getByText("Duplicate this case").click();
    const copy = page.getByRole("form", { name: "Duplicate case" });
    expect(await copy.getByLabel("Name of the copy").inputValue()).toBe(
      "Invented bulk edit case, renamed (copy)",
    );
    const original = page.url();
    await copy.getByRole("button", { name: "Duplicate case" }).click();
    await page.waitForURL((url) => /\/cases\/\d+$/.test(url.pathname) && url.href !== original);
    await page.getByRole("heading", { name: "Invented bulk edit case, renamed (copy)" }).waitFor();
    await page.getByText("Only during the summer stop.", { exact: true }).waitFor();
    await expect.poll(() => approvalBadges().count()).toBe(3);
    await page.getByText("Draft", { exact: true }).first().waitFor();
  });

  it("finds the copy in the cases list by text and stage, with the filter in the URL", async () => {
    await page.goto(`${baseUrl()}/cases`);
    await page.getByLabel("Case, account, site or owner contains").fill("bulk edit case");
    await page.getByLabel("Stage").selectOption({ label: "Draft" });
    await page.getByRole("button", { name: "Filter cases" }).click();
    await page.waitForURL(/[?&]stage=draft/);
    await page.getByRole("link", { name: "Invented bulk edit case, renamed (copy)" }).waitFor();
    expect(await page.getByRole("link", { name: /^Invented bulk edit case/ }).count()).toBe(1);
    await page.getByText(/Page 1 of 1 · 1 case$/).waitFor();
  });
});
