import { PassThrough } from "node:stream";
import ExcelJS from "exceljs";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { writeAssumptionsSheet } from "./assumptions-sheet";
import { writeAxesSheet } from "./axes-sheet";
import { writeCashFlowSheet } from "./cash-flow-sheet";
import { writeCautionsSheet } from "./cautions-sheet";
import { sheetOptions } from "./formats";
import { FROZEN, SHEET } from "./layout";
import { headerFooterText } from "./safe-text";
import { writeSummarySheet } from "./summary-sheet";
import { writeSourcesSheet } from "./sources-sheet";
import { SOURCES_SHEET } from "@/lib/glossary";
import type { WorkbookMeta } from "./types";

/**
 * The proposal workbook (issue 5): Summary, Axes, Cash flow, Assumptions and Cautions, with live
 * formulas that reproduce the engine's figures from the inputs written beside them. Every
 * formula cell carries the engine's value as its cached result, for viewers that do not
 * calculate; spreadsheets recalculate dependants as soon as an input changes.
 */
export async function buildProposalWorkbook(
  input: ParsedCase,
  result: CaseResult,
  meta: WorkbookMeta,
): Promise<Buffer> {
  return streamWorkbook(meta, (workbook) => writeProposalSheets(workbook, input, result, meta));
}

export type SheetWriter = ExcelJS.stream.xlsx.WorkbookWriter;

/**
 * exceljs's streaming writer: rows are serialised as they are added, so a 2,000-axis case never
 * holds the whole sheet model in memory (issue 5: < 3 s, < 300 MB). `fill` adds the sheets.
 */
export async function streamWorkbook(
  meta: WorkbookMeta,
  fill: (workbook: SheetWriter) => void | Promise<void>,
): Promise<Buffer> {
  const chunks: Buffer[] = [];
  const stream = new PassThrough();
  stream.on("data", (chunk: Buffer) => chunks.push(chunk));
  const generated = new Date(meta.generatedAt);
  const when = Number.isNaN(generated.getTime()) ? new Date() : generated;
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({
    stream,
    useStyles: true,
    useSharedStrings: true,
    // Deflate level 1: at the default level, compression is most of a large workbook's write time.
    zip: { zlib: { level: 1 } },
    created: when,
    modified: when,
    creator: "Loopshift",
    lastModifiedBy: "Loopshift",
  } as Partial<ExcelJS.stream.xlsx.WorkbookStreamWriterOptions>);
  workbook.title = meta.title;
  workbook.subject = `${meta.accountName} — ${meta.siteName} — ${meta.caseName}`;
  await fill(workbook);

  const finished = new Promise<void>((resolve, reject) => {
    stream.on("end", resolve);
    stream.on("error", reject);
  });
  await workbook.commit();
  await finished;
  return Buffer.concat(chunks);
}

/** The footer every sheet prints: the title and the page number. */
export const footerOf = (meta: WorkbookMeta) => `&L${headerFooterText(meta.title)}&RPage &P of &N`;

/** The five sheets of the proposal workbook, in reading order, filled in dependency order. */
export function writeProposalSheets(
  workbook: SheetWriter,
  input: ParsedCase,
  result: CaseResult,
  meta: WorkbookMeta,
): void {
  const footer = footerOf(meta);
  const add = (name: (typeof SHEET)[keyof typeof SHEET]) => {
    const sheet = workbook.addWorksheet(
      name,
      sheetOptions(FROZEN[name].rows, FROZEN[name].columns),
    );
    sheet.headerFooter = { ...sheet.headerFooter, oddFooter: footer };
    return sheet;
  };
  const summary = add(SHEET.summary);
  const axes = add(SHEET.axes);
  const cashFlow = add(SHEET.cashFlow);
  const assumptions = add(SHEET.assumptions);
  const cautions = add(SHEET.cautions);

  const machineRanges = writeAssumptionsSheet(workbook, assumptions, input, result);
  const axesRanges = writeAxesSheet(axes, input, result);
  writeCashFlowSheet(workbook, cashFlow, input, result, axesRanges, machineRanges);
  writeSummarySheet(summary, input, result, meta, { axes: axesRanges, machines: machineRanges });
  writeCautionsSheet(cautions, input, result);
  if (meta.evidence) {
    const sources = workbook.addWorksheet(SOURCES_SHEET, sheetOptions(3, 0));
    sources.headerFooter = { ...sources.headerFooter, oddFooter: footer };
    writeSourcesSheet(sources, input, result, meta.evidence);
  }
}
