import { z } from "zod";
import { bounded, int, money } from "@/lib/engine/schema-fields";
import { inWords } from "./in-words";

/** A factor on a figure the proposal holds: 0 (none of it) up to 10 times. */
const factor = (field: string) =>
  inWords(
    field,
    "0.5",
    z
      .number({ error: `${field}: enter a factor such as 0.5` })
      .min(0, `${field}: use a factor of at least 0`)
      .max(10, `${field}: use a factor of at most 10`)
      .optional(),
  ).optional();

/**
 * The reviewer's sandbox (docs/model.md, The business case): finance figures replace the
 * proposal's; the factors multiply what the proposal entered on every axis and machine.
 * A blank figure is the proposal's own. Figures may come as the reviewer typed them ("0,24"): lib/validations/in-words.ts reads them
 * and words every message with the field's name, as the sandbox's labels say it.
 */
export const whatIfSchema = z
  .object({
    tariffPerKWh: inWords("Electricity tariff", "0.24", money().optional(), "amount").optional(),
    tariffEscalationPct: inWords(
      "Tariff escalation",
      "2",
      bounded("ratePct").optional(),
    ).optional(),
    discountRatePct: inWords(
      "Discount rate",
      "8",
      bounded("discountRatePct").optional(),
    ).optional(),
    horizonYears: inWords("Horizon", "10", int(1, 30).optional()).optional(),
    taxRatePct: inWords(
      "Tax rate",
      "25",
      z
        .number({ error: "Tax rate: enter a percentage such as 25" })
        .min(0, "Tax rate: use at least 0 %")
        .lt(100, "Tax rate: use less than 100 %")
        .optional(),
    ).optional(),
    runningHoursFactor: factor("Running hours"),
    stepLossEventsFactor: factor("Step-loss events"),
    costPerEventFactor: factor("Cost per event"),
    extraOutputFactor: factor("Extra output"),
  })
  .strict();

export type WhatIfInput = z.output<typeof whatIfSchema>;
/** What the sandbox sends: each figure as a number or as the text the reviewer typed. */
export type WhatIfRequest = z.input<typeof whatIfSchema>;
