import fc from "fast-check";
import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import { evaluateCase, torqueSpeedCurve, type CaseInput } from "@/lib/engine";
import { COPPER_ALPHA_PER_K } from "@/lib/engine/motor";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
type Json = any;

/** Invented axes around the hand-worked one: physics inputs drawn, money kept simple. */
const axisArb = fc.record({
  holdingTorqueNm: fc.double({ min: 0.2, max: 4, noNaN: true }),
  ratedCurrentA: fc.double({ min: 1, max: 5, noNaN: true }),
  phaseResistanceOhm: fc.double({ min: 0.2, max: 3, noNaN: true }),
  phaseInductanceMh: fc.double({ min: 0.5, max: 10, noNaN: true }),
  hysteresisWPerHz: fc.double({ min: 0, max: 0.01, noNaN: true }),
  eddyWPerHz2: fc.double({ min: 0, max: 1e-5, noNaN: true }),
  stepMode: fc.constantFrom("full", "half", "half-compensated", "micro"),
  settingShare: fc.double({ min: 0.3, max: 1, noNaN: true }),
  busVoltageV: fc.constantFrom(24, 36, 48, 72),
  movePct: fc.integer({ min: 0, max: 70 }),
  holdPct: fc.integer({ min: 0, max: 30 }),
  speedRpm: fc.integer({ min: 0, max: 1500 }),
  loadShare: fc.double({ min: 0, max: 0.6, noNaN: true }),
  sensing: fc.constantFrom("encoder", "sensorless"),
});

type AxisDraw = typeof axisArb extends fc.Arbitrary<infer T> ? T : never;

function caseFor(d: AxisDraw, loadTorqueNm?: number): Json {
  const input = structuredClone(handCase) as Json;
  const axis = input.axes[0];
  Object.assign(axis.motor, {
    holdingTorqueNm: d.holdingTorqueNm,
    ratedCurrentA: d.ratedCurrentA,
    phaseResistanceOhm: d.phaseResistanceOhm,
    phaseInductanceMh: d.phaseInductanceMh,
    hysteresisWPerHz: d.hysteresisWPerHz,
    eddyWPerHz2: d.eddyWPerHz2,
  });
  Object.assign(axis.drive, {
    stepMode: d.stepMode,
    currentSettingA: d.ratedCurrentA * d.settingShare,
    busVoltageV: d.busVoltageV,
  });
  const load = loadTorqueNm ?? d.holdingTorqueNm * d.loadShare;
  Object.assign(axis.duty, {
    movePct: d.movePct,
    holdPct: d.holdPct,
    speedRpm: d.speedRpm,
    loadTorqueNm: load,
    peakTorqueNm: load * 1.5,
  });
  axis.retrofit.kit.sensing = d.sensing;
  return input;
}

