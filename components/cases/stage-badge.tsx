import { Badge } from "@/components/ui/badge";
import type { CaseStage } from "@/lib/cases/stages";
import { CASE_STAGE_LABELS } from "@/lib/glossary";

const TONES: Record<CaseStage, "neutral" | "flux" | "coil" | "success" | "danger"> = {
  draft: "neutral",
  modelled: "flux",
  proposed: "coil",
  won: "success",
  lost: "danger",
};

export function StageBadge({ stage }: { stage: CaseStage }) {
  return (
    <Badge tone={TONES[stage]} term="case-stage">
      {CASE_STAGE_LABELS[stage]}
    </Badge>
  );
}
