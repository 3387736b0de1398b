import { DRIVER_LABELS } from "./drivers";
import { FINANCE_TERMS } from "./finance";
import { ROLE_LABELS } from "./roles";
import { SCENARIO_LABELS } from "./scenarios";
import { CASE_STAGE_LABELS, DECISION_LABELS, QUOTE_STAGE_LABELS } from "./stages";
import {
  BAND_POSITION_LABELS,
  CHECKOUT_STATUS_LABELS,
  LOOP_STATUS_LABELS,
  MAIL_STATUS_LABELS,
  PAYBACK_STATUS_LABELS,
} from "./statuses";

/**
 * Each family of terms by the name a screen marks it with (`data-term="quote-stage"`), so that
 * a test can read a page and check every marked word against the family it claims to be from.
 */
export const TERMS_BY_KIND = {
  "case-stage": Object.values(CASE_STAGE_LABELS),
  "quote-stage": Object.values(QUOTE_STAGE_LABELS),
  decision: Object.values(DECISION_LABELS),
  "checkout-status": Object.values(CHECKOUT_STATUS_LABELS),
  "mail-status": Object.values(MAIL_STATUS_LABELS),
  "loop-status": Object.values(LOOP_STATUS_LABELS),
  "payback-status": Object.values(PAYBACK_STATUS_LABELS),
  "band-position": Object.values(BAND_POSITION_LABELS),
  scenario: Object.values(SCENARIO_LABELS),
  driver: Object.values(DRIVER_LABELS),
  finance: Object.values(FINANCE_TERMS),
  role: Object.values(ROLE_LABELS),
} as const satisfies Record<string, readonly string[]>;

export type TermKind = keyof typeof TERMS_BY_KIND;

/**
 * Whether a printed word is the glossary's term of that kind. A trade-claim scenario prints the
 * band it assumes after its name ("Low trade claim (20 % saved)"); the name is what must match.
 */
export function isGlossaryTerm(kind: TermKind, printed: string): boolean {
  const text = printed.trim();
  const name = kind === "scenario" ? text.replace(/ \(\d+(\.\d+)? % saved\)$/, "") : text;
  return (TERMS_BY_KIND[kind] as readonly string[]).includes(name);
}
