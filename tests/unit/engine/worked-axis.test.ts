import { describe, expect, it } from "vitest";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import { evaluateCase } from "@/lib/engine";

/*
 * One axis worked by hand from ENGINE.md (independently of the engine; values to 16 digits).
 * Invented NEMA 23 class motor: T_H 1.26 N·m, I_R 2.8 A, R20 0.9 Ω, L 3.2 mH, Nr 50,
 * kh 0.004 W/Hz, ke 2e-6 W/Hz². Drive 48 V, 2.8 A peak, micro, idle 50 %, η 90 %, standby 2 W.
 * Duty 4000 h, move 40 %, hold 40 %, 300 rpm, load 0.25 N·m, peak 0.45 N·m, ambient 40 °C.
 * Kit keeps the motor: encoder, I_max = √2·2.8 = 3.959797974644666 A, η 92 %, 3 W + 0.5 W.
 *
 * §3  k1 = 1.26/(√2·2.8) = 0.31819805153394637 N·m/A
 *     f_e = 50·300/60 = 250 Hz; ω_m = 31.41592653589793 rad/s
 *     P_fe = 0.004·250 + 2e-6·250² = 1.125 W; T_drag = 1.125/31.4159 = 0.03580986219567645 N·m
 * §5  R_th = 80/(2·2.8²·0.9) = 5.6689342403628125 K/W
 *   Open loop: A = 0.9·(0.4·2.8² + 0.4·1.4²) = 3.528 W, B = 0.4·1.125 = 0.45 W
 *     T_w = [40 + 5.66893·(3.528·(1 − 20·0.00393) + 0.45)] / (1 − 5.66893·3.528·0.00393) = 66.18083395719911 °C
 *     R_hot = 0.9·(1 + 0.00393·46.18083) = 1.0633416097066133 Ω
 *   Closed loop: I_q = (0.25 + 0.0358099)/0.318198 = 0.8982137408380244 A; hold at I_min = 0.39597979746446665 A
 *     A = 0.9·(0.4·0.898214² + 0.4·0.395980²) = 0.34689165272288564 W, B = 0.45 W
 *     T_w = 44.70848263370072 °C, R_hot = 0.9873939030753994 Ω
 * Losses (open / closed): copper move 8.336598220099846 / 0.796617477459794 W,
 *     copper hold 2.0841495550249616 / 0.15482336400222266 W, iron 1.125 W; P_mech = 0.25·31.4159 = 7.853981633974483 W
 * §6  P_in move = (7.853982 + 1.125 + 8.336598)/0.9 + 2 = 21.2395331711937 W (closed: /0.92 + 3.5 = 14.125651208080734 W)
 *     P_in hold = 2.084150/0.9 + 2 = 4.315721727805513 W (closed 3.668286265219807 W); off 2 W (closed 3.5 W)
 *     E = 4000·(0.4·21.23953 + 0.4·4.31572 + 0.2·2)/1000 = 42.48840783839874 kWh (closed 31.27029995728087 kWh)
 *     cabinet heat 2.8622101959599684 W (closed 3.845405999145617 W); cooling at COP 1.5: 7.632560522559916 kWh
 *       (closed 10.254415997721646 kWh)
 *     saving 11.218107881117874 kWh = 26.4027494835416 % (within 25–50 %); cooling −2.6218554751617296 kWh
 * §7  I_avail(300 rpm) open 8.743871198129037 A > 2.8 A, so T_po = 0.318198·2.8 − 0.0358099 = 0.8551446820993732 N·m
 *     margin = 100·(1 − 0.45/0.855145) = 47.377325799974145 % ≥ 40 → ok; usable 0.5130868092596239 N·m
 *     closed: T_cl = 0.318198·3.959798 − 0.0358099 = 1.2241901378043236 N·m, margin 63.24100430941972 %,
 *       usable 1.0405616171336751 N·m; torque freed 0.5274748078740512 N·m = 102.80420356843494 %
 *     load angle asin(0.25/0.855145) = 16.9985911506886° elec = 0.339971823013772° mech
 *     bisection: n_max open 866.5008544921875 rpm, closed 1036.468505859375 rpm; headroom 245.489501953125 %
 *     temperature drop 21.472351323498394 K, life factor 2^(21.47235/10) = 4.429780250562648
 * §8  capex = 189 + 1.5·85 + 40 = 356.5; reliability = 6·0.9·180 = 972 per year
 *     CF_t = (11.218108 − 2.621855)·0.24 + 972 = 974.06310057742947432 (t = 1..5, no escalation)
 *     NPV at 8 % = 3532.651518422903…; payback 356.5/974.0631 = 0.3659927162713227 years;
 *     ROI = 100·(5·974.0631 − 356.5)/356.5 = 1266.1474061394522 %; IRR 2.728502927647918
 */
