import { displayName } from "./display-name";
import { z } from "zod";
import { listParamsSchema } from "@/lib/lists/list-params";
import { idSchema } from "@/lib/validations/ids";
import { QUOTE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import { GROUP_SORTS, type QuoteSort } from "@/lib/pipeline/sort-quotes";
import { inWords } from "./in-words";

const stageField = z.enum(QUOTE_STAGES, {
  error: `Choose one of the stages: ${QUOTE_STAGES.join(", ")}`,
});
// A percentage as the administrator types it ("12,5" is 12.5: lib/validations/in-words.ts).
const percentage = (label: string, example: string) =>
  inWords(
    label,
    example,
    z
      .number({ error: `Enter the ${label.toLowerCase()} as a percentage such as ${example}` })
      .min(0, `${label}: use 0 to 100 %`)
      .max(100, `${label}: use 0 to 100 %`),
  );
type Percentage = ReturnType<typeof percentage>;

export const salesSettingsSchema = z.object({
  discountThresholdPct: percentage("Largest discount without approval", "10"),
  stageProbabilities: z.object(
    Object.fromEntries(
      QUOTE_STAGES.map((s) => [
        s,
        percentage(`Chance of closing at ${STAGE_LABELS[s].toLowerCase()}`, "40"),
      ]),
    ) as Record<(typeof QUOTE_STAGES)[number], Percentage>,
  ),
});

export const sendProposalSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter the reviewer's e-mail address"),
  name: displayName("Enter the reviewer's name"),
});

export const DECISIONS = ["accept", "changes", "decline"] as const;

export const decisionSchema = z
  .object({
    decision: z.enum(DECISIONS, { error: 'Choose "accept", "changes" or "decline"' }),
    comment: z.string().trim().max(4000, "Keep the comment under 4000 characters").default(""),
  })
  .superRefine((value, ctx) => {
    if (value.decision === "changes" && !value.comment)
      ctx.addIssue({
        code: "custom",
        path: ["comment"],
        message: "Say what should change, so the engineer can prepare a new version",
      });
  });

export const commentSchema = z.object({
  body: z
    .string()
    .trim()
    .min(1, "Write a comment first")
    .max(4000, "Keep the comment under 4000 characters"),
});

// The finance figures a reviewer may try in the sandbox, checked as the engine checks them
// (docs/model.md): absent ones keep the proposal's own value.
// The sandbox's figures live beside their helper (lib/review/what-if.ts).
export { whatIfSchema, type WhatIfInput } from "./what-if";

const dateOnly = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date such as 2026-09-30")
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), "Not a calendar date");

export const quoteUpdateSchema = z
  .object({
    stage: stageField.optional(),
    ownerId: idSchema("Choose an owner").optional(),
    expectedCloseOn: dateOnly.optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), {
    message: "Give a stage, an owner or an expected close date to change",
  });

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, "Use a month such as 2026-09");

// The pipeline's filters as they arrive in the URL; a malformed one is simply ignored.
export const pipelineFiltersSchema = z.object({
  owner: z.coerce.number().int().positive().optional().catch(undefined),
  stage: stageField.optional().catch(undefined),
  account: z.coerce.number().int().positive().optional().catch(undefined),
  closeMonth: month.optional().catch(undefined),
  from: month.optional().catch(undefined),
  to: month.optional().catch(undefined),
});

export type SalesSettingsInput = z.infer<typeof salesSettingsSchema>;
export type SendProposalInput = z.infer<typeof sendProposalSchema>;
export type DecisionInput = z.infer<typeof decisionSchema>;
export type QuoteUpdateInput = z.infer<typeof quoteUpdateSchema>;
export type PipelineFilters = z.infer<typeof pipelineFiltersSchema>;

// The quote list under the pipeline's charts sorts and pages on the server (lib/lists); every
// column sorts (lib/pipeline/sort-quotes.ts).
export const PIPELINE_SORTS = [
  "created",
  "proposal",
  "account",
  "owner",
  "stage",
  "revenue",
  "investment",
  "chance",
  "weighted",
  "close",
  "payback",
] as const satisfies readonly QuoteSort[];
export type PipelineSort = (typeof PIPELINE_SORTS)[number];
// Links saved before the value column split in two sorted by `value`, which was the customer's
// investment: they keep sorting by it.
const RENAMED_SORTS: Record<string, PipelineSort> = { value: "investment" };
export const pipelineListParamsSchema = z.preprocess(
  (raw) => {
    if (!raw || typeof raw !== "object") return raw;
    const sort = (raw as { sort?: unknown }).sort;
    return typeof sort === "string" && sort in RENAMED_SORTS
      ? { ...raw, sort: RENAMED_SORTS[sort] }
      : raw;
  },
  listParamsSchema(PIPELINE_SORTS, { sort: "created", dir: "desc" }),
);
export type PipelineListParams = z.infer<typeof pipelineListParamsSchema>;

// The sums by stage and by close month, each table sorted by its own URL parameters.
const groupSort = z.enum(GROUP_SORTS).catch("label");
const groupDir = z.enum(["asc", "desc"]).catch("asc");
export const pipelineGroupSortSchema = z.object({
  stageSort: groupSort,
  stageDir: groupDir,
  monthSort: groupSort,
  monthDir: groupDir,
});
export type PipelineGroupSort = z.infer<typeof pipelineGroupSortSchema>;
