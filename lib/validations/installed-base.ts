import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import {
  bounded,
  money,
  formShape,
  numberField,
  pct,
  torqueField,
} from "@/lib/engine/schema-fields";
import { AXIS_FIELDS } from "@/lib/fields";
import { listParamsSchema } from "@/lib/lists/list-params";
import { typedAmount } from "./typed-number";
import { axisInputSchema as engineAxisSchema, stepLossEventSchema } from "@/lib/engine/schema";

// Shared by the forms, the server actions, the API and the importer. Values are stored in SI
// units; torque fields also take { value, unit } and are converted by the NIST SP 811 factors.
const name = (what: string) =>
  z.string().trim().min(1, `Enter the ${what}`).max(120, "Keep it under 120 characters");

export const siteInputSchema = z.object({
  name: name("site name"),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Use a three-letter ISO 4217 code such as EUR"),
  tariffPerKWh: typedAmount("Electricity tariff", money()),
  gridKgCo2PerKWh: bounded("gridKgCo2PerKWh").default(0),
  // The site's ambient and hours are the defaults of its axes' fields of the same name.
  ambientC: numberField(AXIS_FIELDS.ambientC),
  hoursPerYear: numberField(AXIS_FIELDS.hoursPerYear),
});

export const machineInputSchema = z.object({
  name: name("machine name"),
  // nullish: the form sends what this schema made of a blank line (null) to the server action,
  // which parses it again with this same schema.
  line: z
    .string()
    .trim()
    .max(120, "Line: keep it under 120 characters")
    .nullish()
    .transform((v) => v || null),
  downtimeHours: bounded("downtimeHours").default(0),
  throughputGainPct: pct().default(0),
  marginPerOutputHour: typedAmount("Margin per output hour", money().default("0")),
});

const A = AXIS_FIELDS;

