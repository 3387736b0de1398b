import { QUOTE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";

/** One <option> per quote stage, in pipeline order and in our words. */
export function QuoteStageOptions() {
  return QUOTE_STAGES.map((s) => (
    <option key={s} value={s}>
      {STAGE_LABELS[s]}
    </option>
  ));
}
