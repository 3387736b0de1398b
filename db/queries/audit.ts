import { and, asc, count, desc, or, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { db } from "@/db";
import { auditLog } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { assertRole } from "@/lib/auth/session-user";
import { pageWindow, type ListPage } from "@/lib/lists/list-params";
import type { AuditListParams } from "@/lib/validations/audit";

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

export const AUDIT_PAGE_SIZE = 50;

export type AuditRow = typeof auditLog.$inferSelect;

/**
 * One page of the audit log for the administrator: a text filter over the action and the actor's
 * e-mail (and the detail, where the target's name stands), sorted by time either way.
 */
export function listAuditPage(
  caller: SessionUser,
  params: Partial<AuditListParams> = {},
  pageSize = AUDIT_PAGE_SIZE,
): ListPage<AuditRow> {
  assertRole(caller, "admin");
  const filters: SQL[] = [];
  if (params.q) {
    const pattern = `%${params.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    const contains = (column: SQLiteColumn) => sql`${column} like ${pattern} escape '\\'`;
    filters.push(
      or(contains(auditLog.action), contains(auditLog.actorEmail), contains(auditLog.detail))!,
    );
  }
  const where = filters.length ? and(...filters) : undefined;
  const total = db.select({ n: count() }).from(auditLog).where(where).get()!.n;
  const window = pageWindow(total, params.page ?? 1, pageSize);
  const order = params.dir === "asc" ? asc : desc;
  const rows = db
    .select()
    .from(auditLog)
    .where(where)
    .orderBy(order(auditLog.at), order(auditLog.id))
    .limit(window.limit)
    .offset(window.offset)
    .all();
  return { rows, total, page: window.page, pageCount: window.pageCount, pageSize };
}
