import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string, home: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 820 } });
  const page = await context.newPage();
  await signInWithForm(page, email);
  await page.waitForURL(`**${home}`);
  return page;
}

async function openCatalogue(page: Page, query = "") {
  await page.goto(`${baseUrl()}/catalogue${query}`);
  await page.getByRole("heading", { level: 1, name: "Catalogue" }).waitFor();
}

// With the admin's extra column, and the wider "Restore", the tables still fit beside the navigation.
async function expectNoSidewaysScroll(page: Page) {
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow).toBeLessThanOrEqual(0);
}

const kitRows = (page: Page) => page.locator('tbody tr[data-testid^="kit-"]');
const motorRows = (page: Page) => page.locator('tbody tr[data-testid^="motor-"]');

describe("everyone at the vendor reads the catalogue", () => {
  it("an engineer sees both tables, without the retired kit and without any admin control", async () => {
    const page = await signedIn("engineer@example.com", "/accounts");
    await page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link", { name: "Catalogue" })
      .click();
    await page.waitForURL("**/catalogue");
    await page.getByRole("heading", { name: "Closed-loop retrofit kits" }).waitFor();
    await page.getByRole("heading", { name: "Reference open-loop motors" }).waitFor();

    // The seed holds 12 kits, one of them retired, and 8 motors.
    await expect(kitRows(page).count()).resolves.toBe(11);
    await expect(motorRows(page).count()).resolves.toBe(8);
    await expect(page.getByTestId("kit-CL23-OLD").count()).resolves.toBe(0);

    const kit = page.getByTestId("kit-CL23-E");
    await expect(kit.textContent()).resolves.toContain("€189.00");
    await expect(kit.textContent()).resolves.toContain("keeps the axis motor");
    // docs/contracts.md (Case input) KitInput: an absent max current is √2 × I_R of the motor, an absent bus voltage the axis drive's.
    await expect(kit.textContent()).resolves.toContain("√2 × rated current of the motor");
    await expect(kit.textContent()).resolves.toContain("the axis drive’s");
    await expect(page.getByTestId("kit-CL23-EM").textContent()).resolves.toContain(
      "Reference motor, frame 23, 100 mm",
    );
    await expect(page.getByTestId("motor-RM23-76").textContent()).resolves.toContain("NEMA 23");

    for (const name of ["Add kit", "Add motor", /^Edit/, /^Retire/]) {
      await expect(page.getByRole("link", { name }).count()).resolves.toBe(0);
      await expect(page.getByRole("button", { name }).count()).resolves.toBe(0);
    }
    await screenshot(page, "catalogue-engineer");

    // The forms are the administrator's alone: a real 404 for everyone else.
    for (const path of ["/catalogue/kits/new", "/catalogue/motors/1"]) {
      const res = await page.goto(`${baseUrl()}${path}`);
      expect(res?.status()).toBe(404);
      await page.getByRole("heading", { name: "Page not found" }).waitFor();
      await expect(page.locator("form").count()).resolves.toBe(0);
    }
    await page.context().close();
  });

  it("a reviewer gets the not-found page at /catalogue", async () => {
    const page = await signedIn("reviewer@example.com", "/review");
    const res = await page.goto(`${baseUrl()}/catalogue`);
    expect(res?.status()).toBe(404);
    await page.getByRole("heading", { name: "Page not found" }).waitFor();
    await expect(page.getByText("Closed-loop retrofit kits").count()).resolves.toBe(0);
    await page.context().close();
  });
});

