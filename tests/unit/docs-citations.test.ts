import { execFileSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// Comments, tests and docs cite the repository's own documents (docs/conventions.md, Where a rule
// is written down): a citation of a file that is not here, or of a section a document does not
// have, sends the next reader nowhere.

const SELF = "tests/unit/docs-citations.test.ts";
const files = execFileSync(
  "git",
  [
    "ls-files",
    "--cached",
    "--others",
    "--exclude-standard",
    "app",
    "lib",
    "db",
    "components",
    "server",
    "tests",
    "docs",
    "README.md",
    "DEVELOPERS.md",
    "proxy.ts",
  ],
  { encoding: "utf8" },
)
  .split("\n")
  .filter((f) => /\.(ts|tsx|mts|mjs|md|sh)$/.test(f) && f !== SELF && fs.existsSync(f));

// Documents that live outside this repository, and bare section marks that stood for them.
// Dotted section numbers (a zip specification's "4.3.7") cite published standards and stay.
const OUTSIDE = [
  new RegExp(
    ["ENGINE", "PRODUCT", "REFERENCES", "CONVENTIONS"].map((n) => `\\b${n}\\.md`).join("|"),
  ),
  /\.\.\/shared\//,
  /§\d+a?(?![.\d])/,
];

function headingsOf(file: string): Set<string> {
  const text = fs.readFileSync(file, "utf8");
  return new Set([...text.matchAll(/^#{1,3} (.+)$/gm)].map((m) => m[1].trim()));
}

describe("citations in code, tests and docs", () => {
  it("cite no document outside the repository", () => {
    const offenders = files.flatMap((file) =>
      fs
        .readFileSync(file, "utf8")
        .split("\n")
        .flatMap((line, i) =>
          OUTSIDE.some((pattern) => pattern.test(line)) ? [`${file}:${i + 1}: ${line.trim()}`] : [],
        ),
    );
    expect(offenders).toEqual([]);
  });

  it("name docs/ files that exist and sections those files have", () => {
    const problems: string[] = [];
    for (const file of files) {
      const text = fs.readFileSync(file, "utf8");
      for (const match of text.matchAll(/docs\/([\w-]+)\.md(?: \(([^()]+)\))?/g)) {
        const doc = `docs/${match[1]}.md`;
        if (!fs.existsSync(path.resolve(doc))) {
          problems.push(`${file}: ${doc} does not exist`);
          continue;
        }
        const cited = match[2];
        // A parenthesis starting in lower case is prose ("generated from this file"), not a section.
        if (cited === undefined || !/^[A-Z]/.test(cited)) continue;
        const headings = headingsOf(doc);
        for (const part of cited.split(/ to |; /)) {
          if (/^[A-Z]/.test(part) && !headings.has(part))
            problems.push(`${file}: ${doc} has no section "${part}"`);
        }
      }
    }
    expect(problems).toEqual([]);
  });
});
