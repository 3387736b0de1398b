import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { scrollsSideways, seriousAxeViolations } from "./support/axe";
import { launchBrowser, screenshot, signInWithForm } from "./support/browser";
import { baseUrl } from "./support/http";
import { appPageRoutes, routeOf, type PageRoute } from "./support/page-routes";

// Issue 16, keyboard and small screens: every page every role can reach is checked by axe-core
// (the rules engine from npm, tests/e2e/support/axe.ts) with no "serious" or "critical"
// violation, at a desktop width and at a phone's 390 px, without the page scrolling sideways,
// and the first controls reached with Tab show a focus ring. Pages are found by following the
// links of the demo data from each role's home, so the ids are the demo's own; nothing is
// created or changed (other e2e files count the demo engineer's data).

const WIDE = { width: 1360, height: 900 };
const PHONE = { width: 390, height: 844 };
const TAB_STOPS = 8;

// Pages no read-only walk can open, with the reason; every other page of app/ must be visited.
const NOT_REACHABLE: Record<string, string> = {
  // The payment provider's return address: needs the id of a checkout session, made by buying.
  "/dossiers/[proposalId]/paid":
    "needs a checkout session, which only a purchase creates: tests/e2e/dossier.test.ts checks it after its purchase",
};

let browser: Browser;
const routes = appPageRoutes();
const visited = new Set<string>();

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

type Problem = string;

// Pages with no link to them from the demo data but open to the role all the same: the
// reviewer's view of a dossier before it is bought, and the checkout's "cancelled" return page
// (loading it changes nothing: app/(app)/dossiers/[proposalId]/cancelled/page.tsx).
function pagesBeside(pathname: string): string[] {
  const review = pathname.match(/^\/review\/proposals\/(\d+)$/);
  if (review) return [`${pathname}/dossier`];
  const dossier = pathname.match(/^\/dossiers\/(\d+)$/);
  if (dossier) return [`${pathname}/cancelled`];
  return [];
}

// The outline or shadow the focused element shows: visible when it has width and colour.
async function focusRingOf(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const style = getComputedStyle(el);
    const alpha = (colour: string) => {
      if (colour === "transparent") return 0;
      const m = colour.match(/rgba?\(([^)]+)\)/);
      const parts = m ? m[1].split(/[,\s/]+/).filter(Boolean) : [];
      return parts.length === 4 ? Number(parts[3]) : 1;
    };
    const outline =
      style.outlineStyle !== "none" &&
      parseFloat(style.outlineWidth) > 0 &&
      alpha(style.outlineColor) > 0;
    const shadow = style.boxShadow !== "none" && style.boxShadow !== "";
    const label = (el.getAttribute("aria-label") || el.textContent || el.getAttribute("name") || "")
      .trim()
      .replace(/\s+/g, " ")
      .slice(0, 40);
    return {
      element: `${el.tagName.toLowerCase()} "${label}"`,
      // Date fields hand focus to their parts, so the field itself matches :focus only.
      keyboardFocus: el.matches(":focus-visible") || el.matches("input:focus"),
      visible: outline || shadow,
    };
  });
}

async function focusProblems(page: Page): Promise<Problem[]> {
  const problems: Problem[] = [];
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  for (let i = 0; i < TAB_STOPS; i++) {
    await page.keyboard.press("Tab");
    const ring = await focusRingOf(page);
    if (!ring) continue;
    if (!ring.keyboardFocus || !ring.visible)
      problems.push(`focus ring not visible on ${ring.element} (tab stop ${i + 1})`);
  }
  return problems;
}

function describeViolations(at: string, found: Awaited<ReturnType<typeof seriousAxeViolations>>) {
  return found.map((v) => `${at}: ${v.impact} ${v.id} (${v.help}) at ${v.targets.join(", ")}`);
}

// Opens what a reader opens: each chart's "Show as table" and, on a phone, the menu.
async function openEverything(page: Page) {
  const toggles = page.getByRole("button", { name: "Show as table" });
  for (let i = (await toggles.count()) - 1; i >= 0; i--) await toggles.nth(i).click();
  const menu = page.locator("summary", { hasText: "Menu" });
  if ((await menu.count()) && (await menu.isVisible())) await menu.click();
}

