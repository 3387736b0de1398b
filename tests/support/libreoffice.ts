import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { inflateRawSync } from "node:zlib";
import ExcelJS from "exceljs";

/**
 * LibreOffice Calc, headless, standing in for the spreadsheet a finance reviewer opens (see
 * docs/model.md, Sources of the check values): once Calc has recomputed each formula of the
 * exported workbook, the figures it shows have to match the engine's. Calc keeps the values
 * cached beside formulas in an .xlsx instead of computing them, so the workbook goes to it with
 * every cached formula value removed.
 */

export const INSTALL_HINT =
  "LibreOffice Calc is needed to recalculate the exported workbook: run `apt-get install -y libreoffice-calc` (Debian) and run the tests again.";

export function sofficeVersion(): string {
  const run = spawnSync("soffice", ["--version"], { encoding: "utf8", timeout: 60_000 });
  if (run.error || run.status !== 0)
    throw new Error(`${INSTALL_HINT} (soffice: ${run.error?.message ?? run.stderr})`);
  return run.stdout.trim();
}

/** Re-writes every formula cell without its cached result: exceljs writes `<v>` only for a result. */
export async function withoutCachedFormulaValues(xlsx: Buffer): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(xlsx as unknown as ArrayBuffer);
  workbook.eachSheet((sheet) => {
    sheet.eachRow({ includeEmpty: false }, (row) => {
      row.eachCell({ includeEmpty: false }, (cell) => {
        if (cell.type === ExcelJS.ValueType.Formula)
          cell.value = { formula: cell.formula } as ExcelJS.CellFormulaValue;
      });
    });
  });
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

/**
 * Opens the workbook in LibreOffice Calc and saves it again as .xlsx: the formulas without a
 * cached value are calculated on the way. A fresh user profile per run keeps runs independent
 * of any other LibreOffice on the machine.
 */
export function recalculateWithLibreOffice(xlsx: Buffer): Buffer {
  sofficeVersion();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-calc-"));
  try {
    const source = path.join(dir, "workbook.xlsx");
    const out = path.join(dir, "out");
    fs.writeFileSync(source, xlsx);
    const run = spawnSync(
      "soffice",
      [
        `-env:UserInstallation=file://${path.join(dir, "profile")}`,
        "--headless",
        "--norestore",
        "--convert-to",
        "xlsx:Calc MS Excel 2007 XML",
        "--outdir",
        out,
        source,
      ],
      { encoding: "utf8", timeout: 180_000 },
    );
    const converted = path.join(out, "workbook.xlsx");
    if (run.status !== 0 || !fs.existsSync(converted))
      throw new Error(
        `LibreOffice did not convert the workbook: ${run.stdout} ${run.stderr} ${run.error?.message ?? ""}`,
      );
    return fs.readFileSync(converted);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

/** The value of a workbook-level defined name that points at one cell: its formula's result, or its value. */
export function definedNameValue(workbook: ExcelJS.Workbook, name: string): unknown {
  const { sheet, address } = definedNameTarget(workbook, name);
  const cell = workbook.getWorksheet(sheet)?.getCell(address);
  if (!cell) throw new Error(`no sheet "${sheet}" for the name ${name}`);
  return cell.type === ExcelJS.ValueType.Formula ? cell.result : cell.value;
}

export function definedNameTarget(
  workbook: ExcelJS.Workbook,
  name: string,
): { sheet: string; address: string } {
  const ranges = workbook.definedNames.getRanges(name).ranges;
  if (ranges.length !== 1) throw new Error(`the name ${name} points at ${ranges.length} ranges`);
  const match = /^'?(.*?)'?!\$?([A-Z]+)\$?(\d+)$/.exec(ranges[0]);
  if (!match) throw new Error(`the name ${name} points at ${ranges[0]}, not one cell`);
  return { sheet: match[1].replace(/''/g, "'"), address: `${match[2]}${match[3]}` };
}

/** One part of an .xlsx (a zip file) as text, read with node:zlib: e.g. "xl/worksheets/sheet3.xml". */
export function xlsxPart(xlsx: Buffer, part: string): string {
  const parts = xlsxParts(xlsx);
  const text = parts.get(part);
  if (text === undefined)
    throw new Error(`no part ${part} in the workbook (has ${[...parts.keys()].join(", ")})`);
  return text;
}

export function xlsxParts(xlsx: Buffer): Map<string, string> {
  // The end-of-central-directory record (PKWARE APPNOTE 4.3.16) sits in the last 64 KiB + 22 bytes.
  let end = -1;
  for (let i = xlsx.length - 22; i >= Math.max(0, xlsx.length - 65_557); i--) {
    if (xlsx.readUInt32LE(i) === 0x06054b50) {
      end = i;
      break;
    }
  }
  if (end < 0) throw new Error("not a zip file");
  const count = xlsx.readUInt16LE(end + 10);
  let at = xlsx.readUInt32LE(end + 16);
  const parts = new Map<string, string>();
  for (let n = 0; n < count; n++) {
    if (xlsx.readUInt32LE(at) !== 0x02014b50) throw new Error("bad central directory");
    const method = xlsx.readUInt16LE(at + 10);
    const size = xlsx.readUInt32LE(at + 20);
    const nameLength = xlsx.readUInt16LE(at + 28);
    const extraLength = xlsx.readUInt16LE(at + 30);
    const commentLength = xlsx.readUInt16LE(at + 32);
    const local = xlsx.readUInt32LE(at + 42);
    const name = xlsx.toString("utf8", at + 46, at + 46 + nameLength);
    const dataStart = local + 30 + xlsx.readUInt16LE(local + 26) + xlsx.readUInt16LE(local + 28);
    const data = xlsx.subarray(dataStart, dataStart + size);
    parts.set(name, (method === 8 ? inflateRawSync(data) : data).toString("utf8"));
    at += 46 + nameLength + extraLength + commentLength;
  }
  return parts;
}

/** Formula cells of a sheet part that still carry a cached value (`<f>…</f><v>…</v>`). */
export function cachedFormulaValues(sheetXml: string): string[] {
  const cells = sheetXml.matchAll(/<c\b[^>]*?(?<!\/)>((?:(?!<\/c>).)*)<\/c>/gs);
  return [...cells].filter((m) => /<f[ >]/.test(m[1]) && /<v>/.test(m[1])).map((m) => m[0]);
}
