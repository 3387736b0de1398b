import { ImportFileError } from "./errors";

export type CsvDelimiter = "," | ";" | "\t";

const QUOTE = 0x22;
const CR = 0x0d;
const LF = 0x0a;

/**
 * The delimiter of the header line: the one of , ; tab that occurs most often outside quotes
 * (ties go to the comma). The header holds no numbers, so a decimal comma cannot mislead it;
 * Excel writes ";" where the decimal separator is a comma. A first line `sep=;` (Excel's hint)
 * decides outright.
 */
export function detectDelimiter(text: string): CsvDelimiter {
  const counts = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '"') quoted = !quoted;
    else if (!quoted && (c === "\n" || c === "\r")) break;
    else if (!quoted && (c === "," || c === ";" || c === "\t")) counts[c]++;
  }
  if (counts[";"] > counts[","] && counts[";"] >= counts["\t"]) return ";";
  if (counts["\t"] > counts[","] && counts["\t"] > counts[";"]) return "\t";
  return ",";
}

/**
 * Records of a CSV text per RFC 4180: fields in double quotes may hold the delimiter, line breaks
 * and "" for a quote; records end at CRLF, LF or CR. Leniently, as spreadsheet programs do, a
 * quote inside an unquoted field is a plain character. A leading BOM is dropped. Blank lines stay
 * as records of one empty field, so that a record's index + 1 is the row number a spreadsheet shows.
 */
export function parseCsv(input: string, fileName = "the file"): string[][] {
  let text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  let delimiter: CsvDelimiter;
  const hint = /^sep=([,;\t])\r?\n?/.exec(text);
  if (hint !== null) {
    delimiter = hint[1] as CsvDelimiter;
    text = text.slice(hint[0].length);
  } else {
    delimiter = detectDelimiter(text);
  }
  const sep = delimiter.charCodeAt(0);

  const records: string[][] = [];
  let record: string[] = [];
  let i = 0;
  const n = text.length;
  if (n === 0) return records;

  while (i <= n) {
    if (i === n) {
      // End of text right after a delimiter: the last field is empty.
      record.push("");
      records.push(record);
      break;
    }
    let field: string;
    if (text.charCodeAt(i) === QUOTE) {
      const start = i;
      let value = "";
      i++;
      for (;;) {
        const close = text.indexOf('"', i);
        if (close < 0) {
          const row = records.length + 1;
          throw new ImportFileError(
            422,
            `row ${row} of "${fileName}" opens a quote (") at character ${start - lineStart(text, start) + 1} that is never closed; close it or remove it, then upload again`,
          );
        }
        value += text.slice(i, close);
        if (text.charCodeAt(close + 1) === QUOTE) {
          value += '"';
          i = close + 2;
        } else {
          i = close + 1;
          break;
        }
      }
      // Text after the closing quote up to the delimiter belongs to the field (lenient).
      let j = i;
      while (j < n) {
        const c = text.charCodeAt(j);
        if (c === sep || c === CR || c === LF) break;
        j++;
      }
      field = value + text.slice(i, j);
      i = j;
    } else {
      let j = i;
      while (j < n) {
        const c = text.charCodeAt(j);
        if (c === sep || c === CR || c === LF) break;
        j++;
      }
      field = text.slice(i, j);
      i = j;
    }
    record.push(field);
    if (i >= n) {
      records.push(record);
      break;
    }
    const c = text.charCodeAt(i);
    if (c === sep) {
      i++;
      continue;
    }
    // Line break: CRLF, LF or CR.
    i += c === CR && text.charCodeAt(i + 1) === LF ? 2 : 1;
    records.push(record);
    record = [];
    if (i >= n) break;
  }
  return records;
}

function lineStart(text: string, at: number): number {
  const lf = text.lastIndexOf("\n", at);
  const cr = text.lastIndexOf("\r", at);
  return Math.max(lf, cr) + 1;
}

/** One field as RFC 4180 writes it: quoted when it holds the delimiter, a quote or a line break. */
export function csvField(value: string, delimiter: CsvDelimiter = ","): string {
  return value.includes(delimiter) || /["\r\n]/.test(value)
    ? `"${value.replace(/"/g, '""')}"`
    : value;
}