const result = evaluateCase(handCase);
const axis = result.axes[0];
const close = (actual: number | null, expected: number) => expect(actual).toBeCloseTo(expected, 10);

describe("one axis worked by hand (ENGINE.md §3–§8)", () => {
  it("open loop: temperature, resistance, losses, power and energy", () => {
    const o = axis.openLoop;
    close(o.windingTempC, 66.18083395719911);
    close(o.resistanceHotOhm, 1.0633416097066133);
    close(o.copperLossMoveW, 8.336598220099846);
    close(o.copperLossHoldW, 2.0841495550249616);
    close(o.ironLossW, 1.125);
    close(o.inputPowerW.move, 21.2395331711937);
    close(o.inputPowerW.hold, 4.315721727805513);
    close(o.inputPowerW.off, 2);
    close(o.energyKWhPerYear, 42.48840783839874);
    close(o.cabinetHeatW, 2.8622101959599684);
    close(o.coolingKWhPerYear, 7.632560522559916);
  });

  it("open loop: torque at speed, margin, load angle, max speed", () => {
    const o = axis.openLoop;
    close(o.torqueAtSpeedNm, 0.8551446820993732);
    close(o.marginPct, 47.377325799974145);
    expect(o.status).toBe("ok");
    close(o.usableTorqueNm, 0.5130868092596239);
    close(o.loadAngleElecDeg, 16.9985911506886);
    close(o.loadAngleMechDeg, 0.339971823013772);
    close(o.maxSpeedRpm, 866.5008544921875);
  });

  it("closed loop: currents, temperature, losses, energy, torque", () => {
    const c = axis.closedLoop;
    close(c.currentMoveA, 0.8982137408380244);
    close(c.currentHoldA, 0.39597979746446665);
    close(c.windingTempC, 44.70848263370072);
    close(c.resistanceHotOhm, 0.9873939030753994);
    close(c.copperLossMoveW, 0.796617477459794);
    close(c.copperLossHoldW, 0.15482336400222266);
    close(c.inputPowerW.move, 14.125651208080734);
    close(c.inputPowerW.hold, 3.668286265219807);
    close(c.inputPowerW.off, 3.5);
    close(c.energyKWhPerYear, 31.27029995728087);
    close(c.cabinetHeatW, 3.845405999145617);
    close(c.coolingKWhPerYear, 10.254415997721646);
    close(c.torqueAtSpeedNm, 1.2241901378043236);
    close(c.marginPct, 63.24100430941972);
    expect(c.status).toBe("ok");
    close(c.usableTorqueNm, 1.0405616171336751);
    close(c.maxSpeedRpm, 1036.468505859375);
  });

  it("savings", () => {
    const s = axis.savings;
    close(s.energyKWhPerYear, 11.218107881117874);
    close(s.energyPct, 26.4027494835416);
    expect(s.band).toBe("within");
    close(s.coolingKWhPerYear, -2.6218554751617296);
    close(s.tempDropK, 21.472351323498394);
    close(s.insulationLifeFactor, 4.429780250562648);
    close(s.torqueFreedNm, 0.5274748078740512);
    close(s.torqueFreedPct, 102.80420356843494);
    close(s.speedHeadroomPct, 245.489501953125);
    close(s.stepLossEventsAvoided, 5.4);
    expect(axis.warnings).toEqual([]);
  });

  it("capex and cash flows", () => {
    expect(axis.capex).toBe("356.5");
    expect(result.totals.capex).toBe("356.5");
    expect(result.totals.reliabilityPerYear).toBe("972");
    const physics = result.scenarios.physics;
    expect(physics.cashFlows).toHaveLength(6);
    expect(physics.cashFlows[0]).toBe("-356.5");
    for (const flow of physics.cashFlows.slice(1))
      expect(Number(flow)).toBeCloseTo(974.06310057742947432, 9);
    expect(Number(physics.npv)).toBeCloseTo(3532.651518422903, 8);
    close(physics.paybackYears, 0.3659927162713227);
    close(physics.roiPct, 1266.1474061394522);
    expect(physics.irr).toBeCloseTo(2.728502927647918, 8);
  });
});
