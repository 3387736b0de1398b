import { describe, expect, it } from "vitest";
import {
  AXIS_WARNINGS,
  MACHINE_WARNINGS,
  type CaseResult,
  type MotionResult,
  type Scenario,
} from "@/lib/engine";
import { axisRows, warningGroups } from "@/lib/results/axis-rows";
import {
  breakEvenLines,
  formatFactor,
  formatInertia,
  formatTariff,
  hasBreakEven,
  holdingView,
  motionRows,
  paybackLead,
  paybackSentence,
  paybackShort,
  paybackStatusWords,
  valueBySource,
} from "@/lib/results/engine-v2";
import { WARNING_ADVICE, WARNING_TITLES, explainWarning } from "@/lib/results/warnings";
import { input, result } from "./fixture";

// The fixture is evaluated by whatever engine is on the branch; these tests set the engine-2
// fields themselves, so that they check the wording whatever the physics gives.
const zeros = (n: number) => Array.from({ length: n }, () => "0");

function scenario(overrides: Partial<Scenario>): Scenario {
  return {
    cashFlows: ["-1000", "400", "400", "400", "400", "400"],
    npv: "597.08",
    irr: 0.28,
    paybackYears: 2.5,
    discountedPaybackYears: 3.1,
    roiPct: 100,
    paybackStatus: "reached",
    bySource: {
      energy: zeros(5),
      cooling: zeros(5),
      reliability: zeros(5),
      maintenance: zeros(5),
      throughput: zeros(5),
      service: zeros(5),
      tax: zeros(5),
    },
    ...overrides,
  };
}

function withV2(overrides: {
  npv?: string;
  breakEven?: CaseResult["breakEven"];
  energySaved?: number;
  reliabilityPerYear?: string;
}): CaseResult {
  return {
    ...result,
    totals: {
      ...result.totals,
      energySavedKWhPerYear: overrides.energySaved ?? 1000,
      coolingSavedKWhPerYear: 0,
      reliabilityPerYear: overrides.reliabilityPerYear ?? "500",
    },
    scenarios: {
      ...result.scenarios,
      physics: scenario({ npv: overrides.npv ?? "597.08" }),
    },
    breakEven: overrides.breakEven ?? { tariffPerKWh: "0.0831", stepLossFactor: 0.3 },
  };
}

/** A result as engine 1.0.0 stored it: none of the engine-2 fields exist. */
const V2_KEYS = ["breakEven", "paybackStatus", "bySource", "motion", "holdingCapabilityNm"];
function storedV1(): CaseResult {
  // A reviver that answers undefined drops the key, as the stored JSON of 1.0.0 never had it.
  const json = JSON.parse(JSON.stringify(result), (key: string, value: unknown) =>
    V2_KEYS.includes(key) ? undefined : value,
  ) as CaseResult;
  return { ...json, engineVersion: "1.0.0" };
}

describe("payback in plain words (docs/model.md (The business case) payback status)", () => {
  it("a payback inside the horizon reads as its time, within the horizon", () => {
    const s = scenario({ paybackYears: 1.25 });
    expect(paybackStatusWords(s)).toBe("within the horizon");
    expect(paybackSentence(s, 5)).toBe("1 year 3 months, within the horizon");
    expect(paybackShort(s, 5)).toBe("1 year 3 months");
    expect(paybackLead(s, 5)).toBe("paid back in 1 year 3 months as modelled");
  });

  it("a case still gaining at the end of the horizon pays back after it", () => {
    const s = scenario({ paybackYears: null, paybackStatus: "beyond-horizon" });
    expect(paybackStatusWords(s)).toBe("after the horizon");
    expect(paybackShort(s, 5)).toBe("after the 5-year horizon");
    expect(paybackSentence(s, 5)).toMatch(/^after the 5-year horizon/);
  });

  it("a case whose last flow is not positive never pays back", () => {
    const s = scenario({ paybackYears: null, paybackStatus: "never" });
    expect(paybackStatusWords(s)).toBe("never");
    expect(paybackShort(s, 5)).toBe("never");
    expect(paybackLead(s, 5)).toBe("never paid back as modelled");
  });

  it("a stored engine-1.0.0 scenario without a status still reads sensibly", () => {
    const s = strip(scenario({ paybackYears: null }));
    expect(paybackStatusWords(s)).toBe("not within the horizon");
    expect(paybackShort(s, 5)).toBe("not within 5 years");
  });
});

