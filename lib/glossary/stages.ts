/**
 * Stage names of a case and of a quote (a frozen proposal being sold). The keys mirror
 * CASE_STAGES and QUOTE_STAGES of db/schema, which this pure module cannot import; the unit test
 * tests/unit/glossary/glossary.test.ts fails when the two lists part.
 */

export type CaseStageKey = "draft" | "modelled" | "proposed" | "won" | "lost";

/** A case from its first draft to the customer's answer. */
export const CASE_STAGE_LABELS: Record<CaseStageKey, string> = {
  draft: "Draft",
  modelled: "Modelled",
  proposed: "Proposed",
  won: "Won",
  lost: "Lost",
};

export type QuoteStageKey = "ready" | "sent" | "changes" | "accepted" | "declined" | "replaced";

/** Where a proposal stands with the customer: badges, filters, charts and the pipeline. */
export const QUOTE_STAGE_LABELS: Record<QuoteStageKey, string> = {
  ready: "Ready to send",
  sent: "With the customer",
  changes: "Changes asked",
  accepted: "Accepted",
  declined: "Declined",
  replaced: "Replaced by a newer version",
};

export type DecisionKey = "accept" | "changes" | "decline";

/**
 * A reviewer's recorded decision, as a badge on the comment that carried it. Each reads as the
 * quote stage the decision moves the proposal to, so the thread and the stage badge agree.
 */
export const DECISION_LABELS: Record<DecisionKey, string> = {
  accept: QUOTE_STAGE_LABELS.accepted,
  changes: QUOTE_STAGE_LABELS.changes,
  decline: QUOTE_STAGE_LABELS.declined,
};

/** The three answers a reviewer chooses between, as the decision form offers them. */
export const DECISION_CHOICES: Record<DecisionKey, { label: string; hint: string }> = {
  accept: {
    label: "Accept the proposal",
    hint: "Your supplier will plan the retrofit with you.",
  },
  changes: {
    label: "Ask for changes",
    hint: "Say what should change; a new version will follow.",
  },
  decline: { label: "Decline", hint: "Nothing further happens with this version." },
};
