import type { Dossier } from "@/lib/dossier";
import type { ParsedCase } from "@/lib/engine";
import { DOSSIER_SHEET, RECORD_KEY_HEADER } from "@/lib/glossary";
import { footerOf, streamWorkbook, writeProposalSheets } from "../build-workbook";
import { sheetOptions } from "../formats";
import { safeText } from "../safe-text";
import type { WorkbookMeta } from "../types";
import { axisSheetName, writeAxisSheet } from "./axis-sheets";
import { writeMonthlySheet, writePaybackGridSheet, writeSensitivitySheet } from "./tables-sheets";
import { writeUncertaintySheet } from "./uncertainty-sheet";

// The dossier's sheet names are glossary terms (lib/glossary/sheets.ts).
export { DOSSIER_SHEET };

/**
 * The dossier workbook: the five sheets of the proposal workbook, computed from the same frozen
 * input, then the months, the tariff × hours table, the sensitivity at three swings, the
 * uncertainty draws, an index of the axes, and one sheet per axis.
 */
export async function buildDossierWorkbook(
  input: ParsedCase,
  dossier: Dossier,
  meta: WorkbookMeta,
): Promise<Buffer> {
  return streamWorkbook(meta, (workbook) => {
    writeProposalSheets(workbook, input, dossier.result, meta);
    const footer = footerOf(meta);
    const add = (name: string, frozenRows = 1) => {
      const sheet = workbook.addWorksheet(name, sheetOptions(frozenRows));
      sheet.headerFooter = { ...sheet.headerFooter, oddFooter: footer };
      return sheet;
    };
    writeMonthlySheet(add(DOSSIER_SHEET.monthly), input, dossier);
    writePaybackGridSheet(add(DOSSIER_SHEET.paybackGrid, 0), input, dossier);
    writeSensitivitySheet(add(DOSSIER_SHEET.sensitivity, 0), input, dossier);
    writeUncertaintySheet(add(DOSSIER_SHEET.uncertainty, 0), input, dossier);

    // Each axis by the names a reader knows it by and a link to its sheet; its record key (the
    // id the Axes sheet lists it under) at the right, a technical column.
    const index = add(DOSSIER_SHEET.axisIndex);
    index.columns = [{ width: 34 }, { width: 30 }, { width: 34 }, { width: 16 }];
    const names = new Set<string>();
    const sheetNames = dossier.axes.map((axis, i) => {
      let name = axisSheetName(i, axis.label);
      // Names compare without case; a clash after cutting to 31 characters gets the index alone.
      if (names.has(name.toLowerCase())) name = `${i + 1}`;
      names.add(name.toLowerCase());
      return name;
    });
    const header = index.addRow(["Axis", "Machine", "Sheet", RECORD_KEY_HEADER.axis]);
    header.font = { bold: true };
    dossier.axes.forEach((axis, i) => {
      const row = index.addRow([safeText(axis.label), safeText(axis.machineName)]);
      row.getCell(4).value = safeText(axis.id);
      row.getCell(3).value = {
        text: sheetNames[i],
        hyperlink: `#'${sheetNames[i].replace(/'/g, "''")}'!A1`,
      };
    });
    dossier.axes.forEach((axis, i) => {
      const sheet = add(sheetNames[i], 0);
      writeAxisSheet(sheet, axis);
      sheet.commit();
    });
  });
}
