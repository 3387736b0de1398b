// The focus indicator must survive Tailwind's build: Tailwind v4 only emits a theme colour's CSS
// variable when some utility uses it, so a `var(--color-…)` in app/globals.css can silently resolve
// to nothing and leave keyboard focus invisible. Checked against the real Tailwind compiler output.
import { readFileSync } from "node:fs";
import path from "node:path";
import postcss from "postcss";
import tailwind from "@tailwindcss/postcss";
import { describe, expect, it } from "vitest";

const root = path.resolve(__dirname, "../../..");
const cssPath = path.join(root, "app/globals.css");

async function compiledCss(): Promise<string> {
  const source = readFileSync(cssPath, "utf8");
  const result = await postcss([tailwind({ base: root })]).process(source, { from: cssPath });
  return result.css;
}

/** Relative luminance per WCAG 2.x, for a #rrggbb colour. */
function luminance(hex: string): number {
  const channels = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  const [r, g, b] = channels.map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe("keyboard focus indicator (app/globals.css)", () => {
  it("has an outline whose colour is defined in the built stylesheet and reads against white (WCAG 1.4.11, 3:1)", async () => {
    const css = await compiledCss();
    // The bare base-layer rule, not a `focus-visible:` utility class.
    const rule = /(?:^|[\s};])\s*:focus-visible\s*\{([^}]*)\}/.exec(css);
    expect(rule, "a :focus-visible rule in the compiled CSS").not.toBeNull();
    const body = rule![1];
    const outline = /outline:\s*([^;]+);/.exec(body)?.[1] ?? "";
    expect(outline).toMatch(/solid/);
    // Every custom property the rule relies on must be declared somewhere in the output.
    for (const [, name] of body.matchAll(/var\((--[\w-]+)/g)) {
      expect(css, `${name} is declared`).toMatch(new RegExp(`${name}\\s*:`));
    }
    const colour = /#[0-9a-fA-F]{6}/.exec(outline)?.[0] ?? /--focus-ring:\s*(#[0-9a-fA-F]{6})/.exec(css)?.[1];
    expect(colour, "a concrete outline colour").toBeTruthy();
    expect(contrast(colour!, "#ffffff")).toBeGreaterThanOrEqual(3);
  });
});
