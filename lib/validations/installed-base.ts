import { z } from "zod";
import {
  atLeast,
  choice,
  int,
  money,
  num,
  pct,
  positive,
  torque,
} from "@/lib/engine/schema-fields";

// Shared by the forms, the server actions, the API and the importer. Values are stored in SI
// units; torque fields also take { value, unit } and are converted by the NIST SP 811 factors.
const name = (what: string) =>
  z.string().trim().min(1, `Enter the ${what}`).max(120, "Keep it under 120 characters");
const optionalNumber = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (v === "" || v === undefined ? null : v), schema.nullable());

export const siteInputSchema = z.object({
  name: name("site name"),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Use a three-letter ISO 4217 code such as EUR"),
  tariffPerKWh: money(),
  gridKgCo2PerKWh: atLeast(0).default(0),
  ambientC: num().min(-40, "must be at least -40 °C").max(80, "must be at most 80 °C").default(40),
  hoursPerYear: atLeast(0).max(8784, "must be at most 8784, the hours of a leap year"),
});

export const machineInputSchema = z.object({
  name: name("machine name"),
  line: z
    .string()
    .trim()
    .max(120)
    .optional()
    .transform((v) => v || null),
  downtimeHours: atLeast(0).default(0),
  throughputGainPct: pct().default(0),
  marginPerOutputHour: money().default("0"),
});

export const axisFieldsSchema = z.object({
  label: name("axis label"),
  quantity: int(1).default(1),
  // motor (datasheet values)
  rotorTeeth: int(1).default(50),
  holdingTorqueNm: torque({ positive: true }),
  ratedCurrentA: positive(),
  phaseResistanceOhm: positive(),
  phaseInductanceMh: atLeast(0),
  thermalResistanceKPerW: optionalNumber(positive()),
  ratedTempRiseK: positive().default(80),
  insulationClass: choice(["B", "F", "H"]).default("B"),
  hysteresisWPerHz: atLeast(0).default(0),
  eddyWPerHz2: atLeast(0).default(0),
  // drive (as set today)
  busVoltageV: positive(),
  currentSettingA: atLeast(0),
  currentConvention: choice(["peak", "rms"]).default("peak"),
  stepMode: choice(["full", "half", "half-compensated", "micro"]).default("micro"),
  microsteps: int(1).default(16),
  idleCurrentPct: pct().default(50),
  driveEfficiencyPct: positive().max(100, "must be at most 100").default(90),
  driveStandbyW: atLeast(0).default(2),
  // duty
  hoursPerYear: atLeast(0).max(8784, "must be at most 8784"),
  movePct: pct(),
  holdPct: pct(),
  speedRpm: atLeast(0),
  loadTorqueNm: torque(),
  peakTorqueNm: torque(),
  holdTorqueNm: torque().default(0),
  ambientC: num().default(40),
  // reliability
  stepLossEventsPerYear: atLeast(0).default(0),
  costPerEvent: money().default("0"),
  avoidedPct: pct().default(90),
});

export function checkAxisConsistency(
  a: { movePct: number; holdPct: number; loadTorqueNm: number; peakTorqueNm: number },
  ctx: z.RefinementCtx,
) {
  if (a.movePct + a.holdPct > 100) {
    ctx.addIssue({
      code: "custom",
      path: ["holdPct"],
      message: `move % + hold % is ${a.movePct + a.holdPct}; together they must be at most 100`,
    });
  }
  if (a.peakTorqueNm < a.loadTorqueNm) {
    ctx.addIssue({
      code: "custom",
      path: ["peakTorqueNm"],
      message: `must be at least the load torque (${a.loadTorqueNm} N·m)`,
    });
  }
}

export const axisInputSchema = axisFieldsSchema
  .extend({ machineId: z.coerce.number().int().positive("Choose a machine") })
  .superRefine(checkAxisConsistency);

export const axisListParamsSchema = z.object({
  page: z.coerce.number().int().min(1).catch(1),
  q: z.string().trim().max(100).optional().catch(undefined),
  machineId: z.coerce.number().int().positive().optional().catch(undefined),
  sort: z
    .enum([
      "label",
      "machine",
      "holdingTorqueNm",
      "speedRpm",
      "loadTorqueNm",
      "currentSettingA",
      "quantity",
    ])
    .catch("label"),
  dir: z.enum(["asc", "desc"]).catch("asc"),
});

export type SiteInput = z.infer<typeof siteInputSchema>;
export type MachineInput = z.infer<typeof machineInputSchema>;
export type AxisInput = z.infer<typeof axisInputSchema>;
export type AxisFields = z.infer<typeof axisFieldsSchema>;
export type AxisListParams = z.infer<typeof axisListParamsSchema>;
