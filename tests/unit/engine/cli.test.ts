import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ENGINE_VERSION } from "@/lib/engine";
import { caseResultSchema } from "@/tests/support/case-result-schema";

const run = (...args: string[]) =>
  spawnSync("npx", ["tsx", "lib/cli/evaluate.ts", ...args], {
    cwd: process.cwd(),
    encoding: "utf8",
  });

describe("npm run evaluate (issue 3)", () => {
  it("prints the CaseResult of a valid case as JSON with the engine version", () => {
    const out = run("tests/fixtures/engine-case.json");
    expect(out.status).toBe(0);
    const result = caseResultSchema.parse(JSON.parse(out.stdout)); // the docs/contracts.md (Case result) contract, key by key
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    expect(result.axes).toHaveLength(3);
    expect(out.stdout).toContain('\n  "currency": "EUR"');
  });

  it("exits 2 with one line per problem, each naming its JSON path", () => {
    const out = run("tests/fixtures/engine-case-invalid.json");
    expect(out.status).toBe(2);
    expect(out.stdout).toBe("");
    const lines = out.stderr.trim().split("\n");
    expect(lines).toHaveLength(8);
    expect(lines).toContain("axes[0].motor.ratedCurrentA: expected a number, received string");
    expect(lines).toContain("axes[0].duty.peakTorqueNm: must be at least loadTorqueNm (0.35)");
  });

  it("exits 2 on a missing file argument, an unreadable file and invalid JSON", () => {
    expect(run().status).toBe(2);
    const missing = run("tests/fixtures/no-such-case.json");
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain("cannot read");
    const file = join(mkdtempSync(join(tmpdir(), "loopshift-")), "truncated.json");
    writeFileSync(file, '{ "currency": "EUR", ');
    const notJson = run(file);
    expect(notJson.status).toBe(2);
    expect(notJson.stderr).toContain("not valid JSON");
  });
});
