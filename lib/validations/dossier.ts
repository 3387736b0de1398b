import { z } from "zod";
import { idSchema } from "@/lib/validations/ids";
import { currencyMinorUnits } from "../engine/money";
import { inWords } from "./in-words";
import { typedAmount } from "./typed-number";

/**
 * The uncertainty analysis of a dossier: a range for each driver, in % of the case's own value,
 * and the seed that makes the 1,000 draws repeatable. The default ranges are estimates, not
 * published figures: the engineer replaces them with what they know of the customer's site.
 */
const pctBound = (label: string, example: string) =>
  inWords(
    label,
    example,
    z
      .number()
      .min(-90, "must be at least −90 % (a factor below 0.1 is no longer an estimate)")
      .max(300, "must be at most +300 %"),
  );

// Each end is named with its driver, as the form's fieldsets say it; "0,5" is read as 0.5.
const range = (driver: string) =>
  z
    .object({
      lowPct: pctBound(`${driver}, low end`, "-20"),
      highPct: pctBound(`${driver}, high end`, "30"),
    })
    .refine((r) => r.lowPct <= r.highPct, {
      message: "The low end must not be above the high end",
      path: ["highPct"],
    });

export const UNCERTAINTY_DRIVERS = [
  "tariff",
  "hoursPerYear",
  "loadTorque",
  "stepLossEvents",
] as const;
export type UncertaintyDriver = (typeof UNCERTAINTY_DRIVERS)[number];

export const MAX_SEED = 2 ** 31 - 1;

export const uncertaintySettingsSchema = z.object({
  seed: inWords(
    "Seed",
    "12345",
    z
      .number()
      .int("The seed is a whole number")
      .min(0, "The seed is at least 0")
      .max(MAX_SEED, `The seed is at most ${MAX_SEED}`),
  ),
  tariff: range("Electricity tariff"),
  hoursPerYear: range("Running hours per year"),
  loadTorque: range("Load torque"),
  stepLossEvents: range("Step-loss events"),
});

export type UncertaintySettings = z.output<typeof uncertaintySettingsSchema>;
export type UncertaintySettingsInput = z.input<typeof uncertaintySettingsSchema>;

/** Estimates to replace with the customer's own knowledge (shown beside the form). */
export const DEFAULT_RANGES: Omit<UncertaintySettings, "seed"> = {
  tariff: { lowPct: -20, highPct: 30 },
  hoursPerYear: { lowPct: -25, highPct: 10 },
  loadTorque: { lowPct: -15, highPct: 15 },
  stepLossEvents: { lowPct: -50, highPct: 100 },
};

/** The dossier's price as the administrator sets it: a decimal amount and an ISO 4217 code. */
export const dossierPriceSchema = z
  .object({
    // "490,00" is read as 490.00 (lib/validations/typed-number.ts); the text stays a decimal.
    amount: typedAmount(
      "Price",
      z
        .string({ error: "Enter the price" })
        .trim()
        .regex(
          /^\d{1,7}(\.\d{1,2})?$/,
          "Enter an amount such as 490 or 490.00 (at most two decimals)",
        )
        .refine((v) => Number(v) > 0, "The price must be above 0"),
    ),
    currency: z
      .string({ error: "Enter a currency" })
      .trim()
      .transform((v) => v.toUpperCase())
      .pipe(z.string().regex(/^[A-Z]{3}$/, "Enter a three-letter ISO 4217 code, e.g. EUR")),
  })
  .superRefine((price, ctx) => {
    const places = price.amount.split(".")[1]?.length ?? 0;
    const allowed = currencyMinorUnits(price.currency);
    if (places > allowed)
      ctx.addIssue({
        code: "custom",
        path: ["amount"],
        message:
          allowed === 0
            ? `${price.currency} has no minor unit: enter a whole amount`
            : `${price.currency} has ${allowed} decimal places at most`,
      });
  });
export type DossierPrice = z.output<typeof dossierPriceSchema>;

export const checkoutRequestSchema = z.object({
  proposalId: idSchema("Name the proposal by its id"),
});
