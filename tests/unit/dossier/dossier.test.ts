import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { buildDossier, nearestRank, type Draw } from "@/lib/dossier";
import { runUncertainty } from "@/lib/dossier/uncertainty";
import { caseInputSchema, evaluateCase, prepareCase, torqueSpeedCurve } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { DEFAULT_RANGES, type UncertaintySettings } from "@/lib/validations/dossier";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;
const raw = (): Json => structuredClone(fixtureCase) as Json;
const input = caseInputSchema.parse(fixtureCase);
const settings: UncertaintySettings = { seed: 20240611, ...DEFAULT_RANGES };
const dossier = buildDossier(input, settings);
const dec = (v: string) => new Money(v);

describe("uncertainty analysis", () => {
  it("gives identical draws and percentiles for the same seed, and others for another seed", () => {
    const again = buildDossier(caseInputSchema.parse(fixtureCase), { ...settings });
    expect(again.uncertainty).toEqual(dossier.uncertainty);
    const other = buildDossier(input, { ...settings, seed: settings.seed + 1 });
    expect(other.uncertainty.draws[0]).not.toEqual(dossier.uncertainty.draws[0]);
    expect(dossier.uncertainty.seed).toBe(settings.seed);
    expect(dossier.uncertainty.draws).toHaveLength(1000);
  });

  it("puts P50 between P10 and P90, for NPV and payback", () => {
    const [p10, p50, p90] = dossier.uncertainty.percentiles;
    expect([p10.p, p50.p, p90.p]).toEqual([10, 50, 90]);
    expect(dec(p10.npv).lte(dec(p50.npv))).toBe(true);
    expect(dec(p50.npv).lte(dec(p90.npv))).toBe(true);
    expect(dec(p10.npv).lt(dec(p90.npv))).toBe(true);
    // Payback: a shorter payback is the better outcome; nulls (beyond the horizon) rank last.
    expect(p10.paybackYears).not.toBeNull();
    expect(p10.paybackYears!).toBeLessThanOrEqual(p50.paybackYears ?? Infinity);
    expect(p50.paybackYears ?? Infinity).toBeLessThanOrEqual(p90.paybackYears ?? Infinity);
  });

  it("reads percentiles by nearest rank (Hyndman & Fan 1996, definition 1) from the draws", () => {
    // Definition 1: the k-th smallest value with k = ceil(p·n); for n = 1000, ranks 100, 500, 900.
    expect([10, 50, 90].map((p) => nearestRank(p, 1000))).toEqual([100, 500, 900]);
    const sorted = dossier.uncertainty.draws.map((d) => dec(d.npv)).sort((a, b) => a.comparedTo(b));
    expect(dossier.uncertainty.percentiles.map((q) => q.npv)).toEqual(
      [99, 499, 899].map((k) => sorted[k].toFixed()),
    );
  });

  it("keeps every drawn change within the range the engineer set", () => {
    for (const draw of dossier.uncertainty.draws) {
      for (const driver of ["tariff", "hoursPerYear", "loadTorque", "stepLossEvents"] as const) {
        expect(draw.pct[driver]).toBeGreaterThanOrEqual(DEFAULT_RANGES[driver].lowPct);
        expect(draw.pct[driver]).toBeLessThanOrEqual(DEFAULT_RANGES[driver].highPct);
      }
    }
  });

  it("each draw equals evaluateCase of the case with those four inputs changed", () => {
    // The shortcut (physics once, the load's closed loop re-solved, linear terms scaled) must
    // give what the engine gives for the changed input itself.
    for (const draw of dossier.uncertainty.draws.slice(0, 12)) expectDrawIsEngine(raw(), draw);
  });

  it("so does each draw of a case with inflation, tax, depreciation and event costs built up", () => {
    const taxed = raw();
    Object.assign(taxed.finance, { inflationPct: 2.5, taxRatePct: 28, depreciationYears: 3 });
    for (const axis of taxed.axes) {
      delete axis.reliability?.costPerEvent;
      axis.reliability = {
        ...axis.reliability,
        stepLossEventsPerYear: axis.reliability?.stepLossEventsPerYear ?? 2,
        event: {
          downtimeMinutes: 20,
          scrapParts: 3,
          scrapCostPerPart: "7.5",
          restartLaborHours: 0.25,
        },
      };
    }
    const uncertainty = runUncertainty(prepareCase(caseInputSchema.parse(taxed)), settings, 12);
    for (const draw of uncertainty.draws) expectDrawIsEngine(structuredClone(taxed), draw);
  });
});

