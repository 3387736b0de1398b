import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl, request, signInOverHttp } from "./support/http";

let browser: Browser;
const contexts: BrowserContext[] = [];

async function pageFor(email: string, width = 1400): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  contexts.push(context);
  const page = await context.newPage();
  await signInWithForm(page, email);
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
  return page;
}

const METHOD_HEADING = "How Loopshift computes its figures";
const LINK = "How these figures are computed";

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

describe("the method page explains every result, for the vendor and the customer's reviewer", () => {
  it("an engineer opens it from a case's results", async () => {
    const { jar } = await signInOverHttp("engineer@example.com", "loopshift-demo");
    const { cases } = (await (await request(jar, "/api/v1/cases")).json()) as {
      cases: { id: number; name: string }[];
    };
    const caseId = cases.find((c) => c.name === "North hall labellers")!.id;

    const page = await pageFor("engineer@example.com");
    await page.goto(`${baseUrl()}/cases/${caseId}`);
    await page.getByText(/Computed by engine \d+\.\d+\.\d+/).waitFor();
    await page.getByRole("link", { name: LINK }).first().click();
    await page.waitForURL("**/method");
    await page.getByRole("heading", { level: 1, name: METHOD_HEADING }).waitFor();
    for (const section of ["Torque at speed", "The business case", "Sources of the check values"])
      await page.getByRole("heading", { level: 2, name: section }).waitFor();
    expect(await page.getByText("NIST SP 811, Appendix B").count()).toBeGreaterThan(0);
    await screenshot(page, "method-engineer");
  });

  it("a reviewer opens it from a proposal sent to them, inside the portal", async () => {
    const page = await pageFor("reviewer@example.com");
    await page.goto(`${baseUrl()}/review`);
    const proposal = page.locator('a[href^="/review/proposals/"]').first();
    await proposal.waitFor();
    await page.goto(`${baseUrl()}${await proposal.getAttribute("href")}`);
    await page.getByRole("link", { name: LINK }).first().click();
    await page.waitForURL("**/review/method");
    await page.getByRole("heading", { level: 1, name: METHOD_HEADING }).waitFor();
    await page.getByRole("heading", { level: 2, name: "Safety" }).waitFor();
    await screenshot(page, "method-reviewer");
  });

  it("fits a phone's width without sideways scrolling", async () => {
    const page = await pageFor("reviewer@example.com", 390);
    await page.goto(`${baseUrl()}/review/method`);
    await page.getByRole("heading", { level: 1, name: METHOD_HEADING }).waitFor();
    const [scrollWidth, innerWidth] = await page.evaluate(() => [
      document.documentElement.scrollWidth,
      window.innerWidth,
    ]);
    expect(scrollWidth).toBeLessThanOrEqual(innerWidth);
  });

  it.each(["/method", "/review/method"])(
    "%s sends the signed-out to the sign-in page",
    async (path) => {
      const res = await request(null, path);
      expect(res.status).toBe(307);
      expect(res.headers.get("location")).toContain(
        `/sign-in?callbackUrl=${encodeURIComponent(path)}`,
      );
    },
  );

  it.each([
    ["reviewer@example.com", "/method"],
    ["engineer@example.com", "/review/method"],
  ])("%s gets a 404 for the other shell's copy, %s", async (email, path) => {
    const { jar } = await signInOverHttp(email, "loopshift-demo");
    expect((await request(jar, path)).status).toBe(404);
  });
});
