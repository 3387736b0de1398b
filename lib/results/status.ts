import type { LoopResult } from "@/lib/engine";
import { formatNumber } from "./format";

/** Badge tones of components/ui/badge, named here so that the words and the colour agree. */
export type StatusTone = "success" | "caution" | "danger" | "neutral";

export interface LoopStatusView {
  words: string;
  tone: StatusTone;
  /** The margin against what the loop needs, e.g. "margin 31 % (needs 40 %)". */
  detail: string;
}

const STATUS: Record<string, { words: string; tone: StatusTone }> = {
  ok: { words: "Margin kept", tone: "success" },
  "at-risk": { words: "Thin margin", tone: "caution" },
  "step-loss": { words: "Loses steps", tone: "danger" },
  undersized: { words: "Kit too small", tone: "danger" },
};

/** A loop's status in words and tone (docs/model.md (Torque margin and speed)), never by colour alone. */
export function loopStatus(loop: LoopResult, requiredPct: number | null): LoopStatusView {
  const known = STATUS[loop.status] ?? { words: loop.status, tone: "neutral" as const };
  const margin =
    loop.marginPct === null
      ? "no torque at this speed"
      : `margin ${formatNumber(loop.marginPct, 0)} %`;
  const needs = requiredPct === null ? "" : ` (needs ${formatNumber(requiredPct, 0)} %)`;
  return { ...known, detail: `${margin}${needs}` };
}
