/**
 * Text that goes into a cell, a header or a footer. Every string a user or the catalogue typed
 * (labels, names, ids) passes through here.
 *
 * A JS string given to exceljs is written as a string cell (`t="s"`), never as `<f>`, so text
 * such as "=HYPERLINK(…)" or "+1" stays text in every spreadsheet that opens the file; this module
 * only makes sure the value is a string, that it is well-formed XML and that it fits a cell.
 */

/** Characters XML 1.0 does not allow, and unpaired surrogates: exceljs would write a corrupt part. */
const NOT_XML =
  /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** The most characters a cell holds (the limit of the OOXML spreadsheet applications). */
export const MAX_CELL_TEXT = 32767;

/** The characters that make a spreadsheet read typed text as a formula. */
const FORMULA_START = /^[=+\-@]/;

export function looksLikeFormula(text: string): boolean {
  return FORMULA_START.test(text);
}

/** A plain string value for a cell: valid XML, at most MAX_CELL_TEXT characters. */
export function safeText(value: string | number | null | undefined): string {
  const text = String(value ?? "").replace(NOT_XML, "");
  if (text.length <= MAX_CELL_TEXT) return text;
  const cut = text.slice(0, MAX_CELL_TEXT);
  // Do not leave half of a surrogate pair at the end.
  return /[\uD800-\uDBFF]$/.test(cut) ? cut.slice(0, -1) : cut;
}

/** Header and footer text: "&" starts a field code there (&P, &D …), "&&" prints one "&". */
export function headerFooterText(value: string): string {
  return safeText(value).replace(/&/g, "&&");
}
