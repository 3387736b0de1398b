import {
  METHOD_CAUTIONS,
  METHOD_DEFAULTS,
  METHOD_LEAD,
  METHOD_LIMITS,
  METHOD_SECTIONS,
  METHOD_SOURCES,
  METHOD_TITLE,
} from "./model";
import { equationParts, inlineParts, type MethodBlock } from "./types";

/** Inline notation as GitHub-flavoured Markdown with <sub>/<sup>. */
function inline(text: string): string {
  return inlineParts(text)
    .map((p) => (p.kind === "text" ? p.text : `<${p.kind}>${p.text}</${p.kind}>`))
    .join("");
}

const cell = (text: string) => inline(text).replace(/\|/g, "\\|");

function table(head: string[], rows: string[][]): string {
  return [
    `| ${head.map(cell).join(" | ")} |`,
    `| ${head.map(() => "---").join(" | ")} |`,
    ...rows.map((r) => `| ${r.map(cell).join(" | ")} |`),
  ].join("\n");
}

function block(b: MethodBlock): string {
  switch (b.kind) {
    case "p":
      return inline(b.text);
    case "eq":
      return b.lines
        .map((line) => {
          const { formula, gloss } = equationParts(line);
          // Gaps inside a formula separate its parts; Markdown would fold them to one space.
          const shown = inline(formula).replace(/ {2,}/g, " &nbsp; ");
          return `> ${shown}${gloss ? ` — *${inline(gloss)}*` : ""}`;
        })
        .join("<br>\n");
    case "list":
      return b.items.map((i) => `- ${inline(i)}`).join("\n");
    case "table":
      return `*${b.caption}*\n\n${table(b.head, b.rows)}`;
  }
}

/** docs/model.md, generated from the same text as the method page. */
export function methodMarkdown(): string {
  const parts: string[] = [
    "<!-- Generated from lib/method/model.ts by `npm run docs:model`; edit that file, not this one. -->",
    `# ${METHOD_TITLE}`,
    METHOD_LEAD,
  ];
  for (const section of METHOD_SECTIONS) {
    parts.push(`## ${section.title}`);
    for (const b of section.blocks) parts.push(block(b));
  }
  parts.push(
    "## Defaults",
    "Where a default is marked common practice, no single published source gives it.",
    table(
      ["setting", "default", "rests on"],
      METHOD_DEFAULTS.map((d) => [d.setting, d.value, d.basis]),
    ),
    "## Sources of the check values",
    "The engine's tests compare against these outside values. Values marked “from memory” are not yet confirmed against the document; “common practice” has no single source.",
    table(
      ["check", "value", "source"],
      METHOD_SOURCES.map((s) => [s.check, s.value, s.source]),
    ),
    "## Limits",
    METHOD_LIMITS.map((l) => `- ${l}`).join("\n"),
    "## Safety",
    METHOD_CAUTIONS.map((c) => `- ${c}`).join("\n"),
  );
  return `${parts.join("\n\n")}\n`;
}
