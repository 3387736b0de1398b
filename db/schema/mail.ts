import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// Every message the app sends is written here first, in the same transaction as the change that
// causes it, and delivered over SMTP afterwards; a message the server refused stays pending and
// is retried, so a mail server that is down never loses a message nor fails the user's action.
export const mailQueue = sqliteTable(
  "mail_queue",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    toAddress: text("to_address").notNull(),
    toName: text("to_name"),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    status: text("status", { enum: ["pending", "sent"] })
      .notNull()
      .default("pending"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    nextAttemptAt: text("next_attempt_at").notNull().default(now),
    sentAt: text("sent_at"),
    createdAt: text("created_at").notNull().default(now),
  },
  (t) => [index("mail_queue_due_idx").on(t.status, t.nextAttemptAt)],
);

// What the local fake SMTP server received, parsed: the outbox administrators and tests read.
export const outbox = sqliteTable(
  "outbox",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    messageId: text("message_id"),
    fromAddress: text("from_address"),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    createdAt: text("created_at").notNull().default(now),
  },
  (t) => [index("outbox_created_idx").on(t.createdAt)],
);

export type MailQueueRow = typeof mailQueue.$inferSelect;
export type OutboxMessage = typeof outbox.$inferSelect;
