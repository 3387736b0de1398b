import { eq } from "drizzle-orm";
import { db } from "@/db";
import { salesSettings } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import {
  DEFAULT_DISCOUNT_THRESHOLD_PCT,
  DEFAULT_STAGE_PROBABILITIES,
  QUOTE_STAGES,
  STAGE_LABELS,
} from "@/lib/pipeline/stages";
import type { SalesSettingsInput } from "@/lib/validations/pipeline";
import { recordAudit } from "./audit";

export type SalesSettings = SalesSettingsInput & { isDefault: boolean };

// Read by every role's pages and checks (the pipeline's weights, the send check); no caller needed
// because the figures themselves are not secret within the vendor, and reviewers never get them
// from any route.
export function getSalesSettings(): SalesSettings {
  const row = db.select().from(salesSettings).where(eq(salesSettings.id, 1)).get();
  if (!row)
    return {
      discountThresholdPct: DEFAULT_DISCOUNT_THRESHOLD_PCT,
      stageProbabilities: { ...DEFAULT_STAGE_PROBABILITIES },
      isDefault: true,
    };
  return {
    discountThresholdPct: row.discountThresholdPct,
    // A stage added later falls back to its default.
    stageProbabilities: { ...DEFAULT_STAGE_PROBABILITIES, ...row.stageProbabilities },
    isDefault: false,
  };
}

export function saveSalesSettings(caller: SessionUser, input: SalesSettingsInput) {
  assertRole(caller, "admin");
  const before = getSalesSettings();
  const values = { ...input, updatedAt: new Date().toISOString() };
  db.insert(salesSettings)
    .values({ id: 1, ...values })
    .onConflictDoUpdate({ target: salesSettings.id, set: values })
    .run();
  const changes = [
    before.discountThresholdPct !== input.discountThresholdPct
      ? `discount threshold ${before.discountThresholdPct} → ${input.discountThresholdPct} %`
      : null,
    ...QUOTE_STAGES.filter((s) => before.stageProbabilities[s] !== input.stageProbabilities[s]).map(
      (s) =>
        `${STAGE_LABELS[s]} ${before.stageProbabilities[s]} → ${input.stageProbabilities[s]} %`,
    ),
  ].filter(Boolean);
  recordAudit({
    actor: caller,
    action: "settings.sales",
    targetType: "settings",
    targetId: "sales",
    detail: changes.join("; ") || "no change",
  });
}
