import { sql } from "drizzle-orm";
import { integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { AXIS_FIELDS as A, KIT_FIELDS as K } from "../../lib/fields";

const createdAt = () =>
  text("created_at")
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);

// Reference open-loop motors (and the new motors some kits bring): MotorInput of docs/model.md, SI units.
export const motors = sqliteTable("motors", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  frameSize: integer("frame_size").notNull(), // NEMA 17, 23, 34: flange ≈ size/10 in (NEMA ICS 16)
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
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  createdAt: createdAt(),
});

// Closed-loop retrofit kits: KitInput of docs/model.md, with the price in a currency.
export const kits = sqliteTable("kits", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  price: text("price").notNull(),
  currency: text("currency").notNull(),
  sensing: text("sensing", { enum: K.sensing.choices }).notNull().default(K.sensing.default),
  motorId: integer("motor_id").references(() => motors.id, { onDelete: "restrict" }),
  maxCurrentPeakA: real("max_current_peak_a"),
  busVoltageV: real("bus_voltage_v"),
  efficiencyPct: real("efficiency_pct").notNull().default(K.efficiencyPct.default),
  standbyW: real("standby_w").notNull().default(K.standbyW.default),
  encoderW: real("encoder_w"),
  minCurrentPct: real("min_current_pct").notNull().default(K.minCurrentPct.default),
  sensorlessMinRpm: real("sensorless_min_rpm").notNull().default(K.sensorlessMinRpm.default),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  createdAt: createdAt(),
});

export type Motor = typeof motors.$inferSelect;
export type Kit = typeof kits.$inferSelect;
