export type ImportCellError = { row: number; column: string; message: string };

export type ImportResponse = {
  rowsRead: number;
  rowsValid: number;
  imported: number;
  errors: ImportCellError[];
  sheets: string[];
  sheet: string;
  columns: { header: string; key: string | null; unit: string | null }[];
  machinesToCreate: string[];
  machinesCreated?: number;
  preview?: { headers: string[]; rows: string[][] };
  error?: string;
};

export type ImportHistoryRow = {
  id: number;
  fileName: string;
  sizeBytes: number;
  rowsRead: number;
  rowsImported: number;
  errorCount: number;
  machinesCreated: number;
  at: string;
  userEmail: string | null;
};
