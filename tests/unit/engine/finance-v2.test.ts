import fc from "fast-check";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import {
  SENSITIVITY_DRIVERS,
  VALUE_SOURCES,
  evaluateCase,
  roundMoney,
  type CaseResult,
  type Scenario,
} from "@/lib/engine";
import { irr } from "@/lib/engine/finance";
import { Money } from "@/lib/engine/money";

// Engine v2 money, docs/model.md (The business case). Every expected value below is worked by hand from the rule
// quoted beside it (arithmetic on the case's own inputs); the physics figures (kWh saved) are the
// engine's and only pass through.

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const hand = (): Json => structuredClone(handCase) as Json;
const fixture = (): Json => structuredClone(fixtureCase) as Json;
const dec = (v: string | number) => new Money(v);

/** The seven sources of year index i (0 = year 1), added in VALUE_SOURCES order. */
const sumOfSources = (s: Scenario, i: number) =>
  VALUE_SOURCES.reduce((sum, source) => sum.plus(s.bySource[source][i]), dec(0));

const scenariosOf = (r: CaseResult) =>
  [r.scenarios.physics, r.scenarios.bandLow, r.scenarios.bandHigh] as const;

/** The hand case with inflation, tax, depreciation, service and maintenance, over 3 years. */
function taxedHand(taxRatePct: number): Json {
  const input = hand();
  Object.assign(input.finance, {
    horizonYears: 3,
    inflationPct: 10,
    taxRatePct,
    depreciationYears: 2,
    annualServiceCost: "100",
  });
  input.axes[0].retrofit.maintenanceSavingPerYear = "50";
  return input;
}

describe("cost of a step-loss event built from downtime, scrap and restart labour (docs/model.md (The business case))", () => {
  const built = () => {
    const input = hand();
    input.finance.downtimeCostPerHour = "400";
    delete input.axes[0].reliability.costPerEvent;
    input.axes[0].reliability.event = {
      downtimeMinutes: 30,
      scrapParts: 4,
      scrapCostPerPart: "12.5",
      restartLaborHours: 0.5,
    };
    return input;
  };

  it("30 min × 400/h + 4 × 12.50 + 0.5 h × 85/h = 292.50 per event; 6 events × 90 % avoided = 1,579.50 a year", () => {
    // By hand: 200 + 50 + 42.5 = 292.5; 6 · 0.9 · 292.5 = 1579.5.
    expect(evaluateCase(built()).totals.reliabilityPerYear).toBe("1579.5");
  });

  it("an absent cost and no event count 0 (costPerEvent is optional in v2)", () => {
    const input = hand();
    delete input.axes[0].reliability.costPerEvent;
    expect(evaluateCase(input).totals.reliabilityPerYear).toBe("0");
  });

  it("the labor-rate driver also prices the restart labour: +20 % equals the case evaluated at 102/h", () => {
    const row = evaluateCase(built()).sensitivity.find((r) => r.driver === "laborRate")!;
    const direct = built();
    direct.finance.laborRatePerHour = "102";
    // Capex (install hours) and the event's labour both move; exact in Decimal.
    expect(
      dec(row.high.npv).minus(evaluateCase(direct).scenarios.physics.npv).abs().lt("1e-20"),
    ).toBe(true);
  });

  it("a sensorless kit below its minimum speed avoids no events (docs/model.md (Currents at the operating point), docs/model.md (The business case))", () => {
    const input = built();
    input.axes[0].retrofit.kit.sensing = "sensorless";
    input.axes[0].duty.speedRpm = 30; // below the default sensorlessMinRpm of 60
    const result = evaluateCase(input);
    expect(result.axes[0].warnings).toContain("SENSORLESS_LOW_SPEED");
    expect(result.totals.reliabilityPerYear).toBe("0");
  });
});