describe("the administrator keeps the catalogue", () => {
  it("adds a motor with its holding torque in ozf·in and sees it saved in N·m", async () => {
    const page = await signedIn("admin@example.com", "/admin");
    await openCatalogue(page);
    await expectNoSidewaysScroll(page);
    await screenshot(page, "catalogue-admin");
    await page.getByRole("link", { name: "Add motor" }).click();
    await page.waitForURL("**/catalogue/motors/new");

    const form = page.getByRole("form", { name: "Add a motor" });
    await form.getByLabel("Code", { exact: true }).fill("TM23-64");
    await form.getByLabel("Name", { exact: true }).fill("Invented test motor, frame 23, 64 mm");
    await form.getByLabel("Frame size (NEMA)").fill("23");
    await form.getByLabel("Holding torque", { exact: true }).fill("180");
    await form.getByLabel("Unit of holding torque").selectOption("ozf·in");
    await form.getByLabel("Rated current (A)").fill("2.8");
    await form.getByLabel("Phase resistance (Ω)").fill("0.9");
    await form.getByLabel("Phase inductance (mH)").fill("2.6");
    await screenshot(page, "motor-form");
    await form.getByRole("button", { name: "Add motor" }).click();
    await page.waitForURL("**/catalogue");

    // NIST SP 811 (2008) B.9: 1 ozf·in = 7.061 552 E−03 N·m, so 180 ozf·in = 1.271 079 36 N·m.
    const expectedNm = 180 * 7.061552e-3;
    const row = page.getByTestId("motor-TM23-64");
    await row.waitFor();
    await expect(row.locator("td").nth(2).textContent()).resolves.toBe(expectedNm.toFixed(3));
    await expect(row.locator("td").nth(1).textContent()).resolves.toBe("NEMA 23");

    // The edit form shows the saved value unrounded, in N·m.
    await row.getByRole("link", { name: "Edit TM23-64" }).click();
    await page.waitForURL(/\/catalogue\/motors\/\d+$/);
    const saved = Number(await page.getByLabel("Holding torque", { exact: true }).inputValue());
    expect(saved).toBeCloseTo(expectedNm, 9);
    await expect(page.getByLabel("Unit of holding torque").inputValue()).resolves.toBe("N·m");
    await page.context().close();
  });

  it("edits a kit's price", async () => {
    const page = await signedIn("admin@example.com", "/admin");
    await openCatalogue(page);
    await page.getByTestId("kit-CL34-EHV").getByRole("link", { name: "Edit CL34-EHV" }).click();
    await page.waitForURL(/\/catalogue\/kits\/\d+$/);
    const form = page.getByRole("form", { name: "Edit kit CL34-EHV" });
    await expect(form.getByLabel("Price per axis").inputValue()).resolves.toBe("398.00");
    await form.getByLabel("Price per axis").fill("1412.5");
    await form.getByRole("button", { name: "Save kit" }).click();
    await page.waitForURL("**/catalogue");
    // The decimal string is shown at the currency's two places, grouped, and not through a float.
    await expect(page.getByTestId("kit-CL34-EHV").textContent()).resolves.toContain("€1,412.50");
    await page.context().close();
  });

  it("retires a kit: it leaves the default list and shows, marked, with the retired ones", async () => {
    const page = await signedIn("admin@example.com", "/admin");
    await openCatalogue(page);
    const row = page.getByTestId("kit-CL17-S");
    await row.getByRole("button", { name: "Retire CL17-S" }).click();
    await row.waitFor({ state: "detached" });
    await expect(kitRows(page).count()).resolves.toBe(10);

    await page.getByRole("link", { name: "Show retired" }).click();
    await page.waitForURL("**/catalogue?retired=1");
    const retired = page.getByTestId("kit-CL17-S");
    await retired.waitFor();
    await expect(retired.getByText("Retired", { exact: true }).isVisible()).resolves.toBe(true);
    await expect(
      page.getByTestId("kit-CL23-OLD").getByText("Retired", { exact: true }).count(),
    ).resolves.toBe(1);
    await expect(kitRows(page).count()).resolves.toBe(12);
    await expectNoSidewaysScroll(page);
    await screenshot(page, "catalogue-retired");

    // Restoring puts it back in the default list.
    await retired.getByRole("button", { name: "Restore CL17-S" }).click();
    await retired.getByRole("button", { name: "Retire CL17-S" }).waitFor();
    await openCatalogue(page);
    await page.getByTestId("kit-CL17-S").waitFor();
    await page.context().close();
  });

  it("a kit form with an empty name shows the message beside the field and saves nothing", async () => {
    const page = await signedIn("admin@example.com", "/admin");
    await page.goto(`${baseUrl()}/catalogue/kits/new`);
    const form = page.getByRole("form", { name: "Add a kit" });
    await form.getByLabel("Code", { exact: true }).fill("CL-NONAME");
    await form.getByLabel("Price per axis").fill("120.00");
    await form.getByLabel("Drive efficiency (%)").fill("140");
    await form.getByRole("button", { name: "Add kit" }).click();

    const name = form.getByLabel("Name", { exact: true });
    await page.locator("#kit-name-error").getByText("Enter a name").waitFor();
    await expect(name.getAttribute("aria-invalid")).resolves.toBe("true");
    await expect(name.getAttribute("aria-describedby")).resolves.toBe("kit-name-error");
    await page.locator("#kit-efficiency-error").getByText("Must be at most 100").waitFor();
    await page.getByRole("status").getByText("Check the highlighted fields.").waitFor();
    expect(new URL(page.url()).pathname).toBe("/catalogue/kits/new");
    await screenshot(page, "kit-form-errors");

    await openCatalogue(page, "?retired=1");
    await expect(page.getByTestId("kit-CL-NONAME").count()).resolves.toBe(0);
    await expect(kitRows(page).count()).resolves.toBe(12);
    await page.context().close();
  });

  it("a motor whose code is already in use is refused by the server, beside the code field", async () => {
    const page = await signedIn("admin@example.com", "/admin");
    await page.goto(`${baseUrl()}/catalogue/motors/new`);
    const form = page.getByRole("form", { name: "Add a motor" });
    await form.getByLabel("Code", { exact: true }).fill("RM23-56");
    await form.getByLabel("Name", { exact: true }).fill("Invented duplicate of a seeded code");
    await form.getByLabel("Frame size (NEMA)").fill("23");
    await form.getByLabel("Holding torque", { exact: true }).fill("0.9");
    await form.getByLabel("Rated current (A)").fill("2.5");
    await form.getByLabel("Phase resistance (Ω)").fill("0.95");
    await form.getByLabel("Phase inductance (mH)").fill("3");
    await form.getByRole("button", { name: "Add motor" }).click();
    await page
      .locator("#motor-code-error")
      .getByText('The code "RM23-56" is already used')
      .waitFor();
    expect(new URL(page.url()).pathname).toBe("/catalogue/motors/new");

    await openCatalogue(page, "?retired=1");
    await expect(page.getByText("Invented duplicate of a seeded code").count()).resolves.toBe(0);
    await page.context().close();
  });
});
