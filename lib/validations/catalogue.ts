import { z } from "zod";
import { idSchema } from "@/lib/api/params";
import { atLeast, choice, int, money, pct, positive, torque } from "@/lib/engine/schema-fields";

const optional = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (v === "" || v === undefined ? null : v), schema.nullable());
const code = z
  .string()
  .trim()
  .min(1, "Enter a code")
  .max(40, "Keep the code under 40 characters")
  .regex(/^[A-Za-z0-9._-]+$/, "Use letters, digits, dot, dash or underscore");
const name = z
  .string()
  .trim()
  .min(1, "Enter a name")
  .max(120, "Keep the name under 120 characters");

export const motorInputSchema = z.object({
  code,
  name,
  frameSize: int(8, 60),
  rotorTeeth: int(1).default(50),
  holdingTorqueNm: torque({ positive: true }),
  ratedCurrentA: positive(),
  phaseResistanceOhm: positive(),
  phaseInductanceMh: positive(), // ENGINE.md §3: the engine needs L > 0 (validation)
  thermalResistanceKPerW: optional(positive()),
  ratedTempRiseK: positive().default(80),
  insulationClass: choice(["B", "F", "H"]).default("B"),
  hysteresisWPerHz: atLeast(0).default(0),
  eddyWPerHz2: atLeast(0).default(0),
});

export const kitInputSchema = z.object({
  code,
  name,
  price: money(),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Use a three-letter ISO 4217 code such as EUR"),
  sensing: choice(["encoder", "sensorless"]).default("encoder"),
  motorId: optional(idSchema()),
  maxCurrentPeakA: optional(positive()),
  busVoltageV: optional(positive()),
  efficiencyPct: positive().max(100, "must be at most 100").default(92),
  standbyW: atLeast(0).default(3),
  encoderW: optional(atLeast(0)),
  minCurrentPct: pct().default(10),
  sensorlessMinRpm: atLeast(0).default(60),
});

export type MotorCatalogueInput = z.infer<typeof motorInputSchema>;
export type KitCatalogueInput = z.infer<typeof kitInputSchema>;
