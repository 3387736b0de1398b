import { matchHeaders, type MappingOverride } from "./headers";
import { readWorkbook } from "./read";
import { validateRows, type SiteDefaults } from "./validate";
import { ImportFileError } from "./errors";

// Reads, maps and validates one uploaded file: the part of an import that touches no database.
export async function checkImportFile(
  bytes: Uint8Array,
  fileName: string,
  options: { sheet?: string; mapping?: MappingOverride; site: SiteDefaults },
) {
  const workbook = await readWorkbook(bytes, fileName);
  const sheet = options.sheet
    ? workbook.sheets.find((s) => s.name === options.sheet)
    : workbook.sheets[0];
  if (!sheet) {
    throw new ImportFileError(
      422,
      `The workbook has no sheet named "${options.sheet}"; choose one of ${workbook.sheets.map((s) => `"${s.name}"`).join(", ")}`,
    );
  }
  const match = matchHeaders(sheet.headers, options.mapping ?? {});
  const result = validateRows(sheet, match, options.site);
  const columns = sheet.headers.map((header, index) => ({
    header,
    key: match.mapping[index]?.key ?? null,
    unit: match.mapping[index]?.unit ?? null,
  }));
  return {
    kind: workbook.kind,
    sheets: workbook.sheets.map((s) => s.name),
    sheet,
    columns,
    result,
  };
}
