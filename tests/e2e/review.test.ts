import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { seriousAxeViolations } from "./support/axe";
import { baseUrl, request, signInOverHttp } from "./support/http";

let browser: Browser;
const contexts: BrowserContext[] = [];

async function pageFor(email?: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
  contexts.push(context);
  const page = await context.newPage();
  if (email) await signInWithForm(page, email);
  return page;
}

let proposalId: number;
let caseId: number;
let invitationLink: string;
const REVIEWER = "pat.controller@example.com";

beforeAll(async () => {
  browser = await launchBrowser();
  // A version of the seeded, not yet proposed labeller case, frozen through the API.
  const { jar } = await signInOverHttp("engineer@example.com", "loopshift-demo");
  const { cases } = (await (await request(jar, "/api/v1/cases")).json()) as {
    cases: { id: number; name: string }[];
  };
  caseId = cases.find((c) => c.name === "South hall labellers")!.id;
  const frozen = await request(jar, `/api/v1/cases/${caseId}/proposals`, { method: "POST" });
  expect(frozen.status).toBe(201);
  proposalId = ((await frozen.json()) as { id: number }).id;
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

describe("a proposal goes to the customer's reviewer by e-mail and comes back with a decision", () => {
  it("the engineer sends it to a new reviewer from the proposal's page", async () => {
    const page = await pageFor("engineer@example.com");
    await page.waitForURL("**/accounts");
    await page.goto(`${baseUrl()}/proposals/${proposalId}`);
    await page.getByRole("heading", { name: /South hall labellers, version \d/ }).waitFor();
    // The form submits through React: wait until the page's scripts have loaded and run.
    await page.waitForLoadState("networkidle");
    const form = page.getByRole("form", { name: "Send to the reviewer" });
    await form.getByLabel("Reviewer's e-mail").fill(REVIEWER);
    await form.getByLabel("Reviewer's name").fill("Pat Controller");
    await form.getByRole("button", { name: "Send the proposal" }).click();
    await page
      .getByText(`Sent to Pat Controller <${REVIEWER}> with an invitation to choose a password`)
      .waitFor();
    await page.getByText("With the customer").first().waitFor();
    await screenshot(page, "proposal-sent-vendor");
  });

  it("the administrator's outbox shows the message with its invitation link", async () => {
    const page = await pageFor("admin@example.com");
    await page.waitForURL("**/admin");
    await page.getByRole("link", { name: "Outbox" }).click();
    await page.waitForURL("**/admin/outbox");
    const message = page.getByTestId("outbox-message").filter({ hasText: REVIEWER }).first();
    await message.waitFor();
    expect(await message.textContent()).toContain("Retrofit proposal for Cartonia Packaging Plant");
    const link = message.locator('a[href*="/invitation/"]').first();
    invitationLink = (await link.getAttribute("href"))!;
    expect(invitationLink.startsWith(`${baseUrl()}/invitation/`)).toBe(true);
    // The HTML part renders in its sandbox with the same link on its button.
    const button = message
      .frameLocator("iframe")
      .getByRole("link", { name: "Choose a password and open the proposal" });
    await button.waitFor();
    expect(await button.getAttribute("href")).toBe(invitationLink);
    await screenshot(page, "admin-outbox");
  });

  it("the reviewer opens the link, chooses a password and lands on the proposal", async () => {
    const page = await pageFor();
    await page.goto(invitationLink);
    await page.getByRole("heading", { name: "Welcome, Pat Controller" }).waitFor();
    // An open invitation exists only in this flow: the accessibility sweep sees expired ones.
    expect(await seriousAxeViolations(page), "axe-core, invitation").toEqual([]);
    await screenshot(page, "invitation-set-password");
    await page.getByLabel("New password").fill("pat-chooses-this-1");
    await page.getByLabel("Repeat the password").fill("pat-chooses-this-1");
    await page.getByRole("button", { name: "Set password and open the proposal" }).click();
    await page.waitForURL(`**/review/proposals/${proposalId}`);
    await page.getByRole("article", { name: "Engineering estimate" }).waitFor();
    await page.getByRole("heading", { name: "Cumulative cash flow" }).waitFor();
    await page.getByRole("heading", { name: "Figures by machine" }).waitFor();
    await page.getByRole("heading", { name: "Assumptions" }).waitFor();
    await page.getByRole("heading", { name: "Cautions" }).waitFor();
    await page.getByRole("link", { name: "Download the workbook (.xlsx)" }).waitFor();
    await screenshot(page, "review-portal-proposal");

    // A what-if with a dearer tariff: the sandbox's NPV appears beside the proposal's.
    const sandbox = page.getByRole("form", { name: "What-if figures" });
    await sandbox.getByLabel(/Electricity tariff/).fill("0.35");
    await sandbox.getByLabel(/Horizon/).fill("8");
    await sandbox.getByRole("button", { name: "Compute with these figures" }).click();
    const npv = page.getByTestId("what-if-physics-npv");
    await expect.poll(() => npv.textContent(), { timeout: 15_000 }).toMatch(/€/);
    await screenshot(page, "review-portal-what-if");

    // Half the step-loss events entered: the NPV and the value by source move, the proposal's
    // own column does not.
    // The reviewer reads where the value comes from before trying figures.
    await page.getByRole("heading", { name: "Value by source over the horizon" }).first().waitFor();
    const storedBefore = await (
      await page.request.get(`${baseUrl()}/api/v1/proposals/${proposalId}`)
    ).text();
    const proposalNpv = await page.getByRole("cell").filter({ hasText: /€/ }).first().textContent();
    const npvBefore = await npv.textContent();
    const detail = page.getByTestId("what-if-detail");
    const breakdownBefore = await detail.textContent();
    await sandbox.getByLabel(/Step-loss events/).fill("0.5");
    await sandbox.getByRole("button", { name: "Compute with these figures" }).click();
    await expect.poll(() => npv.textContent(), { timeout: 15_000 }).not.toBe(npvBefore);
    await expect.poll(() => detail.textContent(), { timeout: 15_000 }).not.toBe(breakdownBefore);
    // The charts are drawn again with the reviewer's figures, inside the sandbox.
    for (const chart of ["Cumulative cash flow", "Value by source over the horizon"])
      await detail.getByRole("heading", { name: chart }).waitFor();
    await screenshot(page, "review-portal-what-if-charts");
    expect(await page.getByRole("cell").filter({ hasText: /€/ }).first().textContent()).toBe(
      proposalNpv,
    );
    // The stored proposal, as the API serves it, is byte for byte what it was.
    expect(
      await (await page.request.get(`${baseUrl()}/api/v1/proposals/${proposalId}`)).text(),
    ).toBe(storedBefore);

    // The decision.
    const decision = page.getByRole("form", { name: "Decision" });
    await decision.getByLabel(/Accept the proposal/).check();
    await decision.getByLabel(/Comment/).fill("Accepted for the spring shutdown.");
    await decision.getByRole("button", { name: "Send my decision" }).click();
    await page.getByText("Your decision is recorded and your supplier has been told.").waitFor();
    await page.getByText("You accepted this proposal").waitFor();
    await screenshot(page, "review-portal-accepted");

    // The invitation link is dead now.
    await page.goto(invitationLink);
    await page.getByRole("heading", { name: "This link has been used" }).waitFor();
  });

  it("the engineer sees the new stage, and the owner's e-mail says so", async () => {
    const page = await pageFor("engineer@example.com");
    await page.waitForURL("**/accounts");
    await page.goto(`${baseUrl()}/cases/${caseId}`);
    const row = page
      .getByRole("row")
      .filter({ has: page.getByRole("link", { name: /^v\d+$/ }) })
      .first();
    await expect.poll(() => row.textContent()).toContain("Accepted");
    await page.goto(`${baseUrl()}/proposals/${proposalId}`);
    await page.getByText("Accepted for the spring shutdown.").waitFor();

    const { jar } = await signInOverHttp("admin@example.com", "loopshift-demo");
    const outbox = (await (await request(jar, "/api/v1/admin/outbox")).json()) as {
      to: string;
      subject: string;
    }[];
    expect(outbox[0]).toMatchObject({ to: "engineer@example.com" });
    expect(outbox[0].subject).toMatch(/^Pat Controller accepted South hall labellers/);
  });

  it("the manager sees it accepted on the pipeline", async () => {
    const page = await pageFor("manager@example.com");
    await page.waitForURL("**/accounts");
    await page.getByRole("link", { name: "Pipeline" }).click();
    await page.waitForURL("**/pipeline");
    await page.getByRole("heading", { name: "Revenue by stage" }).waitFor();
    await page.getByRole("heading", { name: "Revenue by expected close month" }).waitFor();
    const row = page.getByTestId(`quote-${proposalId}`);
    await expect.poll(() => row.textContent()).toContain("Accepted");
    await screenshot(page, "pipeline-manager");

    await page.goto(`${baseUrl()}/pipeline?stage=accepted`);
    await expect.poll(() => page.getByTestId(`quote-${proposalId}`).count()).toBe(1);
    const stages = await page.locator('[data-testid^="quote-"] td:nth-child(4)').allTextContents();
    expect(stages.length).toBeGreaterThan(0);
    expect(new Set(stages)).toEqual(new Set(["Accepted"]));
  });
});
