import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import {
  choiceField,
  holdingTorque,
  int,
  money,
  numberField,
  presence,
  ranged,
} from "@/lib/engine/schema-fields";
import { AXIS_FIELDS as A, KIT_FIELDS as K } from "@/lib/fields";
import { typedAmount } from "./typed-number";

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
  // A catalogue motor carries the motor fields of an axis (lib/fields/axis.ts), as the engine reads them.
  rotorTeeth: numberField(A.rotorTeeth),
  holdingTorqueNm: presence(holdingTorque(), A.holdingTorqueNm),
  ratedCurrentA: numberField(A.ratedCurrentA),
  phaseResistanceOhm: numberField(A.phaseResistanceOhm),
  phaseInductanceMh: numberField(A.phaseInductanceMh), // docs/model.md (Torque at speed): the engine needs L > 0
  thermalResistanceKPerW: optional(ranged(A.thermalResistanceKPerW.range)),
  ratedTempRiseK: numberField(A.ratedTempRiseK),
  insulationClass: choiceField(A.insulationClass),
  hysteresisWPerHz: numberField(A.hysteresisWPerHz),
  eddyWPerHz2: numberField(A.eddyWPerHz2),
});

export const kitInputSchema = z.object({
  code,
  name,
  // "189,00" is read as 189.00, as a person types it (lib/validations/typed-number.ts).
  price: typedAmount("Price per axis", money()),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Use a three-letter ISO 4217 code such as EUR"),
  // The kit fields of the registry (lib/fields/kit.ts); an empty box of an optional one is null.
  sensing: choiceField(K.sensing),
  motorId: optional(idSchema()),
  maxCurrentPeakA: optional(ranged(K.maxCurrentPeakA.range)),
  busVoltageV: optional(ranged(K.busVoltageV.range)),
  efficiencyPct: numberField(K.efficiencyPct),
  standbyW: numberField(K.standbyW),
  encoderW: optional(ranged(K.encoderW.range)),
  minCurrentPct: numberField(K.minCurrentPct),
  sensorlessMinRpm: numberField(K.sensorlessMinRpm),
});

export type MotorCatalogueInput = z.infer<typeof motorInputSchema>;
export type KitCatalogueInput = z.infer<typeof kitInputSchema>;
