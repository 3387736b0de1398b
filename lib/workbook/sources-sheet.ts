import type ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import type { EvidenceIndex } from "@/lib/evidence/subjects";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { typedValueFigures } from "@/lib/results/value-reliance";
import { currencyFormat, styleHeader, styleTitle } from "./formats";
import { safeText } from "./safe-text";
import { upperFirst } from "@/lib/words";

/**
 * Every figure typed for the case that the value rests on, most value first, beside its recorded
 * source (a note, who gave it, when) or "No source recorded": what the screens list under "Typed
 * figures and their sources" (components/results/evidence-sources.tsx), all of them, for the
 * finance reviewer who works from the file. The value is the engineering estimate's first year,
 * before escalation, of the parts the figure is multiplied into. Returns how many lack a source.
 */
export function writeSourcesSheet(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  evidence: { caseId: number; index: EvidenceIndex },
): number {
  sheet.columns = [{ width: 60 }, { width: 20 }, { width: 70 }, { width: 30 }, { width: 14 }];
  const figures = result.scenarios.physics.bySource
    ? typedValueFigures(result, input, evidence.caseId)
    : [];
  const missing = figures.filter((f) => evidence.index[f.key] === undefined).length;
  const title = sheet.getCell("A1");
  title.value = "Typed figures the value rests on, and where each comes from";
  styleTitle(title);
  sheet.getCell("A2").value =
    figures.length === 0
      ? "No typed figure carries value in this case."
      : missing === 0
        ? "Every typed figure the value rests on has a recorded source."
        : `${missing} of ${figures.length} typed figures the value rests on have no recorded source.`;
  styleHeader(
    sheet.addRow([
      "Typed figure",
      `Value a year resting on it (${SCENARIO_LABELS.physics.toLowerCase()}, ${input.currency})`,
      "Source",
      "Given by",
      "Given on",
    ]),
  );
  const money = currencyFormat(input.currency);
  for (const f of figures) {
    const entry = evidence.index[f.key];
    const row = sheet.addRow([
      safeText(upperFirst(f.words)),
      Number(f.valuePerYear),
      entry ? safeText(entry.note) : "No source recorded",
      entry ? safeText(entry.givenBy) : null,
      entry ? entry.givenOn : null,
    ]);
    row.getCell(2).numFmt = money;
    row.alignment = { wrapText: true, vertical: "top" };
  }
  return missing;
}