function strip(s: Scenario): Scenario {
  const copy: Partial<Scenario> = { ...s };
  delete copy.paybackStatus;
  return copy as Scenario;
}

describe("break-even values in words (docs/model.md (The business case))", () => {
  it("states the break-even tariff to a tenth of a cent, beside today's", () => {
    const [tariff] = breakEvenLines(withV2({}), "0.21")!;
    expect(tariff.value).toBe("breaks even at €0.0831/kWh");
    expect(tariff.note).toMatch(/Today's tariff is €0\.21\/kWh/);
  });

  it("no break-even tariff while energy is saved means it pays back even with free energy", () => {
    const [tariff] = breakEvenLines(
      withV2({ breakEven: { tariffPerKWh: null, stepLossFactor: 0.3 } }),
      null,
    )!;
    expect(tariff.value).toBe("pays back even with free energy");
  });

  it("no break-even tariff when nothing is saved says the tariff does not move the NPV", () => {
    const [tariff] = breakEvenLines(
      withV2({ npv: "-10", energySaved: 0, breakEven: { tariffPerKWh: null, stepLossFactor: 2 } }),
      null,
    )!;
    expect(tariff.value).toBe("no break-even tariff");
    expect(tariff.note).toMatch(/does not help/);
  });

  it("the step-loss factor reads as a share of the events entered", () => {
    const [, events] = breakEvenLines(withV2({}), null)!;
    expect(events.value).toBe("breaks even at 0.3× the step-loss events entered");
    const [, more] = breakEvenLines(
      withV2({ breakEven: { tariffPerKWh: "0.1", stepLossFactor: 2.45 } }),
      null,
    )!;
    expect(more.value).toBe("breaks even at 2.5× the step-loss events entered");
  });

  it("a null factor with avoided events valued means it pays back without them", () => {
    const [, events] = breakEvenLines(
      withV2({ breakEven: { tariffPerKWh: "0.1", stepLossFactor: null } }),
      null,
    )!;
    expect(events.value).toBe("pays back without any avoided step-loss events");
  });

  it("a null factor without any valued events says none are counted", () => {
    const [, events] = breakEvenLines(
      withV2({
        npv: "-5",
        reliabilityPerYear: "0",
        breakEven: { tariffPerKWh: "0.1", stepLossFactor: null },
      }),
      null,
    )!;
    expect(events.value).toBe("no break-even count");
    expect(events.note).toMatch(/cannot make it pay back/);
  });

  it("formats factors and tariffs without false precision", () => {
    expect(formatFactor(0.3)).toBe("0.3×");
    expect(formatFactor(0.25)).toBe("0.25×");
    expect(formatFactor(12.4)).toBe("12×");
    expect(formatTariff("0.08314999", "EUR")).toBe("€0.0831/kWh");
    expect(formatTariff("0.2", "EUR")).toBe("€0.20/kWh");
  });
});

describe("value by source (docs/model.md (The business case))", () => {
  it("lists the sources that carry money, with totals, and the cash flow they add up to", () => {
    const s = scenario({
      bySource: {
        energy: ["300", "310", "320", "330", "340"],
        cooling: zeros(5),
        reliability: ["150", "150", "150", "150", "150"],
        maintenance: zeros(5),
        throughput: zeros(5),
        service: ["-50", "-50", "-50", "-50", "-50"],
        tax: zeros(5),
      },
    });
    const table = valueBySource(s, "EUR")!;
    expect(table.rows.map((r) => r.label)).toEqual([
      "Drive energy",
      "Step-loss events avoided",
      "Service of the closed loop",
    ]);
    expect(table.rows[0].total).toBe("1600.00");
    expect(table.flows!.years).toHaveLength(5);
    expect(table.flows!.total).toBe("2000.00");
  });
});

describe("motion and holding (docs/model.md (Motion from the mechanism), docs/model.md (Torque margin and speed))", () => {
  const motion: MotionResult = {
    speedRpm: 1280,
    loadTorqueNm: 0.41,
    peakTorqueNm: 0.9,
    holdTorqueNm: 0.35,
    meanMechPowerW: 22.5,
    movePct: 40,
    holdPct: 30,
    reflectedInertiaKgM2: 1.125e-3,
    inertiaRatio: 4.2,
  };

  it("shows the derived figures of axes that have a mechanism, and only those", () => {
    const r: CaseResult = {
      ...result,
      axes: result.axes.map((a, i) => ({ ...a, motion: i === 0 ? motion : null })),
    };
    const rows = motionRows(r);
    expect(rows).toHaveLength(1);
    expect(rows[0].inertiaRatioText).toBe("4.2 : 1");
    const unknown = motionRows({
      ...r,
      axes: [{ ...r.axes[0], motion: { ...motion, inertiaRatio: null } }],
    });
    expect(unknown[0].inertiaRatioText).toBe("rotor inertia not given");
  });

  it("inertias read in powers of ten (5 kg at 15 mm → 1.125·10⁻³ kg·m², textbook m·r²)", () => {
    expect(formatInertia(5 * 0.015 ** 2)).toBe("1.13 × 10⁻³ kg·m²");
    expect(formatInertia(2.533e-5)).toBe("2.53 × 10⁻⁵ kg·m²");
    expect(formatInertia(0)).toBe("0 kg·m²");
  });

  it("holding compares what today's drive holds with the load, and flags a slip", () => {
    const axis = {
      ...result.axes[0],
      warnings: ["HOLDING_LOAD", "OL_HOLD_SLIPS"] as CaseResult["axes"][0]["warnings"],
      openLoop: { ...result.axes[0].openLoop, holdingCapabilityNm: 0.2 },
      motion,
    };
    expect(holdingView(axis, 0)).toEqual({
      capabilityNm: 0.2,
      loadNm: 0.35,
      loadKnown: true,
      slips: true,
    });
    expect(holdingView({ ...axis, motion: null, warnings: [] }, 0)).toEqual({
      capabilityNm: 0.2,
      loadNm: null,
      loadKnown: true,
      slips: false,
    });
    // While the case's input is still loading, the load is not known rather than zero.
    expect(holdingView({ ...axis, motion: null }, null)?.loadKnown).toBe(false);
  });
});

describe("a proposal stored under engine 1.0.0", () => {
  const v1 = storedV1();

  it("has no break-even, value-by-source, motion or holding figures to show", () => {
    expect(hasBreakEven(v1)).toBe(false);
    expect(breakEvenLines(v1, "0.2")).toBeNull();
    expect(valueBySource(v1.scenarios.physics, v1.currency)).toBeNull();
    expect(motionRows(v1)).toEqual([]);
    expect(axisRows(v1, input).every((row) => row.holding === null)).toBe(true);
  });
});

describe("every warning says what to do", () => {
  it("has advice for each axis and machine warning code, as one instruction", () => {
    for (const code of [...AXIS_WARNINGS, ...MACHINE_WARNINGS]) {
      const advice = WARNING_ADVICE[code];
      expect(advice, code).toMatch(/^[A-Z].*\.$/);
      expect(explainWarning(code).advice, code).toBe(advice);
    }
    expect(Object.keys(WARNING_ADVICE).sort()).toEqual(
      [...AXIS_WARNINGS, ...MACHINE_WARNINGS].sort(),
    );
  });

  it("has a short title for each code, for the axis table", () => {
    for (const code of [...AXIS_WARNINGS, ...MACHINE_WARNINGS]) {
      expect(WARNING_TITLES[code], code).toMatch(/^[A-Z][^.]{3,40}$/);
    }
  });

  it("lists each warning of a case once, safety first, with the axes it concerns", () => {
    const r: CaseResult = {
      ...result,
      axes: result.axes.map((a, i) => ({
        ...a,
        warnings: i === 0 ? ["SAVING_OUTSIDE_BAND", "HOLDING_LOAD"] : ["SAVING_OUTSIDE_BAND"],
      })),
    };
    const groups = warningGroups(r, input);
    expect(groups.map((g) => g.code).slice(0, 2)).toEqual(["HOLDING_LOAD", "SAVING_OUTSIDE_BAND"]);
    expect(groups[1].concerns).toHaveLength(result.axes.length);
    expect(groups[0].advice).toMatch(/brake/);
  });

  it("load-at-rest warnings carry the brake and safe-stop caution", () => {
    for (const code of ["OL_HOLD_SLIPS", "SENSORLESS_HOLDING_LOAD"] as const) {
      expect(explainWarning(code).caution, code).toMatch(/brake and a safe-stop concept/);
    }
  });
});
