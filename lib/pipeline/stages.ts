import { QUOTE_STAGE_LABELS } from "../glossary";

// Where a proposal stands with the customer, in Loopshift's own words (labels below).
// "replaced" is an open version that a newer frozen version of the same case took over from.
export const QUOTE_STAGES = [
  "ready",
  "sent",
  "changes",
  "accepted",
  "declined",
  "replaced",
] as const;
export type QuoteStage = (typeof QUOTE_STAGES)[number];

// The stages of a quote in Loopshift's words, for badges, filters and charts (lib/glossary).
export const STAGE_LABELS: Record<QuoteStage, string> = QUOTE_STAGE_LABELS;

// Stages still in play: their value is the open pipeline.
export const OPEN_STAGES: readonly QuoteStage[] = ["ready", "sent", "changes"];
// Stages a proposal can be sent from (again): a replaced or decided one cannot.
export const SENDABLE_STAGES: readonly QuoteStage[] = ["ready", "sent", "changes"];
// Stages a reviewer can still decide on.
export const DECIDABLE_STAGES: readonly QuoteStage[] = ["sent", "changes"];

/**
 * Chance of closing per stage, in percent, until the administrator sets the vendor's own. These
 * are rough figures from common sales practice (a quote not yet sent rarely closes, one under
 * review about as often as not), marked as estimates to replace with the vendor's win history.
 */
export const DEFAULT_STAGE_PROBABILITIES: Record<QuoteStage, number> = {
  ready: 10,
  sent: 40,
  changes: 30,
  accepted: 100,
  declined: 0,
  replaced: 0,
};

/** A kit discount above this needs a manager's approval before the proposal is sent. */
export const DEFAULT_DISCOUNT_THRESHOLD_PCT = 15;

export function isQuoteStage(value: unknown): value is QuoteStage {
  return typeof value === "string" && (QUOTE_STAGES as readonly string[]).includes(value);
}