describe("inflation, tax and straight-line depreciation worked by hand (docs/model.md (The business case))", () => {
  const result = evaluateCase(taxedHand(25));
  const physics = result.scenarios.physics;
  const kWh = dec(result.totals.energySavedKWhPerYear);
  const coolingKWh = dec(result.totals.coolingSavedKWhPerYear);
  // Capex 189 + 1.5 h × 85 + 40 = 356.5; depreciation 356.5/2 = 178.25 in years 1 and 2, none in 3.
  const depreciation = [dec("178.25"), dec("178.25"), dec(0)];
  // Reliability 6 × 0.9 × 180 = 972, maintenance 50, service 100, each × 1.1^(t−1).
  const inflated = (amount: number, t: number) => dec(amount).times(dec("1.1").pow(t - 1));
  const beforeTax = (t: number) =>
    kWh
      .times("0.24")
      .plus(coolingKWh.times("0.24"))
      .plus(inflated(972, t))
      .plus(inflated(50, t))
      .minus(inflated(100, t));

  it("CF_0 = −Capex = −356.5", () => {
    expect(physics.cashFlows[0]).toBe("-356.5");
  });

  it("inflates reliability, maintenance and service by 10 % a year: 972, 1069.2, 1176.12; −100, −110, −121", () => {
    expect(physics.bySource.reliability).toEqual(["972", "1069.2", "1176.12"]);
    expect(physics.bySource.maintenance).toEqual(["50", "55", "60.5"]);
    expect(physics.bySource.service).toEqual(["-100", "-110", "-121"]);
    expect(physics.bySource.throughput).toEqual(["0", "0", "0"]);
  });

  it("taxes 25 % of the flow less depreciation: CF_t = P_t − 0.25·(P_t − dep_t)", () => {
    for (let t = 1; t <= 3; t++) {
      const p = beforeTax(t);
      const expected = p.minus(p.minus(depreciation[t - 1]).times("0.25"));
      expect(dec(physics.cashFlows[t]).minus(expected).abs().lt("1e-30"), `year ${t}`).toBe(true);
      const tax = p
        .minus(depreciation[t - 1])
        .times("0.25")
        .negated();
      expect(
        dec(physics.bySource.tax[t - 1])
          .minus(tax)
          .abs()
          .lt("1e-30"),
        `tax ${t}`,
      ).toBe(true);
    }
  });

  it("taxRatePct = 0 reproduces the pre-tax flows: the tax source is 0 and CF_t = P_t", () => {
    const untaxed = evaluateCase(taxedHand(0)).scenarios.physics;
    expect(untaxed.bySource.tax).toEqual(["0", "0", "0"]);
    for (let t = 1; t <= 3; t++) {
      expect(dec(untaxed.cashFlows[t]).minus(beforeTax(t)).abs().lt("1e-30")).toBe(true);
      // And the taxed flow is that pre-tax flow less the tax on it.
      const p = dec(untaxed.cashFlows[t]);
      expect(
        dec(physics.cashFlows[t])
          .minus(p.minus(p.minus(depreciation[t - 1]).times("0.25")))
          .abs()
          .lt("1e-30"),
      ).toBe(true);
    }
  });

  it("a negative taxable flow gives a tax shield (a positive tax source, common practice in project appraisal)", () => {
    const input = taxedHand(25);
    input.axes[0].reliability.stepLossEventsPerYear = 0;
    input.finance.annualServiceCost = "5000";
    const s = evaluateCase(input).scenarios.physics;
    for (const tax of s.bySource.tax) expect(dec(tax).gt(0)).toBe(true);
  });
});

