import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

// The account screens driven by their accessible names: create, rename, share, reassign,
// archive with its confirmation, the list's filters in the URL, and a phone-wide page.
let browser: Browser;

async function signedIn(email: string, width = 1280): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width, height: 900 } })).newPage();
  await signInWithForm(page, email);
  await page.waitForURL("**/accounts");
  return page;
}

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("accounts on screen", () => {
  it("an engineer creates, renames, shares, archives and restores an account", async () => {
    const page = await signedIn("engineer@example.com");
    await page.getByRole("button", { name: "New account" }).click();
    const form = page.getByRole("form", { name: "New account" });
    await form.getByLabel("Account name").fill("cartonia packaging plant");
    await form.getByRole("button", { name: "Create account" }).click();
    await form
      .getByText(/^Account name: an account named "Cartonia Packaging Plant"/)
      .first()
      .waitFor();
    await form.getByLabel("Account name").fill("Invented Screen Works");
    await form.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/accounts\/\d+$/);
    const accountUrl = page.url();
    await page.getByRole("heading", { name: "Sharing and ownership" }).waitFor();

    const rename = page.getByRole("form", { name: "Rename account" });
    await rename.getByLabel("Account name").fill("Invented Screen Works North");
    await rename.getByRole("button", { name: "Save name" }).click();
    await page.getByRole("heading", { level: 1, name: "Invented Screen Works North" }).waitFor();

    const share = page.getByRole("form", { name: "Share account" });
    await share
      .getByLabel("Engineer to share with")
      .selectOption({ label: "Second Demo Engineer" });
    await share.getByRole("button", { name: "Share" }).click();
    await page.getByRole("button", { name: "Stop sharing with Second Demo Engineer" }).click();
    await page.getByText("No longer shared with Second Demo Engineer.").waitFor();
    // An engineer does not reassign owners.
    expect(await page.getByRole("button", { name: "Reassign owner" }).count()).toBe(0);

    await page.getByRole("button", { name: "Archive account" }).click();
    const confirm = page.getByRole("group", { name: "Confirm archiving" });
    await confirm.getByText(/stay readable/).waitFor();
    await confirm.getByRole("button", { name: "Yes, archive account" }).click();
    await page.getByRole("region", { name: "Archived account" }).waitFor();
    expect(await page.getByRole("heading", { name: "Add a site" }).count()).toBe(0);

    await page.goto(`${baseUrl()}/accounts`);
    await page.getByRole("table", { name: "Customer accounts" }).waitFor();
    expect(await page.getByRole("link", { name: "Invented Screen Works North" }).count()).toBe(0);
    await page.getByLabel("Show archived accounts").check();
    await page.getByRole("button", { name: "Apply" }).click();
    await page.waitForURL(/archived=show/);
    await page.getByRole("link", { name: "Invented Screen Works North" }).waitFor();

    await page.goto(accountUrl);
    await page.getByRole("button", { name: "Restore account" }).click();
    await page.getByRole("button", { name: "Archive account" }).waitFor();
    await page.context().close();
  });

  it("a manager creates an account for an engineer, then hands it to another", async () => {
    const page = await signedIn("manager@example.com");
    await page.getByRole("button", { name: "New account" }).click();
    const form = page.getByRole("form", { name: "New account" });
    await form.getByLabel("Account name").fill("Invented Handover Works");
    await form.getByRole("button", { name: "Create account" }).click();
    await form.getByText("Owner: choose the engineer who owns the account.").waitFor();
    await form.getByLabel("Owner").selectOption({ label: "Demo Engineer" });
    await form.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/accounts\/\d+$/);
    await page.getByText("Owner: Demo Engineer").waitFor();

    const reassign = page.getByRole("form", { name: "Reassign owner" });
    await reassign.getByLabel("New owner").selectOption({ label: "Second Demo Engineer" });
    await reassign.getByLabel("Keep Demo Engineer on the share list").check();
    await reassign.getByRole("button", { name: "Reassign owner" }).click();
    await page.getByText("Owner: Second Demo Engineer").waitFor();
    await page.getByRole("list", { name: "Shared with" }).getByText("Demo Engineer").waitFor();

    await page.goto(`${baseUrl()}/accounts?sort=owner&dir=desc&q=handover`);
    const rows = page.getByRole("table", { name: "Customer accounts" }).getByRole("row");
    expect(await rows.count()).toBe(2);
    await page.getByText("Page 1 of 1 · 1 account").waitFor();
    await page.context().close();
  });

  it("fits a phone's width", async () => {
    const page = await signedIn("engineer@example.com", 390);
    await page.getByRole("button", { name: "New account" }).click();
    const wide = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(wide).toBeLessThanOrEqual(390);
    const href = await page
      .getByRole("link", { name: "Cartonia Packaging Plant" })
      .getAttribute("href");
    await page.goto(`${baseUrl()}${href}`);
    await page.getByRole("heading", { name: "Sharing and ownership" }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      390,
    );
    await page.context().close();
  });
});
