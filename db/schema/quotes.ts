import { sql } from "drizzle-orm";
import { check, index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { QUOTE_STAGES, type QuoteStage } from "../../lib/pipeline/stages";
import { proposals } from "./cases";
import { users } from "./users";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// The word list lives in lib/pipeline/stages.ts, below the database, so pure code can use it.
export { QUOTE_STAGES, type QuoteStage };

// The sales side of a frozen proposal: one row per proposal. A proposal's input and result never
// change (a trigger refuses it), so everything that moves while it is sold lives here. Value,
// currency, payback and the largest kit discount are copied from the frozen snapshot once, so
// that the pipeline sums and filters them without reading megabytes of result JSON. So is the
// vendor's revenue with its parts (lib/pipeline/revenue.ts), as exact decimal strings: the
// pipeline no longer works it out of every frozen input on each read. They are null only on a
// quote frozen before they existed and not yet filled in (db/backfill-vendor-revenue.ts).
export const quotes = sqliteTable(
  "quotes",
  {
    proposalId: integer("proposal_id")
      .primaryKey()
      .references(() => proposals.id, { onDelete: "cascade" }),
    stage: text("stage", { enum: QUOTE_STAGES }).notNull().default("ready"),
    ownerId: integer("owner_id")
      .notNull()
      .references(() => users.id),
    value: text("value").notNull(),
    currency: text("currency").notNull(),
    paybackYears: real("payback_years"),
    maxDiscountPct: real("max_discount_pct").notNull().default(0),
    vendorRevenue: text("vendor_revenue"),
    revenueKitsAtListPrice: text("revenue_kits_at_list_price"),
    revenueDiscounts: text("revenue_discounts"),
    revenueInstallation: text("revenue_installation"),
    revenueCommissioning: text("revenue_commissioning"),
    expectedCloseOn: text("expected_close_on").notNull(),
    sentAt: text("sent_at"),
    sentToId: integer("sent_to_id").references(() => users.id, { onDelete: "set null" }),
    decidedAt: text("decided_at"),
    discountApprovedById: integer("discount_approved_by_id").references(() => users.id, {
      onDelete: "set null",
    }),
    discountApprovedAt: text("discount_approved_at"),
    updatedAt: text("updated_at").notNull().default(now),
  },
  (t) => [
    index("quotes_stage_idx").on(t.stage),
    index("quotes_owner_idx").on(t.ownerId),
    index("quotes_close_idx").on(t.expectedCloseOn),
  ],
);

// The administrator's sales settings: one row (id 1). Missing means the defaults of
// lib/pipeline/settings.ts.
export const salesSettings = sqliteTable(
  "sales_settings",
  {
    id: integer("id").primaryKey(),
    discountThresholdPct: real("discount_threshold_pct").notNull(),
    stageProbabilities: text("stage_probabilities", { mode: "json" })
      .$type<Record<QuoteStage, number>>()
      .notNull(),
    updatedAt: text("updated_at").notNull().default(now),
  },
  (t) => [check("sales_settings_one_row", sql`${t.id} = 1`)],
);

export type Quote = typeof quotes.$inferSelect;
