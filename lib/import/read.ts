import type { Readable } from "node:stream";
import ExcelJS from "exceljs";
import { parseCsv } from "./csv";
import { ImportFileError } from "./errors";
import { assertSafeZip, openPart, type ZipEntry } from "./zip-guard";

/** Data rows a sheet may hold (rows with any non-blank cell, the header not counted). */
export const MAX_DATA_ROWS = 20_000;

export interface SheetData {
  name: string;
  /** Row 1, trimmed; "" for an empty header cell. */
  headers: string[];
  /** Cell text of rows 2, 3, …: rows[i] is spreadsheet row i + 2; blank rows are kept, as []. */
  rows: string[][];
}

export interface WorkbookData {
  kind: "xlsx" | "csv";
  sheets: SheetData[];
}

const WHAT_TO_UPLOAD =
  "upload the installed base as an Excel workbook (.xlsx) or as a CSV file saved as CSV UTF-8";

const notASpreadsheet = (fileName: string, what: string) =>
  new ImportFileError(
    415,
    `"${fileName}" is not an .xlsx workbook or a CSV file (it is ${what}); ${WHAT_TO_UPLOAD}`,
  );

const startsWith = (bytes: Uint8Array, magic: readonly number[]) =>
  bytes.length >= magic.length && magic.every((b, i) => bytes[i] === b);

// File signatures: PKWARE APPNOTE 4.3.7 (zip local header "PK\x03\x04", empty zip "PK\x05\x06");
// [MS-CFB] 2.2 (compound file, used by .xls and by password-protected .xlsx); ISO 32000-1 7.5.2
// (%PDF-); PNG spec 5.2 (signature); JPEG/JFIF (SOI marker FF D8 FF). Others fall to the text test.
const ZIP = [0x50, 0x4b, 0x03, 0x04];
const EMPTY_ZIP = [0x50, 0x4b, 0x05, 0x06];
const COMPOUND_FILE = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];
const KNOWN_OTHERS: readonly [readonly number[], string][] = [
  [[0x25, 0x50, 0x44, 0x46, 0x2d], "a PDF document"],
  [[0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], "a PNG image"],
  [[0xff, 0xd8, 0xff], "a JPEG image"],
];

/**
 * The sheets of an .xlsx or .csv file, told apart by content, never by name: a zip is read as a
 * workbook (after the zip guard), UTF-8 text as CSV, anything else is refused with 415.
 * `fileName` names the file in messages and the CSV's one sheet.
 */
export async function readWorkbook(
  buffer: Buffer | Uint8Array,
  fileName: string,
): Promise<WorkbookData> {
  const bytes: Uint8Array = buffer;
  if (bytes.length === 0) {
    throw new ImportFileError(
      422,
      `"${fileName}" is empty; ${WHAT_TO_UPLOAD}, with a header row and one row per axis`,
    );
  }
  if (startsWith(bytes, ZIP)) return { kind: "xlsx", sheets: await readXlsx(bytes, fileName) };
  if (startsWith(bytes, EMPTY_ZIP)) throw notASpreadsheet(fileName, "an empty zip archive");
  if (startsWith(bytes, COMPOUND_FILE)) {
    throw new ImportFileError(
      415,
      `"${fileName}" is an old-format .xls workbook or a password-protected one; save it from Excel as .xlsx without a password, or as CSV UTF-8, and upload that`,
    );
  }
  for (const [magic, what] of KNOWN_OTHERS)
    if (startsWith(bytes, magic)) throw notASpreadsheet(fileName, what);
  return { kind: "csv", sheets: [readCsv(bytes, fileName)] };
}

function decodeText(bytes: Uint8Array, fileName: string): string {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw notASpreadsheet(
      fileName,
      "neither a workbook nor UTF-8 text: a binary file, or a CSV saved in another encoding",
    );
  }
  // Control characters other than tab, LF and CR do not occur in CSV text; NUL marks a binary file.
  if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/.test(text)) {
    throw notASpreadsheet(fileName, "a binary file");
  }
  return text;
}

function readCsv(bytes: Uint8Array, fileName: string): SheetData {
  const records = parseCsv(decodeText(bytes, fileName), fileName);
  const [header = [], ...rows] = records;
  while (rows.length > 0 && isBlank(rows[rows.length - 1])) rows.pop();
  const name = fileName.replace(/^.*[\\/]/, "").replace(/\.[^.]*$/, "") || "CSV";
  const sheet = { name, headers: header.map((h) => h.trim()), rows };
  checkRowCount(sheet, fileName, "csv");
  return sheet;
}

const isBlank = (row: readonly string[]) => row.every((cell) => cell.trim() === "");

function checkRowCount(sheet: SheetData, fileName: string, kind: WorkbookData["kind"]): void {
  let count = 0;
  for (const row of sheet.rows) if (!isBlank(row)) count++;
  if (count > MAX_DATA_ROWS) {
    const where = kind === "csv" ? `"${fileName}"` : `Sheet "${sheet.name}" of "${fileName}"`;
    throw new ImportFileError(
      422,
      `${where} has ${count.toLocaleString("en-US")} rows; the limit is ${MAX_DATA_ROWS.toLocaleString("en-US")} — split the file`,
    );
  }
}

