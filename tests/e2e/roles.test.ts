import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function freshPage() {
  const context = await browser.newContext({ viewport: { width: 1280, height: 820 } });
  return context.newPage();
}

describe("each demo user signs in through the form and lands on their home", () => {
  it.each([
    ["engineer@example.com", "/accounts", "Accounts"],
    ["engineer2@example.com", "/accounts", "Accounts"],
    ["manager@example.com", "/accounts", "Accounts"],
    ["reviewer@example.com", "/review", "Proposals for review"],
    ["admin@example.com", "/admin", "Users and audit"],
  ])("%s → %s", async (email, home, heading) => {
    const page = await freshPage();
    await signInWithForm(page, email);
    await page.waitForURL(`**${home}`);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(heading);
    await expect(page.getByText(email).first().isVisible()).resolves.toBe(true);
    await screenshot(page, `home-${email.split("@")[0]}`);
    await page.context().close();
  });
});

describe("the sign-in page", () => {
  it("lists the demo users and says plainly when the password is wrong", async () => {
    const page = await freshPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await expect(page.getByRole("heading", { name: "Demo users" }).isVisible()).resolves.toBe(true);
    await page.getByRole("button", { name: /Sales manager/ }).click();
    await expect(page.getByLabel("E-mail").inputValue()).resolves.toBe("manager@example.com");
    await page.getByLabel("Password").fill("definitely-wrong");
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await page.getByText("That e-mail and password do not match an active user.").waitFor();
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await screenshot(page, "sign-in-wrong-password");
    await page.context().close();
  });

  it("shows a message under each empty field instead of submitting", async () => {
    const page = await freshPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await page.getByText("Enter the e-mail address you were registered with").waitFor();
    await page.getByText("Enter your password").waitFor();
    await page.context().close();
  });
});

describe("a reviewer is kept out of the administrator's area", () => {
  it("gets the not-found page at /admin", async () => {
    const page = await freshPage();
    await signInWithForm(page, "reviewer@example.com");
    await page.waitForURL("**/review");
    const res = await page.goto(`${baseUrl()}/admin`);
    expect(res?.status()).toBe(404);
    await page.getByRole("heading", { name: "Page not found" }).waitFor();
    await expect(page.getByText("Users and audit").count()).resolves.toBe(0);
    await screenshot(page, "reviewer-at-admin");
    await page.context().close();
  });
});

describe("the administrator manages users", () => {
  it("creates a user, changes their role, deactivates them, and sees it all in the audit log", async () => {
    const page = await freshPage();
    await signInWithForm(page, "admin@example.com");
    await page.waitForURL("**/admin");
    const form = page.getByRole("form", { name: "Add a user" });
    await form.getByLabel("Name").fill("Invented Planner");
    await form.getByLabel("E-mail").fill("planner@example.com");
    await form.getByLabel("Role").selectOption("engineer");
    await form.getByLabel("Initial password").fill("planner-password-1");
    await form.getByRole("button", { name: "Create user" }).click();
    await page.getByText("Created planner@example.com.").waitFor();

    const row = page.getByTestId("user-planner@example.com");
    await row.waitFor();
    await row.getByLabel("Role of planner@example.com").selectOption("manager");
    await row.getByRole("button", { name: "Save role" }).click();
    await page.getByRole("cell", { name: "planner@example.com: engineer → manager" }).waitFor();
    await row.getByRole("button", { name: "Deactivate" }).click();
    await row.getByText("Deactivated").waitFor();

    await page.goto(`${baseUrl()}/admin?role=manager&sort=email&dir=desc`);
    const emails = await page.locator("tbody tr[data-testid] td:nth-child(2)").allTextContents();
    expect(emails).toEqual(["planner@example.com", "manager@example.com"]);
    await screenshot(page, "admin-users");
    await page.context().close();
  });
});

describe("signing out and narrow screens", () => {
  it("signing out ends the session and returns to the sign-in page", async () => {
    const page = await freshPage();
    await signInWithForm(page, "engineer@example.com");
    await page.waitForURL("**/accounts");
    await page.getByRole("button", { name: "Sign out" }).first().click();
    await page.waitForURL("**/sign-in**");
    const res = await page.goto(`${baseUrl()}/accounts`);
    expect(new URL(res!.url()).pathname).toBe("/sign-in");
    await page.context().close();
  });

  it("on a phone-sized screen the navigation folds into a menu", async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 800 } });
    const page = await context.newPage();
    await signInWithForm(page, "manager@example.com");
    await page.waitForURL("**/accounts");
    const menu = page.getByText("Menu");
    await expect(menu.isVisible()).resolves.toBe(true);
    await menu.click();
    await expect(page.getByRole("link", { name: "Accounts" }).last().isVisible()).resolves.toBe(
      true,
    );
    await screenshot(page, "phone-manager-menu");
    await context.close();
  });
});
