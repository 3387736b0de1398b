import { crc32, deflateRawSync } from "node:zlib";

/**
 * The workbook of issue 13, finding 4, generated (never committed): an ordinary-looking .xlsx of
 * 8.9 MB, under the 10 MB upload limit, that unpacks to 195 MB. Its parts come in the order Excel
 * writes them (the sheet before the shared strings); the sheet holds 250,000 rows, far over the
 * import's row cap, and the shared strings 13 MB of distinct texts, under their cap. Each part's
 * ratio (about 22:1) and the total stay under the zip guard's limits, so only the caps applied
 * while the parts stream can stop it. Deterministic: the same bytes every time.
 */
export function hostileWorkbook(): Buffer {
  let seed = 0x2545f491;
  // xorshift32: cheap, seeded noise so the XML compresses like real data, not like a bomb.
  const next = () => {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return seed >>> 0;
  };
  const STRINGS = 200_000;
  const ROWS = 250_000;
  const NOTE = "Retrofit candidate: open-loop axis with missed steps at high acceleration; ".repeat(
    6,
  );

  const strings: string[] = [
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="${STRINGS}" uniqueCount="${STRINGS}">`,
  ];
  for (let i = 0; i < STRINGS; i++)
    strings.push(`<si><t>Axis ${i} of line ${next() % 40}, checked by the night shift</t></si>`);
  strings.push("</sst>");

  const sheet: string[] = [
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>`,
    `<row r="1"><c r="A1" t="inlineStr"><is><t>Machine</t></is></c><c r="B1" t="inlineStr"><is><t>Axis label</t></is></c><c r="G1" t="inlineStr"><is><t>Note</t></is></c></row>`,
  ];
  for (let r = 2; r <= ROWS + 1; r++) {
    sheet.push(
      `<row r="${r}" spans="1:6"><c r="A${r}" t="s"><v>${r % STRINGS}</v></c><c r="B${r}"><v>${next() % 50}</v></c><c r="C${r}" s="1"><v>1.26</v></c><c r="D${r}" s="1"><v>0.9</v></c><c r="E${r}"><v>${1000 + (next() % 8) * 100}</v></c><c r="F${r}" s="2"><v>24</v></c><c r="G${r}" t="inlineStr"><is><t>${NOTE}</t></is></c></row>`,
    );
  }
  sheet.push("</sheetData></worksheet>");

  const ns = "http://schemas.openxmlformats.org";
  return zip([
    [
      "[Content_Types].xml",
      `<?xml version="1.0" encoding="UTF-8"?><Types xmlns="${ns}/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/><Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/></Types>`,
    ],
    [
      "_rels/.rels",
      `<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="${ns}/package/2006/relationships"><Relationship Id="rId1" Type="${ns}/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>`,
    ],
    [
      "xl/workbook.xml",
      `<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="${ns}/spreadsheetml/2006/main" xmlns:r="${ns}/officeDocument/2006/relationships"><sheets><sheet name="Axes" sheetId="1" r:id="rId1"/></sheets></workbook>`,
    ],
    [
      "xl/_rels/workbook.xml.rels",
      `<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="${ns}/package/2006/relationships"><Relationship Id="rId1" Type="${ns}/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/><Relationship Id="rId2" Type="${ns}/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/></Relationships>`,
    ],
    ["xl/worksheets/sheet1.xml", sheet.join("")],
    ["xl/sharedStrings.xml", strings.join("")],
  ]);
}

// A zip of deflated parts (PKWARE APPNOTE 4.3.7 local headers, 4.3.12 directory, 4.3.16 end).
function zip(parts: [name: string, text: string][]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const [fileName, text] of parts) {
    const name = Buffer.from(fileName, "utf8");
    const data = Buffer.from(text, "utf8");
    const packed = deflateRawSync(data);
    const crc = crc32(data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc, 16);
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
