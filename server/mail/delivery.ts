// No "server-only" guard here: lib/cli/app-server.ts and lib/cli/start.ts load this file with
// plain tsx, outside a React Server Component bundle, where the guard would throw.
import { and, asc, eq, lte } from "drizzle-orm";
import type { Db } from "../../db/client";
import { mailQueue } from "../../db/schema/mail";
import { mailFrom, smtpTransport } from "./transport";

// Delivery of queued messages over SMTP. It takes the database as an argument so that both the
// app server and `npm start` (which keeps a retry loop running beside it) can deliver; a lease
// on each row makes sure two of them never send the same message twice.

export type MailDelivery = { status: "sent" } | { status: "queued"; notice: string };

export const QUEUED_NOTICE =
  "The e-mail could not be handed to the mail server just now. It is queued and will be sent automatically as soon as the server answers; nothing else needs doing.";

// How long a sender holds a message it is delivering, before another may try it.
const LEASE_MS = 60_000;

// Waits before retrying a message that failed n times: 30 s, 1 min, 2 min … at most 15 min.
export function retryDelayMs(attempts: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 15 * 60_000);
}

function claim(db: Db, id: number, now: Date): boolean {
  const result = db
    .update(mailQueue)
    .set({ nextAttemptAt: new Date(now.getTime() + LEASE_MS).toISOString() })
    .where(
      and(
        eq(mailQueue.id, id),
        eq(mailQueue.status, "pending"),
        lte(mailQueue.nextAttemptAt, now.toISOString()),
      ),
    )
    .run();
  return result.changes === 1;
}

/** One delivery attempt of a pending message; false when it failed or someone else holds it. */
export async function attemptDelivery(db: Db, id: number, now = new Date()): Promise<boolean> {
  if (!claim(db, id, now)) return false;
  const row = db.select().from(mailQueue).where(eq(mailQueue.id, id)).get()!;
  try {
    await smtpTransport().sendMail({
      from: mailFrom(),
      to: row.toName ? { name: row.toName, address: row.toAddress } : row.toAddress,
      subject: row.subject,
      text: row.text,
      html: row.html,
    });
    db.update(mailQueue)
      .set({ status: "sent", sentAt: new Date().toISOString(), attempts: row.attempts + 1 })
      .where(eq(mailQueue.id, id))
      .run();
    return true;
  } catch (error) {
    const attempts = row.attempts + 1;
    db.update(mailQueue)
      .set({
        attempts,
        lastError: error instanceof Error ? error.message.slice(0, 500) : String(error),
        nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts)).toISOString(),
      })
      .where(eq(mailQueue.id, id))
      .run();
    return false;
  }
}

/** Delivers every pending message whose retry time has come; returns how many went out. */
export async function flushQueue(db: Db, now = new Date()): Promise<number> {
  const due = db
    .select({ id: mailQueue.id })
    .from(mailQueue)
    .where(and(eq(mailQueue.status, "pending"), lte(mailQueue.nextAttemptAt, now.toISOString())))
    .orderBy(asc(mailQueue.id))
    .all();
  let sent = 0;
  for (const { id } of due) if (await attemptDelivery(db, id, now)) sent++;
  return sent;
}

/** Retries the queue every interval for as long as the process runs. */
export function startRetryLoop(db: Db, intervalMs = 30_000) {
  let running = false;
  const timer = setInterval(() => {
    if (running) return;
    running = true;
    flushQueue(db)
      .catch((error) => console.error("Mail retry failed:", error))
      .finally(() => (running = false));
  }, intervalMs);
  timer.unref?.();
  return () => clearInterval(timer);
}
