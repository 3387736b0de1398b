import type { z } from "zod";
import { listParamsSchema } from "@/lib/lists/list-params";

// The audit log sorts by time only; newest first unless asked otherwise.
export const AUDIT_SORTS = ["at"] as const;

export const auditListParamsSchema = listParamsSchema(AUDIT_SORTS, { sort: "at", dir: "desc" });

export type AuditListParams = z.infer<typeof auditListParamsSchema>;

// The audit list shares the admin page with the users list, so its URL parameters carry an "a".
export const AUDIT_URL_KEYS = { q: "aq", sort: "asort", dir: "adir", page: "apage" } as const;
