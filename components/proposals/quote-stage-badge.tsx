import { Badge } from "@/components/ui/badge";
import { STAGE_LABELS, type QuoteStage } from "@/lib/pipeline/stages";

const TONES: Record<QuoteStage, "neutral" | "flux" | "coil" | "success" | "caution" | "danger"> = {
  ready: "neutral",
  sent: "flux",
  changes: "caution",
  accepted: "success",
  declined: "danger",
  replaced: "neutral",
};

export function QuoteStageBadge({ stage }: { stage: QuoteStage }) {
  return (
    <Badge tone={TONES[stage]} term="quote-stage">
      {STAGE_LABELS[stage]}
    </Badge>
  );
}
