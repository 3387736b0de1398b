import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import {
  bounded,
  boundedInt,
  choice,
  holdingTorque,
  int,
  money,
  pct,
} from "@/lib/engine/schema-fields";

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
  rotorTeeth: boundedInt("rotorTeeth").default(50),
  holdingTorqueNm: holdingTorque(),
  ratedCurrentA: bounded("ratedCurrentA"),
  phaseResistanceOhm: bounded("phaseResistanceOhm"),
  phaseInductanceMh: bounded("phaseInductanceMh"), // docs/model.md (Torque at speed): the engine needs L > 0
  thermalResistanceKPerW: optional(bounded("thermalResistanceKPerW")),
  ratedTempRiseK: bounded("ratedTempRiseK").default(80),
  insulationClass: choice(["B", "F", "H"]).default("B"),
  hysteresisWPerHz: bounded("hysteresisWPerHz").default(0),
  eddyWPerHz2: bounded("eddyWPerHz2").default(0),
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
  maxCurrentPeakA: optional(bounded("maxCurrentPeakA")),
  busVoltageV: optional(bounded("busVoltageV")),
  efficiencyPct: bounded("efficiencyPct").default(92),
  standbyW: bounded("standbyW").default(3),
  encoderW: optional(bounded("standbyW")),
  minCurrentPct: pct().default(10),
  sensorlessMinRpm: bounded("speedRpm").default(60),
});

export type MotorCatalogueInput = z.infer<typeof motorInputSchema>;
export type KitCatalogueInput = z.infer<typeof kitInputSchema>;
