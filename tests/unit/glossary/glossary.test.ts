import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { CASE_STAGES } from "@/db/schema/cases";
import { CHECKOUT_STATUSES } from "@/db/schema/dossiers";
import { mailQueue } from "@/db/schema/mail";
import { QUOTE_STAGES } from "@/db/schema/quotes";
import { ROLES } from "@/db/schema/users";
import { SENSITIVITY_DRIVERS } from "@/lib/engine";
import {
  BAND_POSITION_LABELS,
  CASE_STAGE_LABELS,
  CHECKOUT_STATUS_LABELS,
  DECISION_CHOICES,
  DECISION_LABELS,
  DRIVER_LABELS,
  LOOP_STATUS_LABELS,
  MAIL_STATUS_LABELS,
  PAYBACK_STATUS_LABELS,
  QUOTE_STAGE_LABELS,
  ROLE_LABELS,
  SCENARIO_LABELS,
  TERMS_BY_KIND,
  isGlossaryTerm,
  scenarioLabel,
} from "@/lib/glossary";
import { SCENARIO_KEYS } from "@/lib/results/scenarios";
import { DECISIONS } from "@/lib/validations/pipeline";
import { SCENARIOS } from "@/lib/workbook/layout";

const sorted = (keys: readonly string[]) => [...keys].sort();

// The keys each family must label, as the database, the engine and the validations hold them.
const FAMILIES: [string, Record<string, string>, readonly string[]][] = [
  ["case stages", CASE_STAGE_LABELS, CASE_STAGES],
  ["quote stages", QUOTE_STAGE_LABELS, QUOTE_STAGES],
  ["decisions", DECISION_LABELS, DECISIONS],
  [
    "decision choices",
    Object.fromEntries(Object.entries(DECISION_CHOICES).map(([k, v]) => [k, v.label])),
    DECISIONS,
  ],
  ["dossier payments", CHECKOUT_STATUS_LABELS, CHECKOUT_STATUSES],
  ["outbox", MAIL_STATUS_LABELS, mailQueue.status.enumValues],
  ["roles", ROLE_LABELS, ROLES],
  ["scenarios", SCENARIO_LABELS, SCENARIO_KEYS],
  ["sensitivity drivers", DRIVER_LABELS, SENSITIVITY_DRIVERS],
  ["loop statuses", LOOP_STATUS_LABELS, ["ok", "at-risk", "step-loss", "undersized"]],
  ["payback statuses", PAYBACK_STATUS_LABELS, ["reached", "beyond-horizon", "never"]],
  ["band positions", BAND_POSITION_LABELS, ["below", "within", "above"]],
];

describe("the glossary of user-facing terms", () => {
  it.each(FAMILIES)(
    "labels every one of the %s the app stores, and nothing else",
    (_, labels, keys) => {
      expect(sorted(Object.keys(labels))).toEqual(sorted(keys));
      for (const key of keys) expect(labels[key]?.trim(), key).toBeTruthy();
    },
  );

  it.each(FAMILIES)("gives no two of the %s the same label", (_, labels) => {
    const values = Object.values(labels);
    expect(new Set(values).size).toBe(values.length);
  });

  it("never names a case stage and a quote stage alike, since both show on the same pages", () => {
    const caseLabels = new Set(Object.values(CASE_STAGE_LABELS));
    for (const label of Object.values(QUOTE_STAGE_LABELS))
      expect(caseLabels.has(label)).toBe(false);
  });

  it("prints no raw key on screen: every label differs from its lower-case key", () => {
    for (const [, labels] of FAMILIES)
      for (const [key, label] of Object.entries(labels)) expect(label).not.toBe(key);
  });

  it("names the workbook's scenarios as the screens and the e-mails do", () => {
    expect(sorted(SCENARIOS)).toEqual(sorted(SCENARIO_KEYS));
    const band = { lowPct: 25, highPct: 50 };
    expect(scenarioLabel("physics", band)).toBe(SCENARIO_LABELS.physics);
    expect(scenarioLabel("bandLow", band)).toBe(`${SCENARIO_LABELS.bandLow} (25 % saved)`);
    expect(isGlossaryTerm("scenario", scenarioLabel("bandHigh", band))).toBe(true);
    expect(isGlossaryTerm("scenario", "Modelled physics")).toBe(false);
  });

  it("speaks to finance in plain words and in British spelling", () => {
    const every = Object.values(TERMS_BY_KIND).flat();
    expect(every.length).toBeGreaterThan(40);
    for (const term of every) {
      expect(term).not.toMatch(/\blabor|\bcolor|modeled|catalog\b|\bcapex\b|\bphysics\b/i);
    }
    expect(DRIVER_LABELS.laborRate).toBe("Labour rate");
    expect(SCENARIO_LABELS.physics).toBe("Engineering estimate");
  });

  it("stays pure: no file of lib/glossary imports the database or the server", () => {
    const dir = path.join(process.cwd(), "lib/glossary");
    const files = readdirSync(dir).filter((f) => f.endsWith(".ts"));
    expect(files.length).toBeGreaterThan(0);
    for (const file of files) {
      const source = readFileSync(path.join(dir, file), "utf8");
      expect(source, file).not.toMatch(/from\s+["'](@\/|\.\.\/)+(db|server)\b|server-only/);
    }
  });
});