// Built from the registry (lib/fields/axis.ts): every axis field with its range, choices and
// default, so that a field added there is on the form and the API with no edit here.
// Amounts are typed as text, so "250,00" is read here as the number fields are read on the form
// (lib/validations/typed-number.ts); the engine's JSON contract keeps its decimal point.
const axisShape = formShape(A);
export const axisFieldsSchema = z.object({
  ...axisShape,
  costPerEvent: typedAmount(A.costPerEvent.label, axisShape.costPerEvent),
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

// The catalogue motor whose figures the form took (components/installed-base/axis-form.tsx);
// blank when the figures were typed from a datasheet.
// Left out, the stored one stays (an update from the importer or an older client).
const referenceMotorField = z.preprocess(
  (v) => (v === "" ? null : v),
  idSchema("Choose a motor from the catalogue, or none").nullable().optional(),
);

/**
 * How the axis form gives the cost of one step-loss event (docs/model.md (The business case)):
 * "typed" as one figure (costPerEvent), or "built" up from downtime, scrap and restart labour
 * (the engine's reliability.event), priced with the case's downtime cost and labour rate.
 */
export const STEP_LOSS_COST_MODES = ["typed", "built"] as const;
export type StepLossCostMode = (typeof STEP_LOSS_COST_MODES)[number];

/**
 * The way the cost is given: as chosen, or read from `event` alone — the action parses again what
 * the form's own parse made (an event object, or null for a typed cost), which names no mode.
 */
function costModeOf(a: { costMode?: StepLossCostMode; event?: unknown }) {
  if (a.costMode !== undefined) return a.costMode;
  if (a.event === undefined) return undefined;
  return a.event === null ? "typed" : "built";
}

export const axisInputSchema = axisFieldsSchema
  .extend({
    machineId: idSchema("Choose a machine"),
    referenceMotorId: referenceMotorField,
    // Left out (the importer, an older client), the stored event stays as it is.
    costMode: z.enum(STEP_LOSS_COST_MODES).optional(),
    // Checked only when the cost is built up: the boxes of the other way are not sent.
    event: z.unknown().optional(),
  })
  .superRefine((a, ctx) => {
    checkAxisConsistency(a, ctx);
    if (costModeOf(a) !== "built") return;
    const parsed = stepLossEventSchema.safeParse(a.event ?? {});
    if (!parsed.success)
      for (const issue of parsed.error.issues)
        ctx.addIssue({
          code: "custom",
          path: ["event", ...issue.path.map(String)],
          message: issue.message,
        });
  })
  .transform(({ costMode: _mode, event, ...axis }) => {
    const costMode = costModeOf({ costMode: _mode, event });
    if (costMode === undefined) return axis;
    if (costMode === "typed") return { ...axis, event: null };
    // As over the API: with the cost built up, costPerEvent is not a figure of the axis and
    // keeps its registry default.
    const unused = A.costPerEvent.default;
    return { ...axis, costPerEvent: unused, event: stepLossEventSchema.parse(event ?? {}) };
  });

// The engine's own schemas for the optional objects of docs/model.md, taken from its axis schema
// (with the radius/lead and fromRpm/toRpm rules), so that the API refuses exactly what the engine
// would and stores them as the engine parses them (inertia in kg·m², defaults filled).
const engineAxis = engineAxisSchema.shape;
export const motionSchema = engineAxis.duty.shape.motion.unwrap();
export const resonanceSchema = engineAxis.drive.shape.resonance.unwrap();
export { stepLossEventSchema };

// One axis is a few kB even with its motion; a JSON body far larger is not an axis.
export const MAX_AXIS_BYTES = 256 * 1024;

// Figures that docs/model.md (Motion from the mechanism) derives when motion is given; without motion they are required.
const MOTION_SUPPLIED = ["movePct", "holdPct", "speedRpm", "loadTorqueNm", "peakTorqueNm"] as const;

/**
 * An axis over the JSON API: the form's fields plus `motion`, `event` and `resonance`. A body
 * states the whole axis, so on update an object left out (or null) is removed. With motion the
 * duty figures may be left out; they are then stored as 0, a placeholder the engine never
 * receives (db/queries/case-input.ts).
 */
export const axisApiSchema = axisFieldsSchema
  .extend({
    machineId: idSchema(),
    movePct: numberField(A.movePct).optional(),
    holdPct: numberField(A.holdPct).optional(),
    speedRpm: numberField(A.speedRpm).optional(),
    loadTorqueNm: torqueField(A.loadTorqueNm).optional(),
    peakTorqueNm: torqueField(A.peakTorqueNm).optional(),
    // Absent = "0", or built from `event`; both at once is refused, as the engine does.
    costPerEvent: money().optional(),
    motion: motionSchema.nullable().optional(),
    event: stepLossEventSchema.nullable().optional(),
    resonance: resonanceSchema.nullable().optional(),
  })
  .superRefine((a, ctx) => {
    if (!a.motion) {
      for (const field of MOTION_SUPPLIED)
        if (a[field] === undefined)
          ctx.addIssue({
            code: "custom",
            path: [field],
            message: "required: expected a number (or give motion to derive it)",
          });
    }
    if (
      a.movePct !== undefined &&
      a.holdPct !== undefined &&
      a.loadTorqueNm !== undefined &&
      a.peakTorqueNm !== undefined
    )
      checkAxisConsistency(
        {
          movePct: a.movePct,
          holdPct: a.holdPct,
          loadTorqueNm: a.loadTorqueNm,
          peakTorqueNm: a.peakTorqueNm,
        },
        ctx,
      );
    if (a.event && a.costPerEvent !== undefined)
      ctx.addIssue({
        code: "custom",
        path: ["event"],
        message:
          "give either costPerEvent or event (the cost built from downtime, scrap and labour), not both",
      });
  })
  .transform((a) => ({
    ...a,
    movePct: a.movePct ?? 0,
    holdPct: a.holdPct ?? 0,
    speedRpm: a.speedRpm ?? 0,
    loadTorqueNm: a.loadTorqueNm ?? 0,
    peakTorqueNm: a.peakTorqueNm ?? 0,
    costPerEvent: a.costPerEvent ?? "0",
    motion: a.motion ?? null,
    event: a.event ?? null,
    resonance: a.resonance ?? null,
  }));

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
export type AxisApiInput = z.output<typeof axisApiSchema>;
export type AxisListParams = z.infer<typeof axisListParamsSchema>;

// Duplicating a machine of a series: only the new name is asked; everything else is copied.
export const duplicateMachineSchema = z.object({ name: name("new machine's name") });
export type DuplicateMachineInput = z.infer<typeof duplicateMachineSchema>;

// The machine page's list of its axes, and the account page's list of its sites (lib/lists).
export const machineAxisListSchema = listParamsSchema(
  ["label", "quantity", "holdingTorqueNm", "speedRpm", "currentSettingA"],
  { sort: "label" },
);
export type MachineAxisListParams = z.infer<typeof machineAxisListSchema>;
export const siteListSchema = listParamsSchema(["name", "machines", "axes"], { sort: "name" });
export type SiteListParams = z.infer<typeof siteListSchema>;
