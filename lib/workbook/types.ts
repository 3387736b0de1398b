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
}