describe("value by source adds up to each cash flow exactly (docs/model.md (The business case))", () => {
  const check = (result: CaseResult) => {
    for (const s of scenariosOf(result)) {
      for (const source of VALUE_SOURCES)
        expect(s.bySource[source]).toHaveLength(s.cashFlows.length - 1);
      for (let i = 0; i < s.cashFlows.length - 1; i++) {
        const sum = sumOfSources(s, i);
        // Exactly, as Decimals, and so also to the cent.
        expect(sum.equals(s.cashFlows[i + 1]), `${sum.toFixed()} vs ${s.cashFlows[i + 1]}`).toBe(
          true,
        );
        expect(roundMoney(sum, "EUR")).toBe(roundMoney(s.cashFlows[i + 1], "EUR"));
      }
    }
  };

  it("in every scenario of the fixture case", () => check(evaluateCase(fixtureCase)));

  it("with escalation, inflation, tax and depreciation chosen at random", () => {
    fc.assert(
      fc.property(
        fc.record({
          tariffEscalationPct: fc.double({ min: -5, max: 12, noNaN: true }),
          inflationPct: fc.double({ min: -3, max: 15, noNaN: true }),
          taxRatePct: fc.double({ min: 0, max: 60, noNaN: true }),
          depreciationYears: fc.integer({ min: 1, max: 30 }),
          horizonYears: fc.integer({ min: 1, max: 30 }),
          annualServiceCost: fc.integer({ min: 0, max: 5000 }).map(String),
        }),
        (finance) => {
          const input = fixture();
          Object.assign(input.finance, finance);
          check(evaluateCase(input));
        },
      ),
      { numRuns: 25 },
    );
  });

  it("band scenarios: energy and cooling carry the band's share of today's drive and cooling energy", () => {
    const input = fixture();
    input.finance.horizonYears = 2;
    const result = evaluateCase(input);
    const driveToday = result.totals.energyOpenLoopKWhPerYear;
    const coolingToday = result.axes.reduce(
      (s, a) => s + a.quantity * a.openLoop.coolingKWhPerYear,
      0,
    );
    for (const [key, pct] of [
      ["bandLow", 25],
      ["bandHigh", 50],
    ] as const) {
      const s = result.scenarios[key];
      // Year 2: tariff 0.24 escalated by 3 %.
      const tariff2 = dec("0.24").times("1.03");
      expect(Number(s.bySource.energy[1])).toBeCloseTo((pct / 100) * driveToday * 0.24 * 1.03, 9);
      expect(Number(s.bySource.cooling[1])).toBeCloseTo(
        (pct / 100) * coolingToday * 0.24 * 1.03,
        9,
      );
      expect(dec(s.bySource.energy[1]).div(tariff2).toNumber()).toBeCloseTo(
        (pct / 100) * driveToday,
        9,
      );
    }
  });
});

describe("payback status (docs/model.md (The business case))", () => {
  it('"reached" when the simple payback falls within the horizon', () => {
    const s = evaluateCase(hand()).scenarios.physics;
    expect(s.paybackYears).not.toBeNull();
    expect(s.paybackStatus).toBe("reached");
  });

  it('"beyond-horizon" when it is not reached but the last flow is still positive', () => {
    const input = hand();
    input.axes[0].retrofit.kit.price = "20000";
    const s = evaluateCase(input).scenarios.physics;
    expect(s.paybackYears).toBeNull();
    expect(dec(s.cashFlows[s.cashFlows.length - 1]).gt(0)).toBe(true);
    expect(s.paybackStatus).toBe("beyond-horizon");
  });

  it('"never" when it is not reached and the last flow is ≤ 0', () => {
    const input = hand();
    input.finance.annualServiceCost = "100000";
    const s = evaluateCase(input).scenarios.physics;
    expect(s.paybackYears).toBeNull();
    expect(s.paybackStatus).toBe("never");
  });
});

describe("break-even values (docs/model.md (The business case): NPV is affine in the tariff and in the event factor)", () => {
  /** The hand case with a dear kit, tax, inflation and escalation: NPV < 0 at today's figures. */
  const dear = (): Json => {
    const input = taxedHand(30);
    Object.assign(input.finance, { horizonYears: 6, tariffEscalationPct: 4 });
    input.axes[0].retrofit.kit.price = "9000";
    return input;
  };
  const result = evaluateCase(dear());

  it("substituting the break-even tariff makes NPV 0", () => {
    expect(dec(result.scenarios.physics.npv).lt(0)).toBe(true);
    const tariff = result.breakEven.tariffPerKWh;
    expect(tariff).not.toBeNull();
    const input = dear();
    input.finance.tariffPerKWh = tariff;
    expect(Math.abs(Number(evaluateCase(input).scenarios.physics.npv))).toBeLessThan(1e-9);
  });

  it("scaling every axis's events by the break-even factor makes NPV 0", () => {
    const factor = result.breakEven.stepLossFactor;
    expect(factor).not.toBeNull();
    expect(factor!).toBeGreaterThan(1);
    const input = dear();
    input.axes[0].reliability.stepLossEventsPerYear *= factor!;
    expect(Math.abs(Number(evaluateCase(input).scenarios.physics.npv))).toBeLessThan(1e-6);
  });

  it("is null when the answer would be negative (NPV > 0 even at a tariff of 0)", () => {
    const input = hand();
    input.finance.tariffPerKWh = "0";
    expect(dec(evaluateCase(input).scenarios.physics.npv).gt(0)).toBe(true);
    expect(evaluateCase(hand()).breakEven.tariffPerKWh).toBeNull();
  });

  it("is null when NPV does not rise with it (no events: slope 0)", () => {
    const input = dear();
    input.axes[0].reliability.stepLossEventsPerYear = 0;
    expect(evaluateCase(input).breakEven.stepLossFactor).toBeNull();
  });
});

