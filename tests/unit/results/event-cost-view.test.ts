import { describe, expect, it } from "vitest";
import { eventCostSentence } from "@/lib/results/event-cost-view";

const pricing = {
  caseName: "Line 3",
  currency: "EUR",
  downtimeCostPerHour: "600",
  laborRatePerHour: "45",
};

describe("eventCostSentence", () => {
  it("prices an event built up from downtime, scrap and restart labour with a case's rates", () => {
    // By hand: 30/60 h · 600 = 300; 2 · 5 = 10; 0.5 h · 45 = 22.50; together 332.50.
    expect(
      eventCostSentence(
        { downtimeMinutes: 30, scrapParts: 2, scrapCostPerPart: "5", restartLaborHours: 0.5 },
        pricing,
      ),
    ).toBe(
      "€332.50 per event: downtime 30 min at €600.00/h €300.00, scrap 2 × €5.00 €10.00, restart 0.5 h at €45.00/h €22.50",
    );
  });

  it("reads empty boxes as 0 and says nothing while a box is not a number", () => {
    expect(
      eventCostSentence(
        { downtimeMinutes: "", scrapParts: 0, scrapCostPerPart: "", restartLaborHours: 1 },
        pricing,
      ),
    ).toMatch(/^€45\.00 per event/);
    expect(
      eventCostSentence(
        { downtimeMinutes: Number.NaN, scrapParts: 0, scrapCostPerPart: "0", restartLaborHours: 0 },
        pricing,
      ),
    ).toBeNull();
    expect(
      eventCostSentence(
        { downtimeMinutes: 0, scrapParts: 0, scrapCostPerPart: "five", restartLaborHours: 0 },
        pricing,
      ),
    ).toBeNull();
  });
});