/** A draw against evaluateCase of the case with its four inputs changed by the draw's %. */
function expectDrawIsEngine(changed: Json, draw: Draw): void {
  const f = (pct: number) => 1 + pct / 100;
  changed.finance.tariffPerKWh = dec(changed.finance.tariffPerKWh)
    .times(dec(String(draw.pct.tariff)).div(100).plus(1))
    .toFixed();
  for (const axis of changed.axes) {
    axis.duty.hoursPerYear *= f(draw.pct.hoursPerYear);
    // docs/model.md (The business case) (v2): the load driver scales load, peak and holding torque alike.
    axis.duty.loadTorqueNm *= f(draw.pct.loadTorque);
    axis.duty.peakTorqueNm *= f(draw.pct.loadTorque);
    axis.duty.holdTorqueNm = (axis.duty.holdTorqueNm ?? 0) * f(draw.pct.loadTorque);
    axis.reliability ??= {};
    axis.reliability.stepLossEventsPerYear =
      (axis.reliability.stepLossEventsPerYear ?? 0) * f(draw.pct.stepLossEvents);
  }
  const expected = evaluateCase(changed).scenarios.physics;
  // Doubles summed in another order: equal to far below a cent.
  expect(dec(draw.npv).minus(expected.npv).abs().toNumber()).toBeLessThan(1e-6);
  if (expected.paybackYears === null) expect(draw.paybackYears).toBeNull();
  else expect(draw.paybackYears).toBeCloseTo(expected.paybackYears, 9);
}

describe("dossier tables", () => {
  const result = evaluateCase(fixtureCase);

  it("spreads each year's flow evenly over its months, and pays back in the month the engine's payback falls", () => {
    const { rows, paybackMonth } = dossier.monthly;
    expect(rows).toHaveLength(1 + 12 * input.finance.horizonYears);
    expect(rows[0].flow).toBe(result.scenarios.physics.cashFlows[0]);
    for (let t = 1; t <= input.finance.horizonYears; t++) {
      const sum = rows.filter((r) => r.year === t).reduce((s, r) => s.plus(r.flow), new Money(0));
      expect(sum.minus(result.scenarios.physics.cashFlows[t]).abs().toNumber()).toBeLessThan(1e-20);
    }
    const payback = result.scenarios.physics.paybackYears!;
    expect(paybackMonth).toBe(Math.ceil(payback * 12));
  });

  it("centres the tariff × hours table on the engine's payback, shorter as tariff and hours rise", () => {
    const { paybackYears, tariffPct, hoursPct, tariffs } = dossier.paybackGrid;
    const centre = tariffPct.indexOf(0);
    expect(paybackYears[centre][hoursPct.indexOf(0)]).toBe(result.scenarios.physics.paybackYears);
    expect(tariffs[centre]).toBe("0.24");
    for (let i = 1; i < tariffPct.length; i++) {
      expect(paybackYears[i][centre]!).toBeLessThan(paybackYears[i - 1][centre]!);
      expect(paybackYears[centre][i]!).toBeLessThan(paybackYears[centre][i - 1]!);
    }
  });

  it("gives the engine's own sensitivity at ±10, ±20 and ±30 %", () => {
    for (const { swingPct, rows } of dossier.sensitivity) {
      const changed = raw();
      changed.sensitivity = { swingPct };
      expect(rows).toEqual(evaluateCase(changed).sensitivity);
    }
    expect(dossier.sensitivity.map((s) => s.swingPct)).toEqual([10, 20, 30]);
  });

  it("lists both loops' torque–speed points and each state's current, losses and input power per axis", () => {
    expect(dossier.axes.map((a) => a.id)).toEqual(result.axes.map((a) => a.id));
    dossier.axes.forEach((detail, i) => {
      expect(detail.curves.open).toEqual(torqueSpeedCurve(input.axes[i], "open", 25));
      expect(detail.curves.closed).toEqual(torqueSpeedCurve(input.axes[i], "closed", 25));
      const move = detail.states.find((s) => s.loop === "closed" && s.state === "move")!;
      expect(move.inputPowerW).toBe(result.axes[i].closedLoop.inputPowerW.move);
      expect(detail.thermal.open.windingTempC).toBe(result.axes[i].openLoop.windingTempC);
      // IEC 60085 thermal classes: B 130 °C, F 155 °C, H 180 °C.
      const limit = { B: 130, F: 155, H: 180 }[input.axes[i].motor.insulationClass];
      expect(detail.thermal.open.classLimitC).toBe(limit);
    });
    expect(dossier.result).toEqual(result);
  });
});

describe("the draws' generator", () => {
  it("is MT19937: seed 5489 gives 3499211612 then 581869302 (reference mt19937ar.c, Matsumoto & Nishimura 1998)", async () => {
    const { mersenne } = await import("pure-rand/generator/mersenne");
    const rng = mersenne(5489);
    expect([rng.next() >>> 0, rng.next() >>> 0]).toEqual([3499211612, 581869302]);
    // ISO C++ [rand.predef]: the 10000th output of a default-seeded mt19937 is 4123659995.
    let value = 0;
    for (let i = 3; i <= 10000; i++) value = rng.next() >>> 0;
    expect(value).toBe(4123659995);
    expect(dossier.uncertainty.generator).toMatch(/^MT19937/);
  });
});
