import type { LoopResult } from "@/lib/engine";
import { LOOP_STATUS_LABELS, type LoopStatusKey } from "@/lib/glossary";
import { formatNumber } from "./format";

/** Badge tones of components/ui/badge, named here so that the words and the colour agree. */
export type StatusTone = "success" | "caution" | "danger" | "neutral";

export interface LoopStatusView {
  words: string;
  tone: StatusTone;
  /** The margin against what the loop needs, e.g. "margin 31 % (needs 40 %)". */
  detail: string;
}

const TONE: Record<LoopStatusKey, StatusTone> = {
  ok: "success",
  "at-risk": "caution",
  "step-loss": "danger",
  undersized: "danger",
};

const isKnown = (status: string): status is LoopStatusKey => status in TONE;

/** A loop's status in words and tone (docs/model.md (Torque margin and speed)), never by colour alone. */
export function loopStatus(loop: LoopResult, requiredPct: number | null): LoopStatusView {
  const known = isKnown(loop.status)
    ? { words: LOOP_STATUS_LABELS[loop.status], tone: TONE[loop.status] }
    : { words: loop.status, tone: "neutral" as const };
  const margin =
    loop.marginPct === null
      ? "no torque at this speed"
      : `margin ${formatNumber(loop.marginPct, 0)} %`;
  const needs = requiredPct === null ? "" : ` (needs ${formatNumber(requiredPct, 0)} %)`;
  return { ...known, detail: `${margin}${needs}` };
}
