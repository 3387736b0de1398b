import { NextResponse } from "next/server";
import { commitImport, machinesToCreate, recordRefusedImport } from "@/db/queries/imports";
import { getSiteOrThrow } from "@/db/queries/sites";
import { jsonError, withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { ImportFileError, type MappingOverride } from "@/lib/import";
import { checkImportFileInWorker } from "@/server/import/check-in-worker";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;

function parseMapping(text: FormDataEntryValue | null): MappingOverride | undefined {
  if (text === null || text === "") return undefined;
  try {
    const value = JSON.parse(String(text));
    if (value && typeof value === "object" && !Array.isArray(value))
      return value as MappingOverride;
  } catch {
    // reported below
  }
  throw new ImportFileError(
    422,
    'The field "mapping" must be a JSON object of column header → field key',
  );
}

// Absent means a real import; "true" or "false" say which; anything else is a mistake the caller
// should hear about rather than an import they did not mean to run.
function parseDryRun(value: FormDataEntryValue | null): boolean {
  if (value === null || value === "false") return false;
  if (value === "true") return true;
  throw new ImportFileError(422, 'dryRun must be "true" or "false"');
}

// multipart: file (required), dryRun ("true" validates only), mapping (JSON), sheet (name).
export const POST = withApi(
  async (request: Request, context: { params: Promise<{ siteId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const site = getSiteOrThrow(caller, idFromRoute((await context.params).siteId));
    // The multipart envelope adds a few hundred bytes to the file itself.
    if (Number(request.headers.get("content-length") ?? 0) > MAX_IMPORT_BYTES + 16 * 1024) {
      return jsonError(413, "The file is larger than 10 MB; split it into smaller files");
    }
    try {
      const form = await request.formData().catch(() => {
        throw new ImportFileError(
          422,
          'Send the spreadsheet as multipart/form-data in the field "file"',
        );
      });
      const file = form.get("file");
      if (!(file instanceof File))
        throw new ImportFileError(
          422,
          'Send the spreadsheet as multipart/form-data in the field "file"',
        );
      if (file.size > MAX_IMPORT_BYTES)
        return jsonError(413, "The file is larger than 10 MB; split it into smaller files");
      const dryRun = parseDryRun(form.get("dryRun"));
      // Read in a worker thread (server/import/check-in-worker.ts): a large file does not hold up
      // the requests of other users while it is read.
      const checked = await checkImportFileInWorker(
        new Uint8Array(await file.arrayBuffer()),
        file.name,
        {
          sheet: form.get("sheet") ? String(form.get("sheet")) : undefined,
          mapping: parseMapping(form.get("mapping")),
          site,
        },
      );
      const { result } = checked;
      const facts = {
        fileName: file.name,
        sizeBytes: file.size,
        rowsRead: result.rowsRead,
        errorCount: result.errors.length,
      };
      const body = {
        rowsRead: result.rowsRead,
        rowsValid: result.rows.length,
        imported: 0,
        errors: result.errors,
        sheets: checked.sheets,
        sheet: checked.sheet.name,
        columns: checked.columns,
        machinesToCreate: machinesToCreate(caller, site.id, result.machinesNamed),
        ...(dryRun
          ? { preview: { headers: checked.sheet.headers, rows: checked.sheet.rows } }
          : {}),
      };
      if (dryRun) return NextResponse.json(body);
      if (result.errors.length > 0 || result.rows.length === 0) {
        recordRefusedImport(caller, site.id, facts);
        const message = result.errors.length
          ? "Nothing was imported: fix the errors and upload the file again"
          : "The file has no data rows";
        return NextResponse.json({ ...body, error: message }, { status: 422 });
      }
      const committed = commitImport(
        caller,
        site.id,
        facts,
        result.rows.map(({ sourceRow: _row, ...axis }) => axis),
      );
      return NextResponse.json({
        ...body,
        imported: committed.imported,
        machinesCreated: committed.machinesCreated,
      });
    } catch (error) {
      if (error instanceof ImportFileError) return jsonError(error.status, error.message);
      throw error;
    }
  },
);
