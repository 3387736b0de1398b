import { z } from "zod";
import { bounded, int, money } from "@/lib/engine/schema-fields";

/** A factor on a figure the proposal holds: 0 (none of it) up to 10 times. */
const factor = (field: string) =>
  z
    .number({ error: `${field}: enter a number such as 0.5` })
    .min(0, `${field}: use a factor of at least 0`)
    .max(10, `${field}: use a factor of at most 10`);

/**
 * The reviewer's sandbox (docs/model.md, The business case): finance figures replace the
 * proposal's; the factors multiply what the proposal entered on every axis and machine.
 */
export const whatIfSchema = z
  .object({
    tariffPerKWh: money().optional(),
    tariffEscalationPct: bounded("ratePct").optional(),
    discountRatePct: bounded("discountRatePct").optional(),
    horizonYears: int(1, 30).optional(),
    taxRatePct: z
      .number({ error: "Tax rate: enter a percentage" })
      .min(0, "Tax rate: use at least 0 %")
      .lt(100, "Tax rate: use less than 100 %")
      .optional(),
    runningHoursFactor: factor("Running hours").optional(),
    stepLossEventsFactor: factor("Step-loss events").optional(),
    costPerEventFactor: factor("Cost per event").optional(),
    extraOutputFactor: factor("Extra output").optional(),
  })
  .strict();

export type WhatIfInput = z.infer<typeof whatIfSchema>;