async function readXlsx(bytes: Uint8Array, fileName: string): Promise<SheetData[]> {
  const entries = await assertSafeZip(bytes, fileName);
  if (!entries.some((e) => partName(e) === "xl/workbook.xml")) {
    throw notASpreadsheet(
      fileName,
      "a zip archive without a workbook inside (a document or another archive)",
    );
  }
  // Streamed, not loaded: exceljs's WorkbookReader hands over one row at a time, so a sheet over
  // the row cap or the text cap is refused at the row that crosses it, before the rest of the
  // file is unpacked or parsed (a full load of a 200 MB workbook took seconds and ~750 MB).
  // exceljs reads cell values and formulas only: it runs no macros (vbaProject.bin is not
  // parsed) and fetches nothing an external link points to.
  const reader = new CappedWorkbookReader(bytes, entries, fileName);
  const sheets: SheetData[] = [];
  try {
    for await (const worksheet of reader)
      sheets.push(await readWorksheetStream(worksheet, fileName));
  } catch (error) {
    if (error instanceof ImportFileError) throw error;
    throw new ImportFileError(
      422,
      `"${fileName}" looks like an Excel workbook but cannot be read; open it in Excel, save it again as .xlsx and upload that`,
    );
  }
  return sheets;
}

/**
 * Limits on the unpacked XML handed to the sheet reader, checked as it streams. The shared
 * strings part is held whole (cells refer to its strings by index), so it has its own, smaller
 * caps: 20,000 rows of every import column as distinct texts stay well inside both.
 */
export const XML_LIMITS = {
  maxSharedStringsBytes: 32_000_000,
  maxSharedStrings: 1_000_000,
  maxWorksheetBytes: 100_000_000,
} as const;

