import { desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { mailQueue, outbox } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";

/** What the local mail catcher received, newest first (administrators only). */
export function listOutbox(caller: SessionUser, limit = 200) {
  assertRole(caller, "admin");
  return db
    .select({
      id: outbox.id,
      to: outbox.to,
      subject: outbox.subject,
      text: outbox.text,
      html: outbox.html,
      createdAt: outbox.createdAt,
    })
    .from(outbox)
    .orderBy(desc(outbox.createdAt), desc(outbox.id))
    .limit(limit)
    .all();
}

/** Messages still waiting for the mail server, oldest first. */
export function listWaitingMail(caller: SessionUser) {
  assertRole(caller, "admin");
  return db
    .select({
      id: mailQueue.id,
      to: mailQueue.toAddress,
      subject: mailQueue.subject,
      attempts: mailQueue.attempts,
      lastError: mailQueue.lastError,
      nextAttemptAt: mailQueue.nextAttemptAt,
      createdAt: mailQueue.createdAt,
    })
    .from(mailQueue)
    .where(eq(mailQueue.status, "pending"))
    .orderBy(mailQueue.id)
    .all();
}
