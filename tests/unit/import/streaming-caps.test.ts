import ExcelJS from "exceljs";
import { crc32, deflateRawSync } from "node:zlib";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ImportFileError } from "@/lib/import/errors";
import { readWorkbook, XML_LIMITS } from "@/lib/import/read";

// Issue 13, finding 4: the parts of a workbook are capped while they stream, so a hostile part
// is stopped at its cap instead of being unpacked, copied or cached whole first.

const NS = "http://schemas.openxmlformats.org";

/** A zip of deflated parts in the given order (PKWARE APPNOTE 4.3.7, 4.3.12, 4.3.16). */
function zip(parts: [string, string][]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const [fileName, text] of parts) {
    const name = Buffer.from(fileName);
    const data = Buffer.from(text);
    const packed = deflateRawSync(data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc32(data), 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc32(data), 16);
    central.writeUInt32LE(packed.length, 20);
    central.writeUInt32LE(data.length, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, packed);
    centrals.push(central, name);
    offset += 30 + name.length + packed.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(parts.length, 8);
  end.writeUInt16LE(parts.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

/** A one-sheet workbook zipped as Excel zips it: the sheet first, the shared strings after. */
function workbook(sheetData: string, sharedStrings: string[] | string): Buffer {
  const sst =
    typeof sharedStrings === "string"
      ? sharedStrings
      : `<sst xmlns="${NS}/spreadsheetml/2006/main">${sharedStrings.map((s) => `<si><t>${s}</t></si>`).join("")}</sst>`;
  return zip([
    [
      "xl/workbook.xml",
      `<workbook xmlns="${NS}/spreadsheetml/2006/main" xmlns:r="${NS}/officeDocument/2006/relationships"><sheets><sheet name="Axes" sheetId="1" r:id="rId1"/></sheets></workbook>`,
    ],
    [
      "xl/_rels/workbook.xml.rels",
      `<Relationships xmlns="${NS}/package/2006/relationships"><Relationship Id="rId1" Type="${NS}/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>`,
    ],
    [
      "xl/worksheets/sheet1.xml",
      `<worksheet xmlns="${NS}/spreadsheetml/2006/main"><sheetData>${sheetData}</sheetData></worksheet>`,
    ],
    ["xl/sharedStrings.xml", sst],
  ]);
}

async function refusal(promise: Promise<unknown>): Promise<ImportFileError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ImportFileError);
  return error as ImportFileError;
}

// exceljs starts reading a sheet in _parseWorksheet: not called means no row was read.
function spyOnSheetReading() {
  const proto = ExcelJS.stream.xlsx.WorkbookReader.prototype as unknown as {
    _parseWorksheet: (...a: unknown[]) => unknown;
  };
  return vi.spyOn(proto, "_parseWorksheet");
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe("a workbook zipped as Excel zips it (sheets before shared strings)", () => {
  it("reads its shared strings into the sheet's cells", async () => {
    const bytes = workbook(
      '<row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" t="s"><v>1</v></c></row>' +
        '<row r="2"><c r="A2" t="s"><v>2</v></c><c r="B2"><v>1.26</v></c></row>',
      ["Machine", "Holding torque [N·m]", "Press 7"],
    );
    const { sheets } = await readWorkbook(bytes, "excel-order.xlsx");
    expect(sheets).toEqual([
      { name: "Axes", headers: ["Machine", "Holding torque [N·m]"], rows: [["Press 7", "1.26"]] },
    ]);
  });
});

describe("shared strings are capped while they stream", () => {
  it(`refuses more than ${XML_LIMITS.maxSharedStringsBytes / 1_000_000} MB of shared text, naming the cap, before any row is read (413)`, async () => {
    const sheetReading = spyOnSheetReading();
    const long = "x".repeat(1000);
    const strings = Array.from({ length: 40_000 }, (_, i) => `${i} ${long}`);
    const error = await refusal(readWorkbook(workbook("", strings), "long-texts.xlsx"));
    expect(error.status).toBe(413);
    expect(error.message).toBe(
      '"long-texts.xlsx" holds more than 32 MB of shared text (xl/sharedStrings.xml); the limit is 32 MB — remove long texts and unused sheets, or split the file',
    );
    expect(sheetReading).not.toHaveBeenCalled();
  });

  it(`refuses more than ${XML_LIMITS.maxSharedStrings.toLocaleString("en-US")} distinct texts, naming the cap (413)`, async () => {
    const sheetReading = spyOnSheetReading();
    // Short texts: 1.2 million of them stay under the byte cap, so the count must stop them.
    const strings = Array.from({ length: 1_200_000 }, (_, i) => i.toString(36));
    const error = await refusal(readWorkbook(workbook("", strings), "many-texts.xlsx"));
    expect(error.status).toBe(413);
    expect(error.message).toBe(
      '"many-texts.xlsx" holds more than 1 million distinct texts (xl/sharedStrings.xml); the limit is 1 million — remove unused sheets, or split the file',
    );
    expect(sheetReading).not.toHaveBeenCalled();
  });
});

describe("a sheet is capped while it streams", () => {
  it(`refuses a sheet that unpacks to more than ${XML_LIMITS.maxWorksheetBytes / 1_000_000} MB though under the row cap (413)`, async () => {
    // 10,000 rows, each one cell and a 10 kB attribute exceljs does not use: little text and
    // few rows, but 105 MB of XML. The attribute is seeded noise so that the part packs some
    // 80:1, like an over-formatted sheet rather than a bomb.
    let seed = 12345;
    const letter = () =>
      String.fromCharCode(97 + ((seed = (seed * 1103515245 + 12345) % 2 ** 31) % 26));
    const filler = Array.from({ length: 10_000 }, letter).join("");
    const rows: string[] = [];
    for (let r = 1; r <= 10_000; r++)
      rows.push(`<row r="${r}" x14ac:filler="${filler}"><c r="A${r}"><v>${r}</v></c></row>`);
    const error = await refusal(readWorkbook(workbook(rows.join(""), []), "formatted.xlsx"));
    expect(error.status).toBe(413);
    expect(error.message).toBe(
      'A sheet of "formatted.xlsx" (xl/worksheets/sheet1.xml) unpacks to more than 100 MB; the limit is 100 MB — remove unused columns and formatting, or split the file',
    );
  }, 60_000);
});
