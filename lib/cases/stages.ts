// The stages of a working case, from first model to decision. db/schema/cases.ts stores them.
export const CASE_STAGES = ["draft", "modelled", "proposed", "won", "lost"] as const;
export type CaseStage = (typeof CASE_STAGES)[number];
