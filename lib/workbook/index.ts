export { buildProposalWorkbook } from "./build-workbook";
export type { WorkbookMeta } from "./types";
export {
  NAME as WORKBOOK_NAMES,
  SHEET as WORKBOOK_SHEETS,
  SCENARIOS as WORKBOOK_SCENARIOS,
} from "./layout";
export { BEYOND_HORIZON, NO_RATE_FOUND, NO_SIGN_CHANGE, NOT_APPLICABLE } from "./cash-flow-values";
export { safeText, looksLikeFormula, MAX_CELL_TEXT } from "./safe-text";
export { buildDossierWorkbook, DOSSIER_SHEET } from "./dossier/build-dossier-workbook";
