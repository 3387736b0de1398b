import { sql } from "drizzle-orm";
import {
  index,
  integer,
  primaryKey,
  real,
  sqliteTable,
  text,
  uniqueIndex,
} from "drizzle-orm/sqlite-core";
import type { CaseInput, CaseResult } from "../../lib/engine";
import type { CaseAssumptions } from "../../lib/validations/case";
import { CASE_STAGES, type CaseStage } from "../../lib/cases/stages";
import { accounts } from "./accounts";
import { kits } from "./catalogue";
import { axes, sites } from "./installed-base";
import { users } from "./users";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// The word list lives in lib/cases/stages.ts, below the database, so pure code can use it.
export { CASE_STAGES, type CaseStage };

// A retrofit business case on part of one site's installed base. account_id is repeated from the
// site so that the account scope goes straight into the WHERE clause. The assumptions are the
// finance, margins, band, sensitivity and thermal parts of the engine's CaseInput, as parsed by
// its schema (defaults filled, money as decimal strings).
export const cases = sqliteTable(
  "cases",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    siteId: integer("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    ownerId: integer("owner_id")
      .notNull()
      .references(() => users.id),
    name: text("name").notNull(),
    notes: text("notes"),
    stage: text("stage", { enum: CASE_STAGES }).notNull().default("draft"),
    assumptions: text("assumptions", { mode: "json" }).$type<CaseAssumptions>().notNull(),
    createdAt: text("created_at").notNull().default(now),
    updatedAt: text("updated_at").notNull().default(now),
  },
  (t) => [index("cases_account_idx").on(t.accountId), index("cases_site_idx").on(t.siteId)],
);

// The axes picked for a case and the retrofit proposed for each. A kit in use cannot be deleted
// (restrict); the catalogue retires kits instead, and a case keeps the retired kit it names.
export const caseAxes = sqliteTable(
  "case_axes",
  {
    caseId: integer("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    axisId: integer("axis_id")
      .notNull()
      .references(() => axes.id, { onDelete: "cascade" }),
    kitId: integer("kit_id")
      .notNull()
      .references(() => kits.id, { onDelete: "restrict" }),
    discountPct: real("discount_pct").notNull().default(0),
    installHours: real("install_hours").notNull().default(0),
    commissioningCost: text("commissioning_cost").notNull().default("0"),
    maintenanceSavingPerYear: text("maintenance_saving_per_year").notNull().default("0"),
  },
  (t) => [
    primaryKey({ columns: [t.caseId, t.axisId] }),
    // Deleting an axis or a kit looks its case rows up by these.
    index("case_axes_axis_idx").on(t.axisId),
    index("case_axes_kit_idx").on(t.kitId),
  ],
);

// A frozen proposal: the exact input the engine received and the result it gave, so that the
// figures sent to a customer never move when the case, the installed base or the catalogue does.
export const proposals = sqliteTable(
  "proposals",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    caseId: integer("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    input: text("input", { mode: "json" }).$type<CaseInput>().notNull(),
    result: text("result", { mode: "json" }).$type<CaseResult>().notNull(),
    engineVersion: text("engine_version").notNull(),
    createdById: integer("created_by_id")
      .notNull()
      .references(() => users.id),
    createdAt: text("created_at").notNull().default(now),
  },
  (t) => [uniqueIndex("proposals_case_version_idx").on(t.caseId, t.version)],
);

export type Case = typeof cases.$inferSelect;
export type CaseAxis = typeof caseAxes.$inferSelect;
export type Proposal = typeof proposals.$inferSelect;
