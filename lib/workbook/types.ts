import type { EvidenceIndex } from "@/lib/evidence/subjects";

/** What the workbook says about where the case comes from (the Summary sheet's header). */
export interface WorkbookMeta {
  title: string;
  accountName: string;
  siteName: string;
  caseName: string;
  /** The proposal version; null for a case not frozen yet. */
  version: number | null;
  engineVersion: string;
  /** ISO 8601 time the workbook was made. */
  generatedAt: string;
  /**
   * The recorded sources of the typed figures (db/queries/evidence.ts) and the case they are kept
   * under: with them, the workbook lists every typed figure beside its source (lib/workbook/sources-sheet.ts).
   */
  evidence?: { caseId: number; index: EvidenceIndex };
}
