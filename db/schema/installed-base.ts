import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { ParsedMotion } from "../../lib/engine/schema";
import { AXIS_FIELDS as A } from "../../lib/fields";
import { accounts } from "./accounts";
import { motors } from "./catalogue";

const createdAt = () =>
  text("created_at")
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);

// A plant of a customer account: its tariff, grid factor, climate and working hours are the
// defaults of every case built on its machines. Money is kept as decimal text (docs/model.md).
export const sites = sqliteTable(
  "sites",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    accountId: integer("account_id")
      .notNull()
      .references(() => accounts.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    currency: text("currency").notNull(),
    tariffPerKWh: text("tariff_per_kwh").notNull(),
    gridKgCo2PerKWh: real("grid_kg_co2_per_kwh").notNull().default(0),
    ambientC: real("ambient_c").notNull().default(A.ambientC.default),
    hoursPerYear: real("hours_per_year").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("sites_account_name_idx").on(t.accountId, t.name)],
);

export const machines = sqliteTable(
  "machines",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    siteId: integer("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    line: text("line"),
    downtimeHours: real("downtime_hours").notNull().default(0),
    throughputGainPct: real("throughput_gain_pct").notNull().default(0),
    marginPerOutputHour: text("margin_per_output_hour").notNull().default("0"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("machines_site_name_idx").on(t.siteId, t.name)],
);

import type { StoredResonance, StoredStepLossEvent } from "../../lib/engine/stored";
export type { StoredResonance, StoredStepLossEvent };

// Column defaults and choices are the field registry's (lib/fields/axis.ts).
// One open-loop axis as installed: every AxisInput field of docs/model.md but the retrofit, in SI
// units (torque N·m, inductance mH, speed rpm, inertia kg·m²). site_id is repeated from the
// machine so that a site's axes page straight off one index.
// The optional objects of engine v2 (motion, resonance, step-loss event) are JSON columns holding
// what the engine's own schema parsed, so they need no column per field and load back as the
// engine reads them. With motion, docs/model.md (Motion from the mechanism) derives speed, torques and duty shares: the typed duty
// columns then keep whatever was typed (0 when left blank) and are not sent to the engine. They
// stay NOT NULL because relaxing them would rebuild this table, which the case rows reference
// with ON DELETE CASCADE and the input-revision triggers watch — a risk to stored data that a
// placeholder does not carry.
export const axes = sqliteTable(
  "axes",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    siteId: integer("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    machineId: integer("machine_id")
      .notNull()
      .references(() => machines.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    quantity: integer("quantity").notNull().default(A.quantity.default),
    assetTag: text("asset_tag"),
    referenceMotorId: integer("reference_motor_id").references(() => motors.id, {
      onDelete: "set null",
    }),
    // motor
    rotorTeeth: integer("rotor_teeth").notNull().default(A.rotorTeeth.default),
    holdingTorqueNm: real("holding_torque_nm").notNull(),
    ratedCurrentA: real("rated_current_a").notNull(),
    phaseResistanceOhm: real("phase_resistance_ohm").notNull(),
    phaseInductanceMh: real("phase_inductance_mh").notNull(),
    thermalResistanceKPerW: real("thermal_resistance_k_per_w"),
    ratedTempRiseK: real("rated_temp_rise_k").notNull().default(A.ratedTempRiseK.default),
    insulationClass: text("insulation_class", { enum: A.insulationClass.choices })
      .notNull()
      .default(A.insulationClass.default),
    hysteresisWPerHz: real("hysteresis_w_per_hz").notNull().default(A.hysteresisWPerHz.default),
    eddyWPerHz2: real("eddy_w_per_hz2").notNull().default(A.eddyWPerHz2.default),
    pullOutCurve: text("pull_out_curve", { mode: "json" }).$type<
      { rpm: number; torqueNm: number }[]
    >(),
    // drive
    busVoltageV: real("bus_voltage_v").notNull(),
    currentSettingA: real("current_setting_a").notNull(),
    currentConvention: text("current_convention", { enum: A.currentConvention.choices })
      .notNull()
      .default(A.currentConvention.default),
    stepMode: text("step_mode", { enum: A.stepMode.choices }).notNull().default(A.stepMode.default),
    microsteps: integer("microsteps").notNull().default(A.microsteps.default),
    idleCurrentPct: real("idle_current_pct").notNull().default(A.idleCurrentPct.default),
    driveEfficiencyPct: real("drive_efficiency_pct")
      .notNull()
      .default(A.driveEfficiencyPct.default),
    driveStandbyW: real("drive_standby_w").notNull().default(A.driveStandbyW.default),
    resonance: text("resonance", { mode: "json" }).$type<StoredResonance>(),
    // duty
    hoursPerYear: real("hours_per_year").notNull(),
    movePct: real("move_pct").notNull(),
    holdPct: real("hold_pct").notNull(),
    speedRpm: real("speed_rpm").notNull(),
    loadTorqueNm: real("load_torque_nm").notNull(),
    peakTorqueNm: real("peak_torque_nm").notNull(),
    holdTorqueNm: real("hold_torque_nm").notNull().default(A.holdTorqueNm.default),
    ambientC: real("ambient_c").notNull().default(A.ambientC.default),
    motion: text("motion", { mode: "json" }).$type<ParsedMotion>(),
    // reliability
    stepLossEventsPerYear: real("step_loss_events_per_year")
      .notNull()
      .default(A.stepLossEventsPerYear.default),
    costPerEvent: text("cost_per_event").notNull().default(A.costPerEvent.default),
    avoidedPct: real("avoided_pct").notNull().default(A.avoidedPct.default),
    // reliability.event of the engine (named so in the API too): the cost of one step-loss event
    // built from what it causes; with it, cost_per_event is not sent to the engine.
    event: text("step_loss_event", { mode: "json" }).$type<StoredStepLossEvent>(),
    createdAt: createdAt(),
  },
  (t) => [
    index("axes_site_label_idx").on(t.siteId, t.label),
    index("axes_machine_idx").on(t.machineId),
  ],
);

export type Site = typeof sites.$inferSelect;
export type Machine = typeof machines.$inferSelect;
export type Axis = typeof axes.$inferSelect;
export type NewAxis = typeof axes.$inferInsert;
