import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { UncertaintySettings } from "../../lib/validations/dossier";
import { accounts } from "./accounts";
import { proposals } from "./cases";
import { users } from "./users";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// Settings the administrators change at run time, one JSON value per key (the dossier's price).
export const appSettings = sqliteTable("app_settings", {
  key: text("key").primaryKey(),
  value: text("value", { mode: "json" }).$type<unknown>().notNull(),
  updatedById: integer("updated_by_id").references(() => users.id, { onDelete: "set null" }),
  updatedAt: text("updated_at").notNull().default(now),
});

// The uncertainty ranges and the seed of a proposal's dossier: with the frozen input, they
// rebuild the same dossier.
export const dossierSettings = sqliteTable("dossier_settings", {
  proposalId: integer("proposal_id")
    .primaryKey()
    .references(() => proposals.id, { onDelete: "cascade" }),
  settings: text("settings", { mode: "json" }).$type<UncertaintySettings>().notNull(),
  updatedById: integer("updated_by_id").references(() => users.id, { onDelete: "set null" }),
  updatedAt: text("updated_at").notNull().default(now),
});

export const CHECKOUT_STATUSES = ["open", "complete", "expired"] as const;

// A checkout session we created at the payment provider, with the price we asked for: a
// completed event is honoured only for a session of ours, at that amount and currency.
export const checkoutSessions = sqliteTable(
  "checkout_sessions",
  {
    id: text("id").primaryKey(),
    proposalId: integer("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    buyerId: integer("buyer_id").references(() => users.id, { onDelete: "set null" }),
    buyerEmail: text("buyer_email").notNull(),
    amountMinor: integer("amount_minor").notNull(),
    amount: text("amount").notNull(),
    currency: text("currency").notNull(),
    status: text("status", { enum: CHECKOUT_STATUSES }).notNull().default("open"),
    createdAt: text("created_at").notNull().default(now),
    completedAt: text("completed_at"),
  },
  (t) => [index("checkout_sessions_proposal_idx").on(t.proposalId)],
);

// Every webhook event received with a valid signature, once: its id is the key, so a replay
// finds it and changes nothing.
export const paymentEvents = sqliteTable("payment_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  sessionId: text("session_id"),
  outcome: text("outcome").notNull(),
  receivedAt: text("received_at").notNull().default(now),
});

// A paid dossier: one per proposal, for the account the proposal belongs to.
export const dossierGrants = sqliteTable(
  "dossier_grants",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    proposalId: integer("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    sessionId: text("session_id")
      .notNull()
      .references(() => checkoutSessions.id),
    eventId: text("event_id")
      .notNull()
      .references(() => paymentEvents.id),
    grantedAt: text("granted_at").notNull().default(now),
  },
  (t) => [
    uniqueIndex("dossier_grants_proposal_idx").on(t.proposalId),
    uniqueIndex("dossier_grants_session_idx").on(t.sessionId),
  ],
);

export type CheckoutSession = typeof checkoutSessions.$inferSelect;
export type DossierGrant = typeof dossierGrants.$inferSelect;
