import { NextResponse } from "next/server";
import { pipeline } from "@/db/queries/pipeline";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { pipelineFiltersSchema } from "@/lib/validations/pipeline";

// Quotes with totals per stage (and per close month); ?owner=&stage=&account=&closeMonth=YYYY-MM.
export const GET = withApi(async (request: Request) => {
  const caller = await requireRole("manager", "engineer");
  const filters = pipelineFiltersSchema.parse(
    Object.fromEntries(new URL(request.url).searchParams),
  );
  return NextResponse.json(pipeline(caller, filters));
});
