import { describe, expect, it } from "vitest";
import { torqueSpeedCurve } from "@/lib/engine";
import { torqueSpeedTable, torqueSpeedView } from "@/lib/results/torque-speed";
import { input, result } from "./fixture";

describe("torque–speed curves", () => {
  const [gantry, , feed] = input.axes;
  const view = torqueSpeedView(gantry, input.margins);

  it("draws the usable torque as T·(1 − required/100) of each loop (docs/model.md (Torque margin and speed))", () => {
    view.open.forEach((p, i) => {
      expect(view.openUsable[i].rpm).toBe(p.rpm);
      expect(view.openUsable[i].torqueNm).toBeCloseTo(p.torqueNm * 0.6, 12);
    });
    view.closed.forEach((p, i) => {
      expect(view.closedUsable[i].torqueNm).toBeCloseTo(p.torqueNm * 0.85, 12);
    });
  });

  it("follows the engine's capability curve of each loop", () => {
    const engine = torqueSpeedCurve(gantry, "closed", 241);
    for (const p of view.closed) {
      const same = engine.find((q) => q.rpm === p.rpm)!;
      expect(p.torqueNm).toBe(same.torqueNm);
    }
  });

  it("puts the operating point at the moving speed and peak torque", () => {
    expect(view.operatingPoint).toEqual({ speedRpm: 300, peakTorqueNm: 0.45 });
    expect(view.maxRpm).toBeGreaterThanOrEqual(300);
  });

  it("meets the engine's torque at the operating speed, open and closed loop", () => {
    const row = torqueSpeedTable(view).find((r) => r.rpm === 300)!;
    expect(row.open).toBeCloseTo(result.axes[0].openLoop.torqueAtSpeedNm, 3);
    expect(row.closed).toBeCloseTo(result.axes[0].closedLoop.torqueAtSpeedNm, 3);
    expect(row.openUsable).toBeCloseTo(result.axes[0].openLoop.usableTorqueNm, 3);
    expect(row.closedUsable).toBeCloseTo(result.axes[0].closedLoop.usableTorqueNm, 3);
  });

  it("cuts the speed axis where both loops have run out of torque, not at 6000 rpm", () => {
    expect(view.maxRpm).toBeLessThan(6000);
    expect(view.closed[view.closed.length - 1].rpm).toBeLessThanOrEqual(view.maxRpm);
  });

  it("shows no open-loop figure beyond a datasheet curve's last point", () => {
    const feedView = torqueSpeedView(feed, input.margins);
    expect(feedView.open[feedView.open.length - 1].rpm).toBe(900);
    const rows = torqueSpeedTable(feedView);
    expect(rows.filter((r) => r.rpm > 900).every((r) => r.open === null && r.closed !== null)).toBe(
      true,
    );
    // Between the datasheet's 600 rpm (0.28 N·m) and 900 rpm (0.20 N·m) points, linearly.
    const between = feedView.open.filter((p) => p.rpm > 600 && p.rpm < 900);
    expect(between.length).toBeGreaterThan(0);
    for (const point of between)
      expect(point.torqueNm).toBeCloseTo(0.28 - ((point.rpm - 600) / 300) * 0.08, 9);
  });
});
