import fs from "node:fs";
import { createRequire } from "node:module";
import type { Page } from "playwright-core";

const require = createRequire(import.meta.url);
const AXE_SOURCE = fs.readFileSync(require.resolve("axe-core/axe.min.js"), "utf8");

export type AxeViolation = { id: string; impact: string | null; help: string; targets: string[] };

// Runs axe-core (the accessibility rules engine from npm) in the page and returns the violations
// of impact "serious" or "critical", each with the elements it found, for a readable failure.
export async function seriousAxeViolations(page: Page): Promise<AxeViolation[]> {
  await page.addScriptTag({ content: AXE_SOURCE });
  const violations = await page.evaluate(async () => {
    type Found = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };
    const axe = (
      window as unknown as { axe: { run: (o: object) => Promise<{ violations: Found[] }> } }
    ).axe;
    const result = await axe.run({ resultTypes: ["violations"] });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      targets: v.nodes.slice(0, 5).map((n) => n.target.join(" ")),
    }));
  });
  return violations.filter((v) => v.impact === "serious" || v.impact === "critical");
}

// The page is wider than the window when it scrolls sideways; at 390 px that means a phone user
// has to pan the whole page rather than a table inside its own scroller.
export async function scrollsSideways(page: Page): Promise<boolean> {
  return page.evaluate(
    () => document.documentElement.scrollWidth > document.documentElement.clientWidth + 1,
  );
}
