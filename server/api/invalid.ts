import "server-only";
import type { z } from "zod";
import { formatIssues, formatPath } from "@/lib/engine";
import { jsonError } from "./handler";

// 422 in the shape of POST /api/v1/evaluate: one "path: message" line per problem, and the
// issues with their paths spelled the same way (`motion.leadMm`, `event.scrapParts`).
export function invalidBody(error: z.ZodError, what = "The axis is not valid") {
  return jsonError(422, what, {
    problems: formatIssues(error),
    issues: error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })),
  });
}
