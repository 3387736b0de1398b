import { describe, expect, it } from "vitest";
import Decimal from "decimal.js";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import invalidCase from "@/tests/fixtures/engine-case-invalid.json";
import { caseInputSchema, evaluateCase, formatIssues } from "@/lib/engine";
import { MONEY_MAX } from "@/lib/engine/schema-fields";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const hand = (): Json => structuredClone(handCase) as Json;
const issuesOf = (input: unknown) => {
  const parsed = caseInputSchema.safeParse(input);
  expect(parsed.success).toBe(false);
  return parsed.success ? [] : formatIssues(parsed.error);
};

describe("case input schema (docs/contracts.md (Case input))", () => {
  it("fills every default of docs/contracts.md (Case input)", () => {
    const parsed = caseInputSchema.parse(hand());
    expect(parsed.finance).toMatchObject({
      tariffEscalationPct: 0,
      discountRatePct: 8,
      horizonYears: 5,
      downtimeCostPerHour: "0",
      projectOneTimeCost: "0",
      annualServiceCost: "0",
      gridKgCo2PerKWh: 0,
    });
    expect(parsed.margins).toEqual({ openLoopRequiredPct: 40, closedLoopRequiredPct: 15 }); // common practice
    expect(parsed.band).toEqual({ lowPct: 25, highPct: 50 });
    expect(parsed.sensitivity).toEqual({ swingPct: 20 });
    expect(parsed.thermal).toEqual({ lifeHalvingK: 10 });
    expect(parsed.machines[0]).toEqual({
      id: "M1",
      name: "Invented gantry",
      downtimeHours: 0,
      throughputGainPct: 0,
      marginPerOutputHour: "0",
    });
    const axis = parsed.axes[0];
    expect(axis.quantity).toBe(1);
    expect(axis.motor).toMatchObject({
      rotorTeeth: 50,
      ratedTempRiseK: 80,
      insulationClass: "B",
      hysteresisWPerHz: 0.004,
    });
    expect(axis.drive).toEqual({
      busVoltageV: 48,
      currentSettingA: 2.8,
      currentConvention: "peak",
      stepMode: "micro",
      microsteps: 16,
      idleCurrentPct: 50,
      efficiencyPct: 90,
      standbyW: 2,
    });
    expect(axis.duty).toMatchObject({ holdTorqueNm: 0, ambientC: 40 });
    expect(axis.reliability).toEqual({
      stepLossEventsPerYear: 6,
      costPerEvent: "180",
      avoidedPct: 90,
    });
    expect(axis.retrofit).toMatchObject({ discountPct: 0, maintenanceSavingPerYear: "0" });
    expect(axis.retrofit.kit).toMatchObject({
      sensing: "encoder",
      efficiencyPct: 92,
      standbyW: 3,
      minCurrentPct: 10,
      sensorlessMinRpm: 60,
    });
  });

  it("keeps money as decimal text, never through a JS number", () => {
    const input = hand();
    input.finance.tariffPerKWh = "0.1000000000000000000000001";
    input.axes[0].retrofit.kit.price = 189.1;
    const parsed = caseInputSchema.parse(input);
    expect(parsed.finance.tariffPerKWh).toBe("0.1000000000000000000000001");
    expect(parsed.axes[0].retrofit.kit.price).toBe("189.1");
  });

  it("refuses amounts above the money ceiling exactly at its edge, leading zeros and all", () => {
    // The ceiling is decided without decimal.js for short amounts; decimal.js is the reference.
    const amounts = [
      "0",
      ".5",
      "+12.50",
      "999999999999.99",
      "1000000000000",
      "1000000000000.00",
      "1000000000000.01",
      "0001000000000000.5",
      "00000000000000000012",
      "10000000000000",
      "5.",
    ];
    for (const amount of amounts) {
      const input = hand();
      input.axes[0].retrofit.kit.price = amount;
      expect(caseInputSchema.safeParse(input).success, amount).toBe(
        new Decimal(amount).lte(MONEY_MAX),
      );
    }
  });

  it("names the path of each problem and what is expected", () => {
    expect(issuesOf(invalidCase)).toEqual([
      'finance.tariffPerKWh: expected an amount as a decimal string such as "12.50" (or a JSON number), received "0,24"',
      "finance.horizonYears: must be at most 30",
      'axes[0].motor.holdingTorqueNm.unit: must be one of "N·m", "mN·m", "ozf·in", "lbf·in", "lbf·ft", "kgf·cm", received "oz-ft"',
      "axes[0].motor.ratedCurrentA: expected a number, received string",
      'axes[0].drive.stepMode: must be one of "full", "half", "half-compensated", "micro", received "quarter"',
      "axes[0].duty.holdPct: movePct + holdPct must be at most 100 (here 70 + 40)",
      "axes[0].duty.peakTorqueNm: must be at least loadTorqueNm (0.35)",
      'axes[0].machineId: must name a machine in machines (no machine "M9")',
    ]);
  });

  it("checks peak ≥ load after unit conversion", () => {
    const input = hand();
    input.axes[0].duty.loadTorqueNm = { value: 50, unit: "ozf·in" }; // 0.353 N·m
    input.axes[0].duty.peakTorqueNm = 0.35;
    expect(issuesOf(input)).toEqual([
      "axes[0].duty.peakTorqueNm: must be at least loadTorqueNm (0.3530776)",
    ]);
  });

  it("requires unique ids, 1 to 100000 axes and a whole horizon of 1..30 years", () => {
    const input = hand();
    input.axes.push(structuredClone(input.axes[0]));
    input.machines.push(structuredClone(input.machines[0]));
    expect(issuesOf(input)).toEqual([
      'machines[1].id: duplicate machine id "M1" (first at machines[0])',
      'axes[1].id: duplicate axis id "X" (first at axes[0])',
    ]);
    expect(issuesOf({ ...hand(), finance: { ...hand().finance, horizonYears: 2.5 } })).toEqual([
      "finance.horizonYears: must be a whole number",
    ]);
    expect(issuesOf({ ...hand(), axes: [] })).toEqual(["axes: must hold at least 1 axis"]);
    expect(issuesOf({ ...hand(), finance: { ...hand().finance, horizonYears: 0 } })).toEqual([
      "finance.horizonYears: must be at least 1",
    ]);
  });

  it("reports missing fields as required, with the type expected", () => {
    const input = hand();
    delete input.axes[0].duty.speedRpm;
    delete input.finance.tariffPerKWh;
    expect(issuesOf(input)).toEqual([
      'finance.tariffPerKWh: required: expected an amount as a decimal string such as "12.50" (or a JSON number)',
      "axes[0].duty.speedRpm: required: expected a number (or give duty.motion to derive it)",
    ]);
  });

  it("reports an axis that is not an object at its path instead of failing", () => {
    for (const notAnAxis of [null, 7, "axis"]) {
      const input = hand();
      input.axes[0] = notAnAxis;
      expect(issuesOf(input)).toEqual([
        expect.stringMatching(/^axes\[0\]: expected an object, received (null|number|string)$/),
      ]);
    }
  });

  it("rejects negative money and torque", () => {
    const input = hand();
    input.axes[0].retrofit.kit.price = "-5";
    input.axes[0].duty.holdTorqueNm = { value: -1, unit: "N·m" };
    expect(issuesOf(input)).toEqual([
      "axes[0].duty.holdTorqueNm.value: must be at least 0",
      "axes[0].retrofit.kit.price: must be at least 0, received -5",
    ]);
  });

  it("evaluateCase throws the ZodError on invalid input and accepts parsed input again", () => {
    expect(() => evaluateCase(invalidCase)).toThrow();
    const parsed = caseInputSchema.parse(hand());
    expect(evaluateCase(parsed)).toEqual(evaluateCase(hand()));
  });
});