describe("sensitivity drivers of engine v2 (docs/model.md (The business case))", () => {
  const result = evaluateCase(fixtureCase);
  const row = (driver: string) => result.sensitivity.find((r) => r.driver === driver)!;

  it("lists the nine drivers", () => {
    expect(result.sensitivity.map((r) => r.driver).sort()).toEqual([...SENSITIVITY_DRIVERS].sort());
    expect(SENSITIVITY_DRIVERS).toHaveLength(9);
  });

  it("throughput gain scales every machine's asked gain, still capped: +20 % equals the case evaluated so", () => {
    const scaled = fixture();
    for (const m of scaled.machines) m.throughputGainPct = (m.throughputGainPct ?? 0) * 1.2;
    const direct = evaluateCase(scaled).scenarios.physics.npv;
    expect(Number(row("throughputGain").high.npv)).toBeCloseTo(Number(direct), 6);
    const capped = fixture();
    capped.machines[0].throughputGainPct = 10000;
    const cappedResult = evaluateCase(capped);
    const gainRow = cappedResult.sensitivity.find((r) => r.driver === "throughputGain")!;
    // Capped at the headroom both ways: the gain does not move NPV.
    expect(gainRow.low.npv).toBe(gainRow.high.npv);
  });

  it("idle current scales every axis's idle current, capped at 100 %: ±20 % equal the case evaluated so", () => {
    for (const [factor, side] of [
      [0.8, "low"],
      [1.2, "high"],
    ] as const) {
      const scaled = fixture();
      for (const a of scaled.axes)
        a.drive.idleCurrentPct = Math.min(100, (a.drive.idleCurrentPct ?? 50) * factor);
      const direct = evaluateCase(scaled).scenarios.physics.npv;
      expect(Number(row("idleCurrent")[side].npv)).toBeCloseTo(Number(direct), 6);
    }
    const full = fixture();
    for (const a of full.axes) a.drive.idleCurrentPct = 100;
    const fullRow = evaluateCase(full).sensitivity.find((r) => r.driver === "idleCurrent")!;
    // At 100 % already, raising it changes nothing; lowering it does.
    expect(fullRow.high.npv).toBe(evaluateCase(full).scenarios.physics.npv);
  });

  it("sorts by the NPV swing rounded to the cent, largest first; equal swings keep the listed order", () => {
    const swings = result.sensitivity.map((r) =>
      dec(r.high.npv).minus(r.low.npv).abs().toDecimalPlaces(2, Money.ROUND_HALF_EVEN),
    );
    for (let i = 1; i < swings.length; i++) expect(swings[i - 1].gte(swings[i])).toBe(true);

    // The hand case: no labour, no events, no throughput value — three swings of exactly 0.
    const input = hand();
    input.finance.laborRatePerHour = "0";
    input.axes[0].reliability.stepLossEventsPerYear = 0;
    const drivers = evaluateCase(input).sensitivity.map((r) => r.driver);
    expect(drivers.slice(-3)).toEqual(["laborRate", "stepLossEvents", "throughputGain"]);
  });
});

describe("IRR by the v2 rule (docs/model.md (The business case))", () => {
  const flows = (values: number[]) => values.map((v) => dec(v));

  it("numpy-financial irr docstring: IRR(−100, 39, 59, 55, 20) = 0.2809484211599611 (bisection to 1e-12)", () => {
    expect(Math.abs(irr(flows([-100, 39, 59, 55, 20]))! - 0.2809484211599611)).toBeLessThan(1e-11);
  });

  it("is null unless CF_0 < 0 and some later flow > 0", () => {
    expect(irr(flows([100, -50, -60]))).toBeNull();
    expect(irr(flows([0, 10, 10]))).toBeNull();
    expect(irr(flows([-100, -10, 0]))).toBeNull();
  });

  it("is null when NPV(−0.99) and NPV(10) have the same sign, even with roots inside (−100, 230, −132: 10 % and 20 %)", () => {
    // By hand: NPV(−0.99) = −100 + 23,000 − 1,320,000 < 0 and NPV(10) = −100 + 20.9 − 1.09 < 0.
    expect(irr(flows([-100, 230, -132]))).toBeNull();
  });
});
