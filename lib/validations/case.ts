import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { caseInputSchema } from "../engine/schema";
import { bounded, money, pct } from "../engine/schema-fields";
import { inWords } from "./in-words";

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

// The retrofit terms by name, for messages and the table's labels.
export const RETROFIT_LABELS = {
  kitId: "Kit",
  discountPct: "Discount %",
  installHours: "Install hours",
  commissioningCost: "Commissioning cost",
  maintenanceSavingPerYear: "Maintenance saving a year",
} as const;

// Each term as the case's axis table takes it: typed text is read as a person writes it ("0,5"),
// and messages name the term (lib/validations/in-words.ts).
export const axisRetrofitSchema = z.object({
  kitId: recordId,
  discountPct: inWords(RETROFIT_LABELS.discountPct, "5", pct().default(0)),
  installHours: inWords(RETROFIT_LABELS.installHours, "2.5", bounded("installHours").default(0)),
  commissioningCost: inWords(
    RETROFIT_LABELS.commissioningCost,
    "120.00",
    money().default("0"),
    "amount",
  ),
  maintenanceSavingPerYear: inWords(
    RETROFIT_LABELS.maintenanceSavingPerYear,
    "40.00",
    money().default("0"),
    "amount",
  ),
});

/**
 * A field a bulk step may leave blank (unchanged): blank is undefined; any other value must pass
 * the field's own schema, and each of its messages starts with the field's name, so "must be at
 * most 100" reads "Discount % must be at most 100" wherever it is shown.
 */
function blankOr<T extends z.ZodType>(
  label: string,
  example: string,
  schema: T,
  kind: "number" | "amount" | "id" = "number",
) {
  // An id is never typed with a comma; the others are read as a person writes them. Null and
  // blank text are "not given"; optional(): a missing key stays missing.
  return inWords(label, example, schema.optional(), kind === "id" ? "as-is" : kind).optional();
}

// One step over many axes of a case: the fields given are set on every selected axis, the
// blank ones stay as they are on each.
export const bulkRetrofitSchema = z
  .object({
    axisIds: z
      .array(recordId, { error: "Select the axes to change" })
      .min(1, "Select at least one axis")
      .max(100000, "A case holds at most 100000 axes")
      .transform((ids) => [...new Set(ids)]),
    kitId: blankOr(
      RETROFIT_LABELS.kitId,
      "a kit",
      idSchema("must be a kit of the catalogue"),
      "id",
    ),
    discountPct: blankOr(RETROFIT_LABELS.discountPct, "5", pct()),
    installHours: blankOr(RETROFIT_LABELS.installHours, "2.5", bounded("installHours")),
    commissioningCost: blankOr(RETROFIT_LABELS.commissioningCost, "120.00", money(), "amount"),
  })
  .refine(
    (v) =>
      v.kitId !== undefined ||
      v.discountPct !== undefined ||
      v.installHours !== undefined ||
      v.commissioningCost !== undefined,
    {
      message:
        "Fill in at least one of kit, discount %, install hours or commissioning cost to set",
      path: ["form"],
    },
  );

const caseName = z
  .string({ error: "Enter a name for the case" })
  .trim()
  .min(1, "Enter a name for the case")
  .max(120, "Keep the name under 120 characters");

export const CASE_NOTES_MAX = 4000;

// The case's own words: its name and free notes (blank notes are none).
export const caseDetailsSchema = z.object({
  name: caseName,
  notes: z
    .string({ error: "Notes must be text" })
    .trim()
    .max(CASE_NOTES_MAX, `Keep the notes under ${CASE_NOTES_MAX.toLocaleString("en")} characters`)
    .optional()
    .transform((v) => (v ? v : null)),
});

// A copy of a case: only its name is asked, the rest comes from the case copied.
export const duplicateCaseSchema = z.object({ name: caseName });

// A case or proposal named by its id alone (suggest kits, freeze).
export const caseIdSchema = recordId;

export type CaseAssumptionsInput = z.input<typeof caseAssumptionsSchema>;
export type CaseAssumptions = z.output<typeof caseAssumptionsSchema>;
export type CreateCaseInput = z.output<typeof createCaseSchema>;
export type CaseAxesInput = z.output<typeof caseAxesSchema>;
export type AxisRetrofitInput = z.output<typeof axisRetrofitSchema>;
export type BulkRetrofitInput = z.output<typeof bulkRetrofitSchema>;
export type CaseDetailsInput = z.output<typeof caseDetailsSchema>;
export type DuplicateCaseInput = z.output<typeof duplicateCaseSchema>;
