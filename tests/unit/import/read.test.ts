import ExcelJS from "exceljs";
import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import { deflateRawSync } from "node:zlib";
import { afterEach, describe, expect, it, vi } from "vitest";
import { parseCsv, detectDelimiter } from "@/lib/import/csv";
import { ImportFileError } from "@/lib/import/errors";
import { MAX_DATA_ROWS, readWorkbook } from "@/lib/import/read";
import { ZIP_LIMITS } from "@/lib/import/zip-guard";

const fixture = (name: string) => readFileSync(`tests/fixtures/import/${name}`);

async function refusal(promise: Promise<unknown>): Promise<ImportFileError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ImportFileError) return error;
    throw error;
  }
  throw new Error("expected an ImportFileError");
}

// CRC-32 (ISO 3309 polynomial 0xEDB88320, as zip uses it, PKWARE APPNOTE §4.4.7).
const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** A zip of deflated entries, its directory claiming `declaredSize` where given (APPNOTE §4.3). */
function buildZip(entries: { name: string; data: Uint8Array; declaredSize?: number }[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const entry of entries) {
    const name = Buffer.from(entry.name, "utf8");
    const packed = deflateRawSync(entry.data);
    const size = entry.declaredSize ?? entry.data.length;
    const crc = crc32(entry.data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(size, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(packed.length, 20);
    central.writeUInt32LE(size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, packed);
    centrals.push(central, name);
    offset += 30 + name.length + packed.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

const workbookXml = Buffer.from('<?xml version="1.0"?><workbook/>');

/** Spies on exceljs's xlsx reader, to tell whether a file got as far as being unpacked by it. */
// The import streams the workbook (ExcelJS.stream.xlsx.WorkbookReader, issue 13); its parse
// is where exceljs starts to unpack.
// exceljs starts a workbook by reading its workbook part: not called means nothing was unpacked
// for it (the zip guard refused the file first).
function spyOnXlsxLoad() {
  const proto = ExcelJS.stream.xlsx.WorkbookReader.prototype as unknown as {
    _parseWorkbook: (...a: unknown[]) => unknown;
  };
  return vi.spyOn(proto, "_parseWorkbook");
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe("CSV text (RFC 4180)", () => {
  it("reads quoted fields with delimiters, doubled quotes and line breaks; CRLF, LF and CR", () => {
    const text = 'a,b,c\r\n"x, y","say ""hi""","two\r\nlines"\nlast,,\rend';
    expect(parseCsv(text)).toEqual([
      ["a", "b", "c"],
      ["x, y", 'say "hi"', "two\r\nlines"],
      ["last", "", ""],
      ["end"],
    ]);
  });

  it("drops a BOM and detects ; from the header line even when values hold decimal commas", () => {
    expect(parseCsv("\uFEFFMachine;Holding torque [N·m]\r\nPress 1;1,26\r\n")).toEqual([
      ["Machine", "Holding torque [N·m]"],
      ["Press 1", "1,26"],
    ]);
    expect(detectDelimiter('"a;b",c,d\n1;2;3;4')).toBe(",");
    expect(detectDelimiter("a\tb\tc\n")).toBe("\t");
  });

  it("obeys Excel's sep= line, which is not a row", () => {
    expect(parseCsv("sep=;\r\na,b;c\r\n")).toEqual([["a,b", "c"]]);
  });

  it("keeps blank lines as records, so that row numbers match what a spreadsheet shows", async () => {
    const { sheets } = await readWorkbook(
      Buffer.from("h1,h2\n1,2\n\n3,4\n\n\n"),
      "blank-lines.csv",
    );
    expect(sheets).toEqual([
      { name: "blank-lines", headers: ["h1", "h2"], rows: [["1", "2"], [""], ["3", "4"]] },
    ]);
  });

  it("refuses a quote that is never closed, naming the row (422)", async () => {
    const error = await refusal(
      readWorkbook(Buffer.from('a,b\n1,2\n3,"four\n5,6\n'), "open-quote.csv"),
    );
    expect(error.status).toBe(422);
    expect(error.message).toBe(
      'row 3 of "open-quote.csv" opens a quote (") at character 3 that is never closed; close it or remove it, then upload again',
    );
  });

  it("keeps text that starts with = + - @ as text; a plain signed number stays a number's text", async () => {
    const { sheets } = await readWorkbook(
      Buffer.from('a,b,c,d\n=1+2,-5,+7,@SUM(A1)\n"=HYPERLINK(""x"")",,,\n'),
      "f.csv",
    );
    expect(sheets[0].rows).toEqual([
      ["=1+2", "-5", "+7", "@SUM(A1)"],
      ['=HYPERLINK("x")', "", "", ""],
    ]);
  });
});

describe("content sniffing: not a spreadsheet → 415", () => {
  it("refuses a PNG image whatever its name", async () => {
    const error = await refusal(readWorkbook(fixture("not-a-sheet.png"), "installed-base.xlsx"));
    expect(error.status).toBe(415);
    expect(error.message).toBe(
      '"installed-base.xlsx" is not an .xlsx workbook or a CSV file (it is a PNG image); upload the installed base as an Excel workbook (.xlsx) or as a CSV file saved as CSV UTF-8',
    );
  });

  it("refuses a PDF, an old .xls (compound file), text in another encoding and a zip without a workbook", async () => {
    const pdf = Buffer.from("%PDF-1.7\n1 0 obj << >> endobj\n");
    const xls = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0, 0, 0]);
    const latin1 = Buffer.from("Machine,Ambient temperature [\xb0C]\n", "latin1");
    const utf16 = Buffer.from("\ufeffMachine,Axis\n", "utf16le");
    const docx = buildZip([{ name: "word/document.xml", data: Buffer.from("<w:document/>") }]);
    for (const [bytes, expected] of [
      [pdf, /\(it is a PDF document\)/],
      [xls, /old-format \.xls workbook or a password-protected one; save it from Excel as \.xlsx/],
      [latin1, /a CSV saved in another encoding/],
      [utf16, /\(it is a binary file\)|another encoding/],
      [docx, /a zip archive without a workbook inside/],
    ] as const) {
      const error = await refusal(readWorkbook(bytes, "upload.bin"));
      expect(error.status).toBe(415);
      expect(error.message).toMatch(expected);
    }
  });

  it("takes UTF-8 text as CSV and a zip as a workbook, regardless of the file name", async () => {
    expect((await readWorkbook(fixture("clean.csv"), "clean.xlsx")).kind).toBe("csv");
    expect((await readWorkbook(fixture("clean.xlsx"), "clean.csv")).kind).toBe("xlsx");
  });

  it("refuses an empty file with 422", async () => {
    const error = await refusal(readWorkbook(Buffer.alloc(0), "empty.csv"));
    expect(error.status).toBe(422);
    expect(error.message).toMatch(/^"empty\.csv" is empty; upload/);
  });
});

describe("row limit: more than 20,000 data rows → 422", () => {
  const csvOf = (rows: number) =>
    Buffer.from(
      ["Machine,Axis label", ...Array.from({ length: rows }, (_, i) => `M,${i}`)].join("\n"),
    );

  it("accepts exactly 20,000 rows", async () => {
    const { sheets } = await readWorkbook(csvOf(MAX_DATA_ROWS), "limit.csv");
    expect(sheets[0].rows).toHaveLength(20_000);
  });

  it("refuses 20,001 rows of a CSV with the count and what to do", async () => {
    const error = await refusal(readWorkbook(csvOf(MAX_DATA_ROWS + 1), "big.csv"));
    expect(error.status).toBe(422);
    expect(error.message).toBe('"big.csv" has 20,001 rows; the limit is 20,000 — split the file');
  });

  it("refuses 20,001 rows on a sheet of a workbook, naming the sheet", async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet("Line 4");
    sheet.addRow(["Machine", "Axis label"]);
    for (let i = 0; i < MAX_DATA_ROWS + 1; i++) sheet.addRow(["M", i]);
    const bytes = Buffer.from((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
    const error = await refusal(readWorkbook(bytes, "big.xlsx"));
    expect(error.status).toBe(422);
    expect(error.message).toBe(
      // Streamed: the read stops at the row that crosses the cap (issue 13), so no full count.
      'Sheet "Line 4" of "big.xlsx" has more than 20,000 rows; the limit is 20,000 — split the file',
    );
  });
});

describe("zip guard: refused before exceljs unpacks anything", () => {
  it("refuses a directory that claims more than 200 MB in total (413)", async () => {
    const load = spyOnXlsxLoad();
    const bomb = buildZip([
      { name: "xl/workbook.xml", data: workbookXml },
      { name: "xl/worksheets/sheet1.xml", data: Buffer.alloc(1000), declaredSize: 150_000_000 },
      { name: "xl/worksheets/sheet2.xml", data: Buffer.alloc(1000), declaredSize: 150_000_000 },
    ]);
    const error = await refusal(readWorkbook(bomb, "bomb.xlsx"));
    expect(error.status).toBe(413);
    expect(error.message).toMatch(
      /^"bomb\.xlsx" unpacks one part \d+ times larger than it is packed/,
    );
    expect(load).not.toHaveBeenCalled();
  });

  it("refuses a total over the limit even when no single part has an absurd ratio (413)", async () => {
    const load = spyOnXlsxLoad();
    // 41 parts declared at 5 MB each from 26 kB of random bytes, which do not compress:
    // each ratio is about 192:1, under the 200:1 limit, and the total is 205 MB.
    const noise = randomBytes(26_000);
    const parts = Array.from({ length: 41 }, (_, i) => ({
      name: `xl/media/image${i}.bin`,
      data: noise,
      declaredSize: 5_000_000,
    }));
    const error = await refusal(
      readWorkbook(
        buildZip([{ name: "xl/workbook.xml", data: workbookXml }, ...parts]),
        "big.xlsx",
      ),
    );
    expect(error.status).toBe(413);
    expect(error.message).toBe(
      `"big.xlsx" unpacks to 205 MB; the limit is ${ZIP_LIMITS.maxTotalUncompressedBytes / 1_000_000} MB — remove pictures and other sheets, or split the file`,
    );
    expect(load).not.toHaveBeenCalled();
  });

  it("refuses a part that unpacks to more than its directory declares (413)", async () => {
    const load = spyOnXlsxLoad();
    const liar = buildZip([
      { name: "xl/workbook.xml", data: workbookXml },
      { name: "xl/worksheets/sheet1.xml", data: Buffer.alloc(5_000_000), declaredSize: 900_000 },
    ]);
    const error = await refusal(readWorkbook(liar, "liar.xlsx"));
    expect(error.status).toBe(413);
    expect(error.message).toMatch(
      /unpacks to more than its zip directory declares \(part xl\/worksheets\/sheet1\.xml\)/,
    );
    expect(load).not.toHaveBeenCalled();
  });

  it("lets an ordinary workbook through to exceljs", async () => {
    const load = spyOnXlsxLoad();
    await readWorkbook(fixture("clean.xlsx"), "clean.xlsx");
    expect(load).toHaveBeenCalledTimes(1);
  });

  it("answers 422 for a truncated workbook", async () => {
    const bytes = fixture("clean.xlsx");
    const error = await refusal(readWorkbook(bytes.subarray(0, bytes.length - 40), "cut.xlsx"));
    expect(error.status).toBe(422);
    expect(error.message).toMatch(/^"cut\.xlsx" looks like an Excel workbook but is damaged/);
  });
});

describe("workbook cells", () => {
  async function workbookWith(
    fill: (sheet: ExcelJS.Worksheet) => void,
    more?: (wb: ExcelJS.Workbook) => void,
  ) {
    const workbook = new ExcelJS.Workbook();
    fill(workbook.addWorksheet("Axes"));
    more?.(workbook);
    return Buffer.from((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
  }

  it("reads formulas as their text with '=', never their cached result; shared formulas too", async () => {
    const bytes = await workbookWith((sheet) => {
      sheet.addRow(["Holding torque [N·m]", "Peak torque [N·m]"]);
      sheet.addRow([1.26, { formula: "A2*2", result: 2.52 }]);
      sheet.getCell("A3").value = {
        formula: "A2+1",
        result: 2.26,
        shareType: "shared",
        ref: "A3:A4",
      } as ExcelJS.CellValue;
      sheet.getCell("A4").value = { sharedFormula: "A3", result: 3.26 } as ExcelJS.CellValue;
    });
    const { sheets } = await readWorkbook(bytes, "formulas.xlsx");
    // Streamed (issue 13): exceljs's WorkbookReader drops a shared formula's index, so its other
    // cells read as "=" — still a formula that fails number validation, never the cached 3.26.
    expect(sheets[0].rows).toEqual([["1.26", "=A2*2"], ["=A2+1"], ["="]]);
  });

  it("reads rich text, hyperlinks, booleans, dates and errors as their text; gaps as empty cells", async () => {
    const bytes = await workbookWith((sheet) => {
      sheet.addRow(["Machine", "Axis label", "Note", "When", "Check"]);
      sheet.getCell("A2").value = {
        richText: [{ text: "Tray " }, { text: "sealer", font: { bold: true } }],
      };
      sheet.getCell("B2").value = { text: "Lift 3", hyperlink: "https://example.invalid/lift" };
      sheet.getCell("C2").value = true;
      sheet.getCell("D2").value = new Date(Date.UTC(2026, 2, 14));
      sheet.getCell("E2").value = { error: "#DIV/0!" };
      sheet.getCell("B5").value = "far below";
    });
    const { sheets } = await readWorkbook(bytes, "cells.xlsx");
    expect(sheets[0].rows).toEqual([
      ["Tray sealer", "Lift 3", "TRUE", "2026-03-14", "#DIV/0!"],
      [],
      [],
      ["", "far below"],
    ]);
  });

  it("returns every sheet with its name, header row and rows", async () => {
    const bytes = await workbookWith(
      (sheet) => sheet.addRow([" Machine ", "Axis label"]),
      (wb) => wb.addWorksheet("Notes").addRows([["Note"], ["invented data"]]),
    );
    const { kind, sheets } = await readWorkbook(bytes, "two.xlsx");
    expect(kind).toBe("xlsx");
    expect(sheets).toEqual([
      { name: "Axes", headers: ["Machine", "Axis label"], rows: [] },
      { name: "Notes", headers: ["Note"], rows: [["invented data"]] },
    ]);
  });
});
