import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { evaluateCase, roundMoney, type CaseResult } from "@/lib/engine";
import { Money } from "@/lib/engine/money";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const hand = (): Json => structuredClone(handCase) as Json;
const totalOpenLoopCooling = (r: CaseResult) =>
  r.axes.reduce((s, a) => s + a.quantity * a.openLoop.coolingKWhPerYear, 0);

describe("business case (docs/model.md (The business case))", () => {
  it("capex adds per-unit kit after discount, labor and commissioning, machine downtime and the project cost", () => {
    const result = evaluateCase(fixtureCase);
    // M1-X: 2 × (189 + 1.5·85 + 40); M1-Z: 249·0.9 + 2·85; M2-FEED: 3 × (129 + 85);
    // downtime (4 + 2) h × 400; project 1500
    expect(result.axes.map((a) => a.capex)).toEqual(["356.5", "394.1", "214"]);
    expect(result.axes.map((a) => a.totals.capex)).toEqual(["713", "394.1", "642"]);
    expect(result.totals.capex).toBe(
      new Money(713).plus("394.1").plus(642).plus(2400).plus(1500).toFixed(),
    );
  });

  it("escalates the tariff yearly and subtracts the annual service cost", () => {
    const input = hand();
    Object.assign(input.finance, {
      tariffEscalationPct: 10,
      annualServiceCost: "100",
      horizonYears: 3,
    });
    const result = evaluateCase(input);
    const kWh = result.totals.energySavedKWhPerYear + result.totals.coolingSavedKWhPerYear;
    const energy = new Money(kWh).times("0.24");
    const flows = result.scenarios.physics.cashFlows.map((f) => new Money(f));
    for (let t = 1; t <= 3; t++) {
      const expected = energy
        .times(new Money("1.1").pow(t - 1))
        .plus(972)
        .minus(100);
      expect(flows[t].minus(expected).abs().lessThan("1e-20")).toBe(true);
    }
  });

  it("band scenarios save the band's share of the open-loop drive and cooling energy", () => {
    const input = structuredClone(fixtureCase) as Json;
    input.finance.horizonYears = 1;
    const result = evaluateCase(input);
    const recurring = new Money(result.totals.reliabilityPerYear)
      .plus(result.totals.maintenancePerYear)
      .plus(result.totals.throughputPerYear)
      .minus("120");
    const openLoopKWh = result.totals.energyOpenLoopKWhPerYear + totalOpenLoopCooling(result);
    for (const [scenario, pct] of [
      ["bandLow", 25],
      ["bandHigh", 50],
    ] as const) {
      const flow = new Money(result.scenarios[scenario].cashFlows[1]);
      const expected = new Money((pct / 100) * openLoopKWh).times("0.24").plus(recurring);
      expect(flow.minus(expected).abs().lessThan("1e-12")).toBe(true);
    }
  });

  it("throughput: gain capped by the least headroom of the machine's axes, valued at its longest hours", () => {
    const input = structuredClone(fixtureCase) as Json;
    input.machines[0].throughputGainPct = 1000;
    const result = evaluateCase(input);
    const m1 = result.axes
      .filter((a) => a.machineId === "M1")
      .map((a) => a.savings.speedHeadroomPct as number);
    const gain = Math.min(...m1);
    expect(result.machines[0].throughputGainPct).toBe(gain);
    expect(result.machines[0].warnings).toEqual(["THROUGHPUT_CAPPED"]);
    expect(Number(result.machines[0].throughputPerYear)).toBeCloseTo((gain / 100) * 35 * 4000, 6);
  });

  it("a machine without axes adds nothing", () => {
    const input = hand();
    input.machines.push({
      id: "M2",
      name: "Invented idle machine",
      throughputGainPct: 10,
      marginPerOutputHour: "50",
    });
    expect(evaluateCase(input).machines[1]).toEqual({
      id: "M2",
      throughputGainPct: 0,
      throughputPerYear: "0",
      warnings: [],
    });
  });

  it("CO₂ is the energy and cooling saved times the grid factor", () => {
    const result = evaluateCase(fixtureCase);
    const kWh = result.totals.energySavedKWhPerYear + result.totals.coolingSavedKWhPerYear;
    expect(result.totals.co2TonnesPerYear).toBeCloseTo((kWh * 0.38) / 1000, 12);
  });

  it("money in the result is plain decimal text (no exponent), unrounded", () => {
    const result = evaluateCase(fixtureCase);
    const money = [
      result.totals.capex,
      result.scenarios.physics.npv,
      ...result.scenarios.physics.cashFlows,
    ];
    for (const m of money) expect(m).toMatch(/^-?\d+(\.\d+)?$/);
    expect(result.scenarios.physics.npv.split(".")[1].length).toBeGreaterThan(2);
  });
});