describe("physical invariants (docs/model.md (Torque at speed to Energy and cooling))", () => {
  it("open loop where the bus drives the setting: currents, losses and temperature do not depend on the load; energy only through P_mech", () => {
    // docs/model.md (Currents at the operating point) keeps the open-loop current at the setting whatever the load while the bus can drive
    // it (low speed, high bus); docs/model.md (Energy and cooling) still counts the mechanical power the load draws, so the
    // energy less P_mech/η is what must not move.
    fc.assert(
      fc.property(
        axisArb,
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        (d, a, b) => {
          const [x, y] = [a, b].map((share) => {
            const input = caseFor(
              { ...d, speedRpm: Math.min(d.speedRpm, 60), busVoltageV: 72 },
              d.holdingTorqueNm * share,
            );
            const open = evaluateCase(input).axes[0].openLoop;
            const duty = input.axes[0].duty;
            const mechanicalKWh =
              (4000 *
                (duty.movePct / 100) *
                ((duty.loadTorqueNm * 2 * Math.PI * duty.speedRpm) / 60)) /
              0.9 /
              1000;
            return { open, rest: open.energyKWhPerYear - mechanicalKWh };
          });
          expect(x.open.currentMoveA).toBe(y.open.currentMoveA);
          expect(x.open.copperLossMoveW).toBe(y.open.copperLossMoveW);
          expect(x.open.windingTempC).toBe(y.open.windingTempC);
          expect(x.open.torqueAtSpeedNm).toBe(y.open.torqueAtSpeedNm);
          expect(x.rest).toBeCloseTo(y.rest, 9);
        },
      ),
    );
  });

  it("closed loop: energy never falls as the load rises (outside thermal runaway)", () => {
    fc.assert(
      fc.property(
        axisArb,
        fc.double({ min: 0, max: 0.6, noNaN: true }),
        fc.double({ min: 0, max: 0.6, noNaN: true }),
        (d, a, b) => {
          const [lo, hi] = [Math.min(a, b), Math.max(a, b)].map(
            (share) => evaluateCase(caseFor(d, d.holdingTorqueNm * share)).axes[0].closedLoop,
          );
          // Runaway switches to the class-limit resistance, which is not a continuation of the heat balance.
          fc.pre(lo.windingTempC !== null && hi.windingTempC !== null);
          expect(hi.energyKWhPerYear).toBeGreaterThanOrEqual(lo.energyKWhPerYear - 1e-12);
        },
      ),
    );
  });

  it("torque capability never rises with speed, in both loops", () => {
    fc.assert(
      fc.property(axisArb, (d) => {
        const axis = caseFor(d).axes[0];
        for (const loop of ["open", "closed"] as const) {
          const curve = torqueSpeedCurve(axis, loop, 121);
          for (let i = 1; i < curve.length; i++)
            expect(curve[i].torqueNm).toBeLessThanOrEqual(curve[i - 1].torqueNm + 1e-12);
        }
      }),
    );
  });

  it("a datasheet curve is made non-increasing before it is used", () => {
    const axis = structuredClone(handCase.axes[0]) as Json;
    axis.motor.pullOutCurve = [
      { rpm: 0, torqueNm: 0.8 },
      { rpm: 200, torqueNm: 0.6 },
      { rpm: 400, torqueNm: 0.7 },
      { rpm: 600, torqueNm: 0.4 },
    ];
    const curve = torqueSpeedCurve(axis, "open", 31);
    for (let i = 1; i < curve.length; i++)
      expect(curve[i].torqueNm).toBeLessThanOrEqual(curve[i - 1].torqueNm);
    expect(curve.find((p) => p.rpm === 400)?.torqueNm).toBeCloseTo(0.6, 12);
  });

  it("the winding temperature solves its own heat balance: T_w = T_amb + R_th·(losses at R(T_w))", () => {
    fc.assert(
      fc.property(axisArb, (d) => {
        const input = caseFor(d);
        const { motor, duty } = input.axes[0];
        // common practice default, calibrated with the winding hot (80 K rise)
        const rth =
          80 /
          (2 * motor.ratedCurrentA ** 2 * motor.phaseResistanceOhm * (1 + COPPER_ALPHA_PER_K * 80));
        const axis = evaluateCase(input).axes[0];
        for (const loop of [axis.openLoop, axis.closedLoop]) {
          fc.pre(loop.windingTempC !== null);
          const t = loop.windingTempC as number;
          expect(loop.resistanceHotOhm).toBeCloseTo(
            motor.phaseResistanceOhm * (1 + COPPER_ALPHA_PER_K * (t - 20)),
            10,
          );
          const m = duty.movePct / 100;
          const h = duty.holdPct / 100;
          const losses = m * loop.copperLossMoveW + h * loop.copperLossHoldW + m * loop.ironLossW;
          expect(t).toBeCloseTo((duty.ambientC ?? 40) + rth * losses, 8); // ambient default 40 °C
        }
      }),
    );
  });

  it("a kit that keeps the motor and is no less efficient, with no more standby, never uses more energy", () => {
    // Holds when the closed-loop current never exceeds today's in any state: an encoder kit (a
    // sensorless one runs slow axes at I_max), a load the setting carries, no holding load, and an
    // I_min below today's idle current; and outside open-loop runaway, whose class-limit resistance
    // would undercut the closed loop's real hot resistance.
    fc.assert(
      fc.property(
        axisArb,
        fc.double({ min: 0, max: 8, noNaN: true }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        (d, efficiencyGain, kitStandbyW) => {
          // Slow enough that neither drive runs short of voltage: at speed an open-loop drive may
          // draw less than its setting while the kit pays for field weakening (docs/model.md (Currents at the operating point)).
          const input = caseFor({
            ...d,
            sensing: "encoder",
            settingShare: Math.max(d.settingShare, 0.5),
            speedRpm: Math.min(d.speedRpm, 300),
            busVoltageV: 72,
          });
          const axis = input.axes[0];
          axis.drive.efficiencyPct = 88;
          axis.drive.standbyW = 4;
          axis.drive.idleCurrentPct = 50;
          Object.assign(axis.retrofit.kit, {
            efficiencyPct: 88 + efficiencyGain,
            standbyW: kitStandbyW,
            encoderW: 4 - kitStandbyW,
            minCurrentPct: 10,
          });
          const k1 = d.holdingTorqueNm / (Math.SQRT2 * d.ratedCurrentA);
          const fe = (50 * d.speedRpm) / 60;
          const drag =
            d.speedRpm === 0
              ? 0
              : (d.hysteresisWPerHz * fe + d.eddyWPerHz2 * fe * fe) /
                ((2 * Math.PI * d.speedRpm) / 60);
          const loadMax = k1 * axis.drive.currentSettingA - drag;
          fc.pre(loadMax > 0);
          axis.duty.loadTorqueNm = loadMax * d.loadShare;
          axis.duty.peakTorqueNm = axis.duty.loadTorqueNm;
          const result = evaluateCase(input).axes[0];
          fc.pre(result.openLoop.windingTempC !== null);
          // The bus still drives today's setting and the kit needs no field weakening: the
          // back-EMF stays below half the bus (a motor with a large back-EMF may need both).
          fc.pre(result.openLoop.currentMoveA === axis.drive.currentSettingA);
          fc.pre(k1 * ((2 * Math.PI * axis.duty.speedRpm) / 60) < axis.drive.busVoltageV / 2);
          expect(result.closedLoop.energyKWhPerYear).toBeLessThanOrEqual(
            result.openLoop.energyKWhPerYear * (1 + 1e-12),
          );
        },
      ),
    );
  });
});

describe("quantity (docs/model.md (The business case), docs/contracts.md (Case result))", () => {
  it("doubling every quantity doubles every total and leaves per-unit figures unchanged", () => {
    // Downtime, project cost and throughput are per machine or per case, not per unit: set to 0.
    const base = structuredClone(fixtureCase) as Json;
    base.finance.projectOneTimeCost = "0";
    base.finance.downtimeCostPerHour = "0";
    for (const machine of base.machines) machine.throughputGainPct = 0;
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 3, maxLength: 3 }),
        (quantities) => {
          const once = structuredClone(base);
          once.axes.forEach((axis: Json, i: number) => (axis.quantity = quantities[i]));
          const twice = structuredClone(once);
          twice.axes.forEach((axis: Json) => (axis.quantity *= 2));
          const a = evaluateCase(once as CaseInput);
          const b = evaluateCase(twice as CaseInput);
          const money = (x: string) => Number(x);
          expect(money(b.totals.capex)).toBeCloseTo(2 * money(a.totals.capex), 8);
          expect(money(b.totals.reliabilityPerYear)).toBeCloseTo(
            2 * money(a.totals.reliabilityPerYear),
            8,
          );
          expect(money(b.totals.maintenancePerYear)).toBeCloseTo(
            2 * money(a.totals.maintenancePerYear),
            8,
          );
          expect(b.totals.throughputPerYear).toBe("0");
          for (const key of [
            "energyOpenLoopKWhPerYear",
            "energyClosedLoopKWhPerYear",
            "energySavedKWhPerYear",
            "coolingSavedKWhPerYear",
            "co2TonnesPerYear",
          ] as const) {
            expect(b.totals[key]).toBeCloseTo(2 * a.totals[key], 9);
          }
          a.axes.forEach((axis, i) => {
            const other = b.axes[i];
            expect(other.openLoop).toEqual(axis.openLoop);
            expect(other.closedLoop).toEqual(axis.closedLoop);
            expect(other.savings).toEqual(axis.savings);
            expect(other.capex).toBe(axis.capex);
            expect(money(other.totals.capex)).toBeCloseTo(2 * money(axis.totals.capex), 9);
            expect(other.totals.energySavedKWhPerYear).toBeCloseTo(
              2 * axis.totals.energySavedKWhPerYear,
              9,
            );
            expect(other.totals.coolingSavedKWhPerYear).toBeCloseTo(
              2 * axis.totals.coolingSavedKWhPerYear,
              9,
            );
          });
        },
      ),
      { numRuns: 30 },
    );
  });
});
