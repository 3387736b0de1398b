import ExcelJS from "exceljs";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import {
  caseInputSchema,
  evaluateParsedCase,
  type CaseResult,
  type ParsedCase,
} from "@/lib/engine";
import { buildProposalWorkbook, type WorkbookMeta } from "@/lib/workbook";

/** A workbook of a case as the app would send it, built and read back with exceljs. */
export interface BuiltWorkbook {
  input: ParsedCase;
  result: CaseResult;
  xlsx: Buffer;
  workbook: ExcelJS.Workbook;
}

export const META: WorkbookMeta = {
  title: "Invented packaging plant — retrofit proposal & review",
  accountName: "Invented packaging plant",
  siteName: "Hall 2",
  caseName: "Cartoner line",
  version: 3,
  engineVersion: "1.0.0",
  generatedAt: "2025-01-15T09:30:00.000Z",
};

export async function buildWorkbookOf(raw: unknown = fixtureCase): Promise<BuiltWorkbook> {
  const input = caseInputSchema.parse(raw);
  const result = evaluateParsedCase(input);
  const xlsx = await buildProposalWorkbook(input, result, {
    ...META,
    engineVersion: result.engineVersion,
  });
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(xlsx as unknown as ArrayBuffer);
  return { input, result, xlsx, workbook };
}

export function sheetOf(workbook: ExcelJS.Workbook, name: string): ExcelJS.Worksheet {
  const sheet = workbook.getWorksheet(name);
  if (!sheet) throw new Error(`no sheet "${name}"`);
  return sheet;
}

/** The formula of a cell, or throws: the tests use it where a typed number would be a bug. */
export function formulaOf(cell: ExcelJS.Cell): string {
  if (cell.type !== ExcelJS.ValueType.Formula)
    throw new Error(`${cell.address} holds no formula but ${JSON.stringify(cell.value)}`);
  return cell.formula;
}
