import { Badge } from "@/components/ui/badge";
import type { CaseStage } from "@/lib/cases/stages";

const TONES: Record<CaseStage, "neutral" | "flux" | "coil" | "success" | "danger"> = {
  draft: "neutral",
  modelled: "flux",
  proposed: "coil",
  won: "success",
  lost: "danger",
};

export function StageBadge({ stage }: { stage: CaseStage }) {
  return <Badge tone={TONES[stage]}>{stage}</Badge>;
}