describe("sensitivity (docs/model.md (The business case))", () => {
  const result = evaluateCase(fixtureCase);
  const swing = (row: CaseResult["sensitivity"][number]) =>
    new Money(row.high.npv).minus(row.low.npv).abs();

  it("covers the nine drivers of engine v2, sorted by NPV swing (rounded to the cent), largest first", () => {
    expect(result.sensitivity.map((r) => r.driver).sort()).toEqual([
      "discountRate",
      "hoursPerYear",
      "idleCurrent",
      "kitPrice",
      "laborRate",
      "loadTorque",
      "stepLossEvents",
      "tariff",
      "throughputGain",
    ]);
    const rounded = (row: CaseResult["sensitivity"][number]) =>
      swing(row).toDecimalPlaces(2, Money.ROUND_HALF_EVEN);
    for (let i = 1; i < result.sensitivity.length; i++) {
      expect(
        rounded(result.sensitivity[i - 1]).greaterThanOrEqualTo(rounded(result.sensitivity[i])),
      ).toBe(true);
    }
  });

  it("keeps the listed order for equal swings (stable sort)", () => {
    const input = hand();
    Object.assign(input.finance, { laborRatePerHour: "0" });
    input.axes[0].reliability.stepLossEventsPerYear = 0;
    const drivers = evaluateCase(input).sensitivity.map((r) => r.driver);
    expect(drivers.indexOf("laborRate")).toBeLessThan(drivers.indexOf("stepLossEvents"));
    // No labour, no events and no throughput value: three swings of 0, in the listed order.
    expect(drivers.slice(-3)).toEqual(["laborRate", "stepLossEvents", "throughputGain"]);
  });

  it("kit price ±20 % moves capex by ±20 % of the discounted kit prices", () => {
    const row = result.sensitivity.find((r) => r.driver === "kitPrice")!;
    const kits = new Money(2 * 189).plus(new Money(249).times("0.9")).plus(3 * 129);
    expect(
      new Money(row.low.npv).minus(row.high.npv).minus(kits.times("0.4")).abs().lessThan("1e-20"),
    ).toBe(true);
  });

  it("discount rate swings relative to its value (8 % → 6.4 % and 9.6 %)", () => {
    const row = result.sensitivity.find((r) => r.driver === "discountRate")!;
    const flows = result.scenarios.physics.cashFlows.map((f) => new Money(f));
    const npvAt = (r: string) =>
      flows.reduce((s, f, t) => s.plus(f.div(new Money(1).plus(r).pow(t))), new Money(0));
    expect(new Money(row.low.npv).minus(npvAt("0.064")).abs().lessThan("1e-20")).toBe(true);
    expect(new Money(row.high.npv).minus(npvAt("0.096")).abs().lessThan("1e-20")).toBe(true);
  });

  it("load torque re-solves the physics: the same as evaluating the case with every load, peak and holding torque scaled", () => {
    const row = result.sensitivity.find((r) => r.driver === "loadTorque")!;
    const scaled = structuredClone(fixtureCase) as Json;
    for (const axis of scaled.axes) {
      axis.duty.loadTorqueNm *= 1.2;
      axis.duty.peakTorqueNm *= 1.2;
      axis.duty.holdTorqueNm = (axis.duty.holdTorqueNm ?? 0) * 1.2;
    }
    const direct = evaluateCase(scaled).scenarios.physics.npv;
    expect(Number(row.high.npv)).toBeCloseTo(Number(direct), 6);
  });

  it("hours per year scale energy, cooling and throughput alike", () => {
    const row = result.sensitivity.find((r) => r.driver === "hoursPerYear")!;
    const scaled = structuredClone(fixtureCase) as Json;
    for (const axis of scaled.axes) axis.duty.hoursPerYear *= 0.8;
    expect(Number(row.low.npv)).toBeCloseTo(Number(evaluateCase(scaled).scenarios.physics.npv), 6);
  });
});

describe("rounding for display and export (docs/contracts.md (Numbers and money))", () => {
  it("rounds half-even to the currency's minor unit (ISO 4217)", () => {
    expect(roundMoney("2.345", "EUR")).toBe("2.34");
    expect(roundMoney("2.355", "EUR")).toBe("2.36");
    expect(roundMoney("1234.5", "JPY")).toBe("1234");
    expect(roundMoney("1.2345", "KWD")).toBe("1.234");
    expect(roundMoney("-0.001", "EUR")).toBe("0.00");
  });
});

describe("sensitivity order when two drivers swing NPV equally", () => {
  it("keeps docs/model.md (The business case)'s listed order (tariff before hours) whatever the float noise", () => {
    const input = structuredClone(fixtureCase);
    // Without throughput value, tariff and hours per year scale the same cash flows exactly.
    for (const m of input.machines) m.throughputGainPct = 0;
    for (const hours of [1234.5, 3333.3, 4000, 5678.9, 7777.7]) {
      for (const a of input.axes) a.duty.hoursPerYear = hours;
      const drivers = evaluateCase(input).sensitivity.map((r) => r.driver);
      expect(drivers.indexOf("tariff")).toBeLessThan(drivers.indexOf("hoursPerYear"));
    }
  });
});
