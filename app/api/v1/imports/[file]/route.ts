import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { NotFoundError } from "@/lib/errors";
import { templateCsv, templateXlsx } from "@/lib/import";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// GET /api/v1/imports/template.xlsx and template.csv: one column per field, "Label [unit]".
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ file: string }> }) => {
    await requireRole(...VENDOR_ROLES);
    const { file } = await context.params;
    if (file === "template.xlsx") {
      return new Response(new Uint8Array(await templateXlsx()), {
        headers: {
          "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
          "content-disposition": 'attachment; filename="loopshift-axes-template.xlsx"',
        },
      });
    }
    if (file === "template.csv") {
      return new Response(templateCsv(), {
        headers: {
          "content-type": "text/csv; charset=utf-8",
          "content-disposition": 'attachment; filename="loopshift-axes-template.csv"',
        },
      });
    }
    throw new NotFoundError("No such file; use template.xlsx or template.csv");
  },
);