const partName = (entry: ZipEntry) => entry.name.replace(/^\//, "");
const WORKSHEET = /^xl\/worksheets\/sheet(\d+)\.xml$/;
const millions = (n: number) => `${(n / 1_000_000).toLocaleString("en-US")} million`;
const megabytes = (n: number) => `${Math.round(n / 1_000_000)} MB`;

// The parts of exceljs's streaming reader that it runs for each zip part (not in its typings).
interface ReaderInternals {
  sharedStrings?: unknown[];
  _parseRels(entry: Readable): Promise<void>;
  _parseWorkbook(entry: Readable): Promise<void>;
  _parseStyles(entry: Readable): Promise<void>;
  _parseSharedStrings(entry: Readable): AsyncGenerator<unknown>;
  _parseWorksheet(iterator: Readable, sheetNo: string): Generator<unknown>;
}

/**
 * exceljs's streaming reader, fed from the zip directory the guard has checked instead of its
 * own pass over the local headers. Its own pass meets the parts in the order they were zipped;
 * Excel zips the sheets before the shared strings, so it copied every sheet whole to a temporary
 * file before reading a row. Here the shared strings come first, then each sheet straight from
 * the inflater, and every part streams through a running byte count that stops it at its cap.
 */
class CappedWorkbookReader extends ExcelJS.stream.xlsx.WorkbookReader {
  constructor(
    private readonly bytes: Uint8Array,
    private readonly entries: readonly ZipEntry[],
    private readonly fileName: string,
  ) {
    super(null as unknown as Readable, {
      sharedStrings: "cache",
      styles: "cache",
      hyperlinks: "ignore",
      worksheets: "emit",
      entries: "ignore",
    });
  }

  private open(name: string, cap?: Parameters<typeof openPart>[3]): Readable | null {
    const entry = this.entries.find((e) => partName(e) === name);
    return entry ? openPart(this.bytes, entry, this.fileName, cap) : null;
  }

  async *parse(): AsyncGenerator<{ eventType: string; value: unknown }> {
    const self = this as unknown as ReaderInternals;
    const { fileName } = this;
    const rels = this.open("xl/_rels/workbook.xml.rels");
    if (rels) await self._parseRels(rels);
    const workbook = this.open("xl/workbook.xml");
    if (workbook) await self._parseWorkbook(workbook);
    const styles = this.open("xl/styles.xml");
    if (styles) await self._parseStyles(styles);

    const stringsCapError = () =>
      new ImportFileError(
        413,
        `"${fileName}" holds more than ${megabytes(XML_LIMITS.maxSharedStringsBytes)} of shared text (xl/sharedStrings.xml); the limit is ${megabytes(XML_LIMITS.maxSharedStringsBytes)} — remove long texts and unused sheets, or split the file`,
      );
    // The strings are cached as they stream: their bytes are capped, and their number is checked
    // at every chunk.
    const strings = this.open("xl/sharedStrings.xml", {
      bytes: XML_LIMITS.maxSharedStringsBytes,
      error: stringsCapError,
      check: () =>
        (self.sharedStrings?.length ?? 0) > XML_LIMITS.maxSharedStrings
          ? new ImportFileError(
              413,
              `"${fileName}" holds more than ${millions(XML_LIMITS.maxSharedStrings)} distinct texts (xl/sharedStrings.xml); the limit is ${millions(XML_LIMITS.maxSharedStrings)} — remove unused sheets, or split the file`,
            )
          : null,
    });
    if (strings) {
      for await (const event of self._parseSharedStrings(strings)) void event;
    }

    for (const entry of this.entries) {
      const match = WORKSHEET.exec(partName(entry));
      if (!match) continue;
      const sheet = openPart(this.bytes, entry, fileName, {
        bytes: XML_LIMITS.maxWorksheetBytes,
        error: () =>
          new ImportFileError(
            413,
            `A sheet of "${fileName}" (${partName(entry)}) unpacks to more than ${megabytes(XML_LIMITS.maxWorksheetBytes)}; the limit is ${megabytes(XML_LIMITS.maxWorksheetBytes)} — remove unused columns and formatting, or split the file`,
          ),
      });
      try {
        yield* self._parseWorksheet(sheet, match[1]!) as Generator<{
          eventType: string;
          value: unknown;
        }>;
      } finally {
        // A sheet left unread (a refusal at its row cap) stops inflating at once.
        sheet.destroy();
      }
    }
  }
}

/** Text a sheet's cells may hold in all: 20,000 rows of every import column is some 10 MB. */
export const MAX_SHEET_TEXT_CHARS = 50_000_000;

const NO_CELLS: string[] = [];

async function readWorksheetStream(
  worksheet: ExcelJS.stream.xlsx.WorksheetReader,
  fileName: string,
): Promise<SheetData> {
  const name = (worksheet as unknown as { name: string }).name;
  const headers: string[] = [];
  const rows: string[][] = [];
  let dataRows = 0;
  let chars = 0;
  for await (const row of worksheet as unknown as AsyncIterable<ExcelJS.Row>) {
    const cells: string[] = [];
    row.eachCell({ includeEmpty: false }, (cell, column) => {
      const text = cellText(cell);
      chars += text.length;
      cells[column - 1] = text;
    });
    if (chars > MAX_SHEET_TEXT_CHARS) {
      throw new ImportFileError(
        413,
        `Sheet "${name}" of "${fileName}" holds more than ${(MAX_SHEET_TEXT_CHARS / 1_000_000).toLocaleString("en-US")} million characters of text; the limit is that — remove long texts or split the file`,
      );
    }
    for (let c = 0; c < cells.length; c++) if (cells[c] === undefined) cells[c] = "";
    if (row.number === 1) {
      headers.push(...cells.map((h) => h.trim()));
      continue;
    }
    if (!isBlank(cells) && ++dataRows > MAX_DATA_ROWS) {
      throw new ImportFileError(
        422,
        `Sheet "${name}" of "${fileName}" has more than ${MAX_DATA_ROWS.toLocaleString("en-US")} rows; the limit is ${MAX_DATA_ROWS.toLocaleString("en-US")} — split the file`,
      );
    }
    while (rows.length < row.number - 2) rows.push(NO_CELLS);
    rows.push(cells);
  }
  while (rows.length > 0 && isBlank(rows[rows.length - 1])) rows.pop();
  return { name, headers, rows };
}

/**
 * The text a cell shows, without evaluating anything: a formula reads as "=" and its text, so
 * that it fails number validation with a message instead of importing a cached result.
 */
export function cellText(cell: ExcelJS.Cell): string {
  const value = cell.value;
  if (value === null || value === undefined) return "";
  if (typeof value === "string") return value;
  if (typeof value === "number") return String(value);
  if (typeof value === "boolean") return value ? "TRUE" : "FALSE";
  if (value instanceof Date) return dateText(value);
  // exceljs's streaming reader gives the other cells of a shared formula an empty formula (it
  // drops the shared index): they read as "=", still a formula, never the cached result.
  if ("formula" in value || "sharedFormula" in value) {
    const formula = "formula" in value ? value.formula : value.sharedFormula;
    return `=${formula ?? ""}`;
  }
  if ("richText" in value) return value.richText.map((part) => part.text).join("");
  if ("hyperlink" in value) {
    const text: unknown = value.text;
    if (typeof text === "string") return text;
    if (typeof text === "object" && text !== null && "richText" in text) {
      return (text as ExcelJS.CellRichTextValue).richText.map((part) => part.text).join("");
    }
    return "";
  }
  if ("error" in value) return String(value.error);
  return cell.text;
}

/** A date cell as ISO 8601: the date alone at midnight, else date and time (UTC, as exceljs reads it). */
function dateText(date: Date): string {
  if (Number.isNaN(date.getTime())) return "";
  const iso = date.toISOString();
  return iso.endsWith("T00:00:00.000Z") ? iso.slice(0, 10) : iso.replace(/\.000Z$/, "Z");
}