async function checkPage(page: Page, label: string, route: PageRoute): Promise<Problem[]> {
  const problems: Problem[] = [];
  const at = (width: string) =>
    `${label} ${route.template} (${new URL(page.url()).pathname}) ${width}`;

  problems.push(...(await focusProblems(page)).map((p) => `${at("1360 px")}: ${p}`));
  problems.push(...describeViolations(at("1360 px"), await seriousAxeViolations(page)));
  if (await scrollsSideways(page)) problems.push(`${at("1360 px")}: the page scrolls sideways`);

  await page.setViewportSize(PHONE);
  await page.waitForTimeout(300); // charts redraw at the new width
  problems.push(...describeViolations(at("390 px"), await seriousAxeViolations(page)));
  if (await scrollsSideways(page)) problems.push(`${at("390 px")}: the page scrolls sideways`);
  await screenshot(page, `a11y-${label}${route.template.replace(/[/[\]]+/g, "-")}-390`);

  await openEverything(page);
  await page.waitForTimeout(200);
  problems.push(
    ...describeViolations(at("390 px, tables and menu open"), await seriousAxeViolations(page)),
  );
  if (await scrollsSideways(page))
    problems.push(`${at("390 px, tables and menu open")}: the page scrolls sideways`);
  return problems;
}

// Follows the links from the starting pages, checking the first address of each page of app/.
async function walk(page: Page, label: string, start: string[]): Promise<Problem[]> {
  const problems: Problem[] = [];
  const seen = new Set<string>();
  const queue = [...start];
  const origin = new URL(baseUrl()).origin;
  while (queue.length) {
    const pathname = queue.shift()!;
    const asked = routeOf(routes, pathname);
    if (!asked || seen.has(asked.template)) continue;
    await page.setViewportSize(WIDE);
    const res = await page.goto(`${baseUrl()}${pathname}`, { waitUntil: "networkidle" });
    if (!res || res.status() >= 400) {
      problems.push(`${label} ${pathname}: answered ${res?.status()}`);
      continue;
    }
    seen.add(asked.template);
    visited.add(asked.template);
    // "/" sends each role on to its home: the page it lands on is checked as itself.
    const landed = routeOf(routes, new URL(page.url()).pathname);
    if (!landed) continue;
    if (landed.template !== asked.template) {
      if (seen.has(landed.template)) continue;
      seen.add(landed.template);
      visited.add(landed.template);
    }
    // Links inside an e-mail's text (the administrator's outbox) are the recipients' addresses,
    // not pages of this role: following them would only meet another role's 404.
    const links = await page.$$eval("a[href]:not(pre a)", (as) =>
      as.map((a) => (a as HTMLAnchorElement).href),
    );
    for (const link of links) {
      const url = new URL(link);
      if (url.origin === origin && !url.pathname.startsWith("/api/")) queue.push(url.pathname);
    }
    queue.push(...pagesBeside(new URL(page.url()).pathname));
    problems.push(...(await checkPage(page, label, landed)));
  }
  expect(seen.size, `${label} reached no page`).toBeGreaterThan(1);
  return problems;
}

async function freshPage() {
  const context = await browser.newContext({ viewport: WIDE });
  return context.newPage();
}

describe("accessibility of every page, by role (axe-core, 390 px, focus ring)", () => {
  it("signed out: the sign-in page and an invitation link", { timeout: 300_000 }, async () => {
    const page = await freshPage();
    // A link that is not (or no longer) valid: the page a reviewer sees for an old invitation.
    const problems = await walk(page, "signed-out", ["/", "/invitation/no-such-invitation"]);
    await page.context().close();
    expect(problems).toEqual([]);
  });

  it.each([["engineer"], ["manager"], ["admin"], ["reviewer"]])(
    "%s@example.com",
    { timeout: 900_000 },
    async (role) => {
      const page = await freshPage();
      await signInWithForm(page, `${role}@example.com`);
      await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
      const problems = await walk(page, role, ["/"]);
      await page.context().close();
      expect(problems).toEqual([]);
    },
  );

  it("visited every page of app/ but those that need a purchase", () => {
    const missed = routes
      .map((r) => r.template)
      .filter((t) => !visited.has(t) && !(t in NOT_REACHABLE));
    expect(missed).toEqual([]);
  });
});
