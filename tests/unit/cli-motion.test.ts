import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { caseResultSchema } from "@/tests/support/case-result-schema";

// The command of the docs/contracts.md itself, as a user types it.
const evaluate = (file: string) =>
  spawnSync("npm", ["run", "--silent", "evaluate", "--", file], {
    cwd: process.cwd(),
    encoding: "utf8",
  });

describe("npm run evaluate with engine v2 inputs (docs/contracts.md (Case input), docs/model.md (Motion from the mechanism))", () => {
  it("evaluates axes given by their mechanism and move, with an event build-up and a resonance band", () => {
    const out = evaluate("tests/fixtures/engine-case-motion.json");
    expect(out.stderr).toBe("");
    expect(out.status).toBe(0);
    // The docs/contracts.md (Case result) contract of engine 2, key by key.
    const result = caseResultSchema.parse(JSON.parse(out.stdout));
    const input = JSON.parse(readFileSync("tests/fixtures/engine-case-motion.json", "utf8"));
    expect(result.axes.map((a) => a.id)).toEqual(input.axes.map((a: { id: string }) => a.id));
    for (const axis of result.axes) {
      const motion = axis.motion!;
      expect(motion.speedRpm).toBeGreaterThan(0);
      expect(motion.peakTorqueNm).toBeGreaterThanOrEqual(motion.loadTorqueNm);
      // docs/model.md (Motion from the mechanism): the shares of the running hours add up to energizedPct (90 % and the default 100 %).
      const energized = input.axes.find((a: { id: string }) => a.id === axis.id).duty.motion
        .energizedPct;
      expect(motion.movePct + motion.holdPct).toBeCloseTo(energized ?? 100, 9);
    }
    const [screw, belt] = result.axes;
    // The vertical screw holds its load at rest; the horizontal belt holds nothing.
    expect(screw.motion!.holdTorqueNm).toBeGreaterThan(0);
    expect(screw.warnings).toContain("HOLDING_LOAD");
    expect(belt.motion!.holdTorqueNm).toBe(0);
  });

  it("exits 2 with one line per problem, each naming its JSON path", () => {
    const out = evaluate("tests/fixtures/engine-case-motion-invalid.json");
    expect(out.status).toBe(2);
    expect(out.stdout).toBe("");
    const lines = out.stderr.trim().split("\n");
    expect(lines).toHaveLength(4);
    expect(lines).toContain(
      "axes[0].duty.motion.leadMm: required for a screw: the lead in mm per screw turn",
    );
    expect(
      lines.some((l) => l.startsWith("axes[0].reliability.event: give either costPerEvent")),
    ).toBe(true);
    expect(
      lines.some((l) => l.startsWith("axes[1].duty.motion.radiusMm: required for a belt")),
    ).toBe(true);
    expect(
      lines.some((l) => l.startsWith("axes[1].duty.motion.motorInertiaKgM2.unit: must be one of")),
    ).toBe(true);
  });
});
