import { describe, expect, it } from "vitest";
import {
  dossierPriceSchema,
  uncertaintySettingsSchema,
  DEFAULT_RANGES,
} from "@/lib/validations/dossier";
import { personMessage } from "@/lib/validations/in-words";
import { axisRetrofitSchema } from "@/lib/validations/case";
import { kitInputSchema } from "@/lib/validations/catalogue";
import { machineInputSchema, siteInputSchema } from "@/lib/validations/installed-base";
import { salesSettingsSchema } from "@/lib/validations/pipeline";
import { whatIfSchema } from "@/lib/validations/what-if";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => i.message);

describe("numbers typed with a decimal comma reach the server as numbers (lib/validations/in-words.ts)", () => {
  it("the reviewer's sandbox reads '0,24' as 0.24 and refuses '1,234' by the field's name", () => {
    expect(
      whatIfSchema.parse({ tariffPerKWh: "0,24", stepLossEventsFactor: "0,5", horizonYears: "12" }),
    ).toEqual({ tariffPerKWh: "0.24", stepLossEventsFactor: 0.5, horizonYears: 12 });
    expect(messages(whatIfSchema.safeParse({ tariffPerKWh: "1,234" }))).toEqual([
      "Electricity tariff: write 1234 or 1.234 — '1,234' could mean either",
    ]);
    expect(messages(whatIfSchema.safeParse({ costPerEventFactor: "1,500" }))).toEqual([
      "Cost per event: write 1500 or 1.500 — '1,500' could mean either",
    ]);
    // Blank boxes are the proposal's own figures.
    expect(whatIfSchema.parse({ discountRatePct: " ", taxRatePct: "" })).toEqual({});
  });

  it("words the sandbox's refusals as sentences with the field and an example", () => {
    expect(messages(whatIfSchema.safeParse({ discountRatePct: "eight" }))).toEqual([
      "Enter the discount rate as a number such as 8",
    ]);
    expect(messages(whatIfSchema.safeParse({ tariffPerKWh: "-0,5" }))).toEqual([
      "Electricity tariff must be at least 0",
    ]);
    expect(messages(whatIfSchema.safeParse({ horizonYears: "2,5" }))).toEqual([
      "Horizon must be a whole number, such as 10",
    ]);
    for (const m of messages(whatIfSchema.safeParse({ tariffPerKWh: true, horizonYears: [] })))
      expect(m).not.toMatch(/expected|received|tariffPerKWh|horizonYears/);
  });

  it("the case's retrofit terms, the sales settings and the dossier read a decimal comma", () => {
    expect(
      axisRetrofitSchema.parse({ kitId: 3, discountPct: "7,5", commissioningCost: "120,50" }),
    ).toMatchObject({ discountPct: 7.5, commissioningCost: "120.50", installHours: 0 });
    expect(messages(axisRetrofitSchema.safeParse({ kitId: 3, installHours: "2,000" }))).toEqual([
      "Install hours: write 2000 or 2.000 — '2,000' could mean either",
    ]);

    const probabilities = Object.fromEntries(QUOTE_STAGES.map((s) => [s, "12,5"]));
    expect(
      salesSettingsSchema.parse({ discountThresholdPct: "7,5", stageProbabilities: probabilities }),
    ).toMatchObject({ discountThresholdPct: 7.5 });
    expect(
      messages(
        salesSettingsSchema.safeParse({
          discountThresholdPct: "",
          stageProbabilities: probabilities,
        }),
      ),
    ).toEqual(["Enter the largest discount without approval as a percentage such as 10"]);

    expect(dossierPriceSchema.parse({ amount: "490,00", currency: "eur" })).toEqual({
      amount: "490.00",
      currency: "EUR",
    });
    const settings = { seed: "42", ...DEFAULT_RANGES, tariff: { lowPct: "-12,5", highPct: "30" } };
    expect(uncertaintySettingsSchema.parse(settings).tariff).toEqual({
      lowPct: -12.5,
      highPct: 30,
    });
    expect(messages(uncertaintySettingsSchema.safeParse({ ...settings, seed: "abc" }))).toEqual([
      "Enter the seed as a number such as 12345",
    ]);
  });

  it("amounts typed on the site, machine and kit forms keep their decimals exact", () => {
    const site = siteInputSchema.parse({
      name: "Plant",
      currency: "EUR",
      tariffPerKWh: "0,1875",
      ambientC: 25,
      hoursPerYear: 4000,
    });
    expect(site.tariffPerKWh).toBe("0.1875");
    expect(
      machineInputSchema.parse({ name: "Press", marginPerOutputHour: "1.234,50" })
        .marginPerOutputHour,
    ).toBe("1234.50");
    const kit = kitInputSchema.safeParse({
      code: "K1",
      name: "Kit",
      price: "1,234",
      currency: "EUR",
      sensing: "encoder",
    });
    expect(messages(kit)).toContain(
      "Price per axis: write 1234 or 1.234 — '1,234' could mean either",
    );
  });
});

describe("engine messages in a person's words (personMessage)", () => {
  it("turns the API's fragments into sentences naming the field", () => {
    expect(personMessage("Discount %", "5", "required: expected a number")).toBe(
      "Enter the discount % as a number such as 5",
    );
    expect(personMessage("Install hours", "2.5", "expected a number, received string")).toBe(
      "Enter the install hours as a number such as 2.5",
    );
    expect(personMessage("Commissioning cost", "120.00", "must be at least 0, received -3")).toBe(
      "Commissioning cost must be at least 0",
    );
    expect(personMessage("Tax rate", "25", "Tax rate: use less than 100 %")).toBe(
      "Tax rate: use less than 100 %",
    );
  });
});
