import { pipeline } from "@/db/queries/pipeline";
import { pipelineCsv } from "@/lib/pipeline/csv";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { pipelineFiltersSchema } from "@/lib/validations/pipeline";

// The pipeline's filtered quotes as CSV, with the page's filters (?owner=&stage=&account=&closeMonth=)
// and its scope: an engineer gets only their own quotes, a reviewer none (403).
export const GET = withApi(async (request: Request) => {
  const caller = await requireRole("manager", "engineer");
  const filters = pipelineFiltersSchema.parse(
    Object.fromEntries(new URL(request.url).searchParams),
  );
  const body = pipelineCsv(pipeline(caller, filters).quotes);
  return new Response(body, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": 'attachment; filename="pipeline.csv"',
    },
  });
});
