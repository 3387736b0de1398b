import { NextResponse } from "next/server";
import { jsonError, readJsonBody, withApi } from "@/server/api/handler";
import { requireUser } from "@/server/auth";
import { caseInputSchema, evaluateParsedCase, formatIssues, formatPath } from "@/lib/engine";

// A CaseInput in, the engine's CaseResult out (docs/model.md), for any signed-in user.
export const MAX_CASE_BYTES = 20 * 1024 * 1024;

export const POST = withApi(async (request: Request) => {
  await requireUser();
  const body = await readJsonBody(request, MAX_CASE_BYTES);
  const parsed = caseInputSchema.safeParse(body);
  if (!parsed.success) {
    return jsonError(422, "The case is not valid", {
      problems: formatIssues(parsed.error),
      issues: parsed.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })),
    });
  }
  return NextResponse.json(evaluateParsedCase(parsed.data));
});
