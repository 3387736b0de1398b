import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { caseInputSchema } from "../engine/schema";
import { bounded, money, pct } from "../engine/schema-fields";

// The engine's own sub-schemas, taken from its CaseInput schema so that a case's stored
// assumptions are validated — and defaulted — exactly as the engine will validate them.
const engine = caseInputSchema.shape;
export const financeSchema = engine.finance;
export const marginsSchema = engine.margins;
export const bandSchema = engine.band;
export const sensitivitySchema = engine.sensitivity;
export const thermalSchema = engine.thermal;

export const caseAssumptionsSchema = z.object({
  finance: financeSchema,
  margins: marginsSchema,
  band: bandSchema,
  sensitivity: sensitivitySchema,
  thermal: thermalSchema,
});

export const createCaseSchema = z.object({
  name: z
    .string()
    .trim()
    .min(1, "Enter a name for the case")
    .max(120, "Keep the name under 120 characters"),
  siteId: idSchema("Choose a site"),
});

const recordId = idSchema();

export const caseAxesSchema = z.object({
  // Repeats collapse: picking an axis twice is picking it once.
  axisIds: z
    .array(recordId)
    .max(100000, "A case holds at most 100000 axes")
    .transform((ids) => [...new Set(ids)]),
});

export const axisRetrofitSchema = z.object({
  kitId: recordId,
  discountPct: pct().default(0),
  installHours: bounded("installHours").default(0),
  commissioningCost: money().default("0"),
  maintenanceSavingPerYear: money().default("0"),
});

// A case or proposal named by its id alone (suggest kits, freeze).
export const caseIdSchema = recordId;

export type CaseAssumptionsInput = z.input<typeof caseAssumptionsSchema>;
export type CaseAssumptions = z.output<typeof caseAssumptionsSchema>;
export type CreateCaseInput = z.output<typeof createCaseSchema>;
export type CaseAxesInput = z.output<typeof caseAxesSchema>;
export type AxisRetrofitInput = z.output<typeof axisRetrofitSchema>;
