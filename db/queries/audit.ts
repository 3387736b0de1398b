import { desc } from "drizzle-orm";
import { db } from "@/db";
import { auditLog } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { assertRole } from "@/lib/auth/session-user";

export type AuditInput = {
  actor: { id: number; email: string } | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  detail?: string;
};

export function recordAudit(entry: AuditInput) {
  db.insert(auditLog)
    .values({
      actorId: entry.actor?.id ?? null,
      actorEmail: entry.actor?.email ?? null,
      action: entry.action,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId == null ? null : String(entry.targetId),
      detail: entry.detail ?? null,
    })
    .run();
}

export function listAudit(caller: SessionUser, limit = 200) {
  assertRole(caller, "admin");
  return db
    .select()
    .from(auditLog)
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(limit)
    .all();
}
