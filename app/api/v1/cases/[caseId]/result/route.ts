import { z } from "zod";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { idFromRoute } from "@/lib/validations/ids";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import {
  caseInputAndResultJson,
  caseResultJson,
  caseResultWithValueByMachineJson,
} from "@/server/cases/results";

const includeParam = z
  .enum(["input", "value-by-machine"], {
    error: "include: the accepted values are input and value-by-machine",
  })
  .nullable();

// The CaseResult of docs/model.md for the case as it stands now. With `?include=input` the body
// is `{ input, result }`: the CaseInput the engine received beside it (the case page's one request).
// With `?include=value-by-machine` it is `{ result, valueByMachine }`: each scenario's value by
// source split by machine plus a case-wide part, adding up to the scenario's (docs/contracts.md).
export const GET = withApi(
  async (request: Request, context: { params: Promise<{ caseId: string }> }) => {
    const caller = await requireRole(...VENDOR_ROLES);
    const caseId = idFromRoute((await context.params).caseId);
    const include = includeParam.parse(new URL(request.url).searchParams.get("include"));
    const body =
      include === "input"
        ? caseInputAndResultJson(caller, caseId)
        : include === "value-by-machine"
          ? caseResultWithValueByMachineJson(caller, caseId)
          : caseResultJson(caller, caseId);
    return new Response(body, {
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
