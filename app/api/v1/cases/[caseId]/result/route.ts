import { caseResultJson } from "@/server/cases/results";
import { withApi } from "@/server/api/handler";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The CaseResult of docs/model.md for the case as it stands now.
export const GET = withApi(
  async (_request: Request, context: { params: Promise<{ caseId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const caseId = idFromRoute((await context.params).caseId);
    return new Response(caseResultJson(caller, caseId), {
      headers: {
        "content-type": "application/json",
        // A result follows every edit of the case, its site or the catalogue: never reuse one.
        // no-transform: the server would gzip the ~1 MB body of a 500-axis case again on every
        // request (about 15 ms of CPU each, several times the rest of the request), and a route
        // handler cannot hand it a body compressed once. A reverse proxy in front may compress.
        "cache-control": "no-store, no-transform",
      },
    });
  },
);
