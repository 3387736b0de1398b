/**
 * The method text as data, so that the in-app page and docs/model.md are rendered from one
 * source. Inline notation: `_{…}` is a subscript and `^{…}` a superscript; everything else is
 * plain Unicode text.
 */
export type MethodBlock =
  | { kind: "p"; text: string }
  /** Displayed equations, one per line. */
  | { kind: "eq"; lines: string[] }
  | { kind: "list"; items: string[] }
  | { kind: "table"; caption: string; head: string[]; rows: string[][] };

export interface MethodSection {
  /** Anchor on the page and in the document. */
  id: string;
  title: string;
  blocks: MethodBlock[];
}

/** A piece of inline text: plain, subscript or superscript. */
export type InlinePart = { kind: "text" | "sub" | "sup"; text: string };

/** Splits `T_{m}(n)` into its plain and sub/superscript pieces. */
export function inlineParts(text: string): InlinePart[] {
  const parts: InlinePart[] = [];
  const pattern = /([_^])\{([^}]*)\}/g;
  let last = 0;
  for (const match of text.matchAll(pattern)) {
    const at = match.index ?? 0;
    if (at > last) parts.push({ kind: "text", text: text.slice(last, at) });
    parts.push({ kind: match[1] === "_" ? "sub" : "sup", text: match[2] });
    last = at + match[0].length;
  }
  if (last < text.length) parts.push({ kind: "text", text: text.slice(last) });
  return parts;
}

/** An equation line is its formula, then after a wide gap (five spaces or more) what it means. */
export function equationParts(line: string): { formula: string; gloss: string | null } {
  const [formula, ...rest] = line.split(/ {5,}/);
  return { formula: formula.trim(), gloss: rest.length ? rest.join(" ").trim() : null };
}
