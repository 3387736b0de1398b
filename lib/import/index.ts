export { ImportFileError, type ImportFileStatus } from "./errors";
export {
  IMPORT_FIELDS,
  importField,
  type AxisColumns,
  type FieldType,
  type ImportField,
  type ImportFieldKey,
  type QuantityKind,
} from "./fields";
export {
  INDUCTANCE_FACTORS_TO_MH,
  SI_UNITS,
  SPEED_FACTORS_TO_RPM,
  resolveColumnUnit,
  splitHeader,
  supportedUnits,
  toSi,
  type ColumnUnit,
} from "./units";
export {
  fieldForHeader,
  headerFor,
  matchHeaders,
  normalizeHeaderLabel,
  type ColumnMapping,
  type HeaderMapping,
  type HeaderMatch,
  type HeaderProblem,
  type MappingOverride,
} from "./headers";
export { MAX_DATA_ROWS, readWorkbook, type SheetData, type WorkbookData } from "./read";
export { ZIP_LIMITS } from "./zip-guard";
export {
  validateRows,
  type ImportCellError,
  type SiteDefaults,
  type ValidatedAxis,
  type ValidationResult,
} from "./validate";
export { MAX_NAME_LENGTH, isAmbiguousDecimalComma } from "./cells";
export { templateCsv, templateHeaders, templateXlsx } from "./template";
