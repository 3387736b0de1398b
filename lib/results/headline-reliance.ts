import type { CaseResult, ParsedCase } from "@/lib/engine";
import type { EvidenceIndex } from "@/lib/evidence/subjects";
import { SCENARIO_LABELS, scenarioLabel } from "@/lib/glossary";
import { DEFAULT_BAND } from "./case-view";
import { SCENARIO_KEYS, type ScenarioKey } from "./scenarios";
import { evidencedReliance, relianceSentence, valueReliance } from "./value-reliance";
import { lowerFirst } from "@/lib/words";

/**
 * Who reads the headline's warning: the vendor records sources, the customer's reviewer asks for
 * them, and a report (the dossier the vendor hands on) tells whoever holds it to check them.
 */
export type RelianceAudience = "vendor" | "reviewer" | "report";

/** The recorded sources the headline weighs (db/queries/evidence.ts), with whose screen it is. */
export interface HeadlineEvidence {
  caseId: number;
  index: EvidenceIndex;
  audience?: RelianceAudience;
}

/** The one note above the scenario cards about what the value rests on. */
export interface HeadlineRelianceNote {
  /** "caution" when most of a scenario's value rests on typed (unsourced) figures. */
  tone: "caution" | "plain";
  /** The bold lead of a caution. */
  title: string | null;
  text: string;
  /** The warning weighs recorded sources: most of the value rests on figures without one. */
  unevidenced: boolean;
}

/** How many figures the warning names before "and N more". */
const NAMED = 4;

/** The first few figures in words: "a; b and c", or "a; b; and 3 more". */
export function figureList(figures: readonly string[], shown = NAMED): string {
  const named = figures.slice(0, shown);
  const more = figures.length - named.length;
  return more > 0
    ? `${named.join("; ")}; and ${more} more`
    : named.length > 1
      ? `${named.slice(0, -1).join("; ")} and ${named[named.length - 1]}`
      : (named[0] ?? "");
}

/** What the reader of the warning does about figures without a source. */
export function askForSources(audience: RelianceAudience = "vendor"): string {
  switch (audience) {
    case "reviewer":
      return "Ask your supplier where each comes from before relying on the net present value.";
    case "report":
      return "Check where each comes from before relying on the net present value.";
    case "vendor":
      return "Record where each comes from (a note, a date and who gave it) before relying on the net present value.";
  }
}

/** One scenario's share of the value the note is about, and whether it is more than half. */
interface Share {
  key: ScenarioKey;
  pct: number;
  mostly: boolean;
}

/**
 * The three scenarios share their typed figures and differ only in the energy and cooling they
 * count (docs/model.md (The business case)), so one note serves all three cards: it speaks of the
 * engineering estimate, the basis of the proposal, and gives the trade-claim scenarios' shares
 * beside it, saying so where one of them is on the other side of half.
 */
function otherScenarios(shares: Share[], band: { lowPct: number; highPct: number }): string {
  const [physics, ...others] = shares;
  if (!physics || others.length === 0) return "";
  const parts = others.map((s) => {
    const where = `${s.pct} % in the ${lowerFirst(scenarioLabel(s.key, band))}`;
    if (s.mostly === physics.mostly) return where;
    return `${where}, ${s.mostly ? "more than half" : "half or less"}`;
  });
  return ` In the other scenarios: ${parts.join("; ")}.`;
}

const PHYSICS_LEAD = `In the ${lowerFirst(SCENARIO_LABELS.physics)}, the basis of the proposal, `;

/**
 * The headline's note on what the value rests on, once for the three scenario cards. With the
 * case's recorded sources (the case page, a proposal page, the dossier): a caution when more than
 * half of a scenario's value rests on typed figures without a source, naming them, or a plain
 * note when the value is mostly typed but mostly sourced. Without them (the input is not at
 * hand): the plainer caution that the value is mostly typed. Null when none of this holds.
 */
export function headlineReliance(
  result: CaseResult,
  input: ParsedCase | null,
  evidence?: HeadlineEvidence,
): HeadlineRelianceNote | null {
  const band = input?.band ?? DEFAULT_BAND;
  if (evidence && input) {
    const splits = SCENARIO_KEYS.map((key) => ({
      key,
      split: evidencedReliance(
        result.scenarios[key],
        result,
        input,
        evidence.index,
        evidence.caseId,
      ),
    }));
    const physics = splits[0]?.split;
    if (!physics) return null;
    const shares: Share[] = splits.flatMap(({ key, split }) =>
      split ? [{ key, pct: split.unevidencedPct, mostly: split.mostlyUnevidenced }] : [],
    );
    if (shares.some((s) => s.mostly)) {
      const list = figureList(physics.unevidencedFigures);
      return {
        tone: "caution",
        title: "Mostly typed figures without a source.",
        text: `${PHYSICS_LEAD}${physics.unevidencedPct} % of the value over the horizon rests on typed figures with no recorded source${list ? `: ${list}` : ""}.${otherScenarios(shares, band)} ${askForSources(evidence.audience)}`,
        unevidenced: true,
      };
    }
    if (!physics.mostlyTyped) return null;
    return {
      tone: "plain",
      title: null,
      text: `${PHYSICS_LEAD}${relianceSentence(physics)} ${physics.evidencedPct} % rests on figures whose source is recorded.`,
      unevidenced: false,
    };
  }
  const reliances = SCENARIO_KEYS.map((key) => ({ key, r: valueReliance(result.scenarios[key]) }));
  const physics = reliances[0]?.r;
  if (!physics) return null;
  const shares: Share[] = reliances.flatMap(({ key, r }) =>
    r ? [{ key, pct: r.typedPct, mostly: r.mostlyTyped }] : [],
  );
  if (!shares.some((s) => s.mostly)) return null;
  return {
    tone: "caution",
    title: "Mostly typed figures.",
    text: `${PHYSICS_LEAD}${relianceSentence(physics)}${otherScenarios(shares, band)}`,
    unevidenced: false,
  };
}
