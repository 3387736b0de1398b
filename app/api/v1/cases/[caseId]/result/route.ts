import { caseResultJson } from "@/db/queries/cases";
import { withApi } from "@/lib/api/handler";
import { idFromRoute } from "@/lib/api/params";
import { requireRole } from "@/lib/auth";

// The CaseResult of ENGINE.md §9 for the case as it stands now.
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ caseId: string }> }) => {
    const caller = await requireRole("engineer", "manager", "admin");
    const caseId = idFromRoute((await context.params).caseId);
    return new Response(caseResultJson(caller, caseId), {
      // A result follows every edit of the case, its site or the catalogue: never reuse one.
      headers: { "content-type": "application/json", "cache-control": "no-store" },
    });
  },
);
