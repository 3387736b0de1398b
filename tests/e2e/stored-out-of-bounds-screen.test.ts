import Database from "better-sqlite3";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";

// Issue 13, finding 6, as the engineer sees it: an axis stored before the engine's bounds existed
// (ambient −1000 °C, written straight into the database as an old version could have) makes the
// case page name the machine, the axis, the field and its allowed range, with a link to the
// axis's edit page; correcting it there brings the results back. The API side of the same 409 is
// tests/integration/stored-out-of-bounds.test.ts.
let browser: Browser;
let page: Page;
let target: { caseId: number; axisId: number; ambient: number };

function write(sql: string, ...args: unknown[]) {
  const db = new Database(inject("databasePath"));
  try {
    db.prepare(sql).run(...args);
    // The server keeps results per input revision: an edit behind its back must move it too.
    db.prepare("update input_revision set revision = revision + 1 where id = 1").run();
  } finally {
    db.close();
  }
}

beforeAll(async () => {
  const db = new Database(inject("databasePath"), { readonly: true });
  target = db
    .prepare(
      `select ca.case_id as caseId, ca.axis_id as axisId, a.ambient_c as ambient
         from case_axes ca
         join cases c on c.id = ca.case_id
         join users u on u.id = c.owner_id
         join axes a on a.id = ca.axis_id
        where u.email = 'engineer@example.com'
        order by ca.case_id, ca.axis_id limit 1`,
    )
    .get() as typeof target;
  db.close();
  write("update axes set ambient_c = -1000 where id = ?", target.axisId);
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1300, height: 900 } })).newPage();
  await signInWithForm(page, "engineer@example.com");
  await page.waitForURL("**/accounts");
});

afterAll(async () => {
  // Leave the shared e2e database as the other files expect it, whatever happened above.
  write("update axes set ambient_c = ? where id = ?", target.ambient, target.axisId);
  await browser?.close();
});

describe("a case with a stored value outside the engine's bounds", () => {
  it("names the value and where to fix it, and the results come back once it is corrected", async () => {
    await page.goto(`${baseUrl()}/cases/${target.caseId}`);
    const panel = page.getByRole("alert").filter({
      hasText: "One stored value is outside the range the engine accepts",
    });
    await panel.waitFor();
    await expect(panel.textContent()).resolves.toMatch(/Ambient temperature is -1000 °C/);
    await expect(panel.textContent()).resolves.toMatch(/allowed: -40 to 80 °C/);
    await screenshot(page, "case-stored-value-out-of-bounds");

    const fix = panel.getByRole("link").first();
    expect(await fix.getAttribute("href")).toBe(`/axes/${target.axisId}`);
    await fix.click();
    await page.waitForURL(`**/axes/${target.axisId}`);
    // The form must be live (hydrated) before it is typed into: on a busy machine a value typed
    // earlier is put back to the stored one when React takes the field over.
    await page.waitForLoadState("networkidle");
    const ambient = page.getByLabel(/Ambient/).first();
    await ambient.fill(String(target.ambient));
    await expect.poll(() => ambient.inputValue()).toBe(String(target.ambient));
    await page.getByRole("button", { name: /^Save/ }).click();
    // A saved axis form goes back to its site (components/installed-base/axis-form.tsx); its
    // "Axis saved." line may be gone by the time a check looks for it.
    await page.waitForURL(/\/sites\/\d+$/);

    await page.goto(`${baseUrl()}/cases/${target.caseId}`);
    await page.getByRole("article", { name: "Engineering estimate" }).waitFor();
    expect(await panel.count()).toBe(0);
  });
});
