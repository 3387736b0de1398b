import "server-only";
import { count, eq } from "drizzle-orm";
import { db } from "@/db";
import { mailQueue } from "@/db/schema";
import {
  attemptDelivery,
  flushQueue,
  QUEUED_NOTICE,
  retryDelayMs,
  type MailDelivery,
} from "./delivery";
import type { MailContent } from "@/lib/mail/layout";

export type { MailDelivery };

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0] | typeof db;

/** Writes a message into the queue, inside the caller's transaction; delivery comes after. */
export function enqueueMail(tx: Tx, to: { email: string; name?: string }, content: MailContent) {
  const [row] = tx
    .insert(mailQueue)
    .values({ toAddress: to.email, toName: to.name ?? null, ...content })
    .returning({ id: mailQueue.id })
    .all();
  return row.id;
}

let retryTimer: ReturnType<typeof setTimeout> | null = null;

// The app server's own retry, for when it runs without `npm start`'s loop beside it.
function scheduleRetry() {
  if (retryTimer) return;
  retryTimer = setTimeout(() => {
    retryTimer = null;
    flushMailQueue()
      .then(() => {
        if (pendingMailCount() > 0) scheduleRetry();
      })
      .catch((error) => console.error("Mail retry failed:", error));
  }, retryDelayMs(1));
  retryTimer.unref?.();
}

/** Tries the queued messages now; a refusal leaves them queued and the user is told so. */
export async function deliverMail(ids: number[]): Promise<MailDelivery> {
  let allSent = true;
  for (const id of ids) if (!(await attemptDelivery(db, id))) allSent = false;
  if (!allSent) {
    scheduleRetry();
    return { status: "queued", notice: QUEUED_NOTICE };
  }
  // A server that answers again also takes what waited for it.
  if (pendingMailCount() > 0) void flushMailQueue();
  return { status: "sent" };
}

export function flushMailQueue(now = new Date()) {
  return flushQueue(db, now);
}

export function pendingMailCount(): number {
  return db.select({ n: count() }).from(mailQueue).where(eq(mailQueue.status, "pending")).get()!.n;
}
