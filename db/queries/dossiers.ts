import crypto from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { appSettings, dossierGrants, dossierSettings } from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import {
  DEFAULT_RANGES,
  MAX_SEED,
  dossierPriceSchema,
  uncertaintySettingsSchema,
  type DossierPrice,
  type UncertaintySettings,
} from "@/lib/validations/dossier";
import { recordAudit } from "./audit";
import { getProposalOrThrow } from "./cases";

const PRICE_KEY = "dossier.price";

/** Until an administrator sets one: an invented list price, stated as such on the admin page. */
export const DEFAULT_DOSSIER_PRICE: DossierPrice = { amount: "490.00", currency: "EUR" };

/**
 * The dossier's price. A global setting every signed-in vendor user may read, and the only
 * price a checkout uses: the client never names an amount.
 */
export function readDossierPrice(): DossierPrice & { isDefault: boolean } {
  const row = db.select().from(appSettings).where(eq(appSettings.key, PRICE_KEY)).get();
  const parsed = row ? dossierPriceSchema.safeParse(row.value) : null;
  return parsed?.success
    ? { ...parsed.data, isDefault: false }
    : { ...DEFAULT_DOSSIER_PRICE, isDefault: true };
}

export function setDossierPrice(caller: SessionUser, price: DossierPrice) {
  assertRole(caller, "admin");
  const value = dossierPriceSchema.parse(price);
  db.insert(appSettings)
    .values({ key: PRICE_KEY, value, updatedById: caller.id })
    .onConflictDoUpdate({
      target: appSettings.key,
      set: { value, updatedById: caller.id, updatedAt: new Date().toISOString() },
    })
    .run();
  recordAudit({
    actor: caller,
    action: "dossier.price",
    targetType: "setting",
    targetId: PRICE_KEY,
    detail: `${value.amount} ${value.currency}`,
  });
  return value;
}

/**
 * The uncertainty ranges and seed of a proposal's dossier. The first read records the default
 * ranges with a fresh random seed, so that every later build of the dossier draws the same.
 */
export function getDossierSettings(caller: SessionUser, proposalId: number): UncertaintySettings {
  getProposalOrThrow(caller, proposalId);
  const row = db
    .select()
    .from(dossierSettings)
    .where(eq(dossierSettings.proposalId, proposalId))
    .get();
  if (row) return uncertaintySettingsSchema.parse(row.settings);
  const settings: UncertaintySettings = { seed: crypto.randomInt(0, MAX_SEED), ...DEFAULT_RANGES };
  db.insert(dossierSettings)
    .values({ proposalId, settings, updatedById: caller.id })
    .onConflictDoNothing()
    .run();
  // Another request may have recorded its seed first: the stored one wins.
  return uncertaintySettingsSchema.parse(
    db.select().from(dossierSettings).where(eq(dossierSettings.proposalId, proposalId)).get()!
      .settings,
  );
}

export function saveDossierSettings(
  caller: SessionUser,
  proposalId: number,
  input: UncertaintySettings,
): UncertaintySettings {
  const proposal = getProposalOrThrow(caller, proposalId);
  const settings = uncertaintySettingsSchema.parse(input);
  db.insert(dossierSettings)
    .values({ proposalId, settings, updatedById: caller.id })
    .onConflictDoUpdate({
      target: dossierSettings.proposalId,
      set: { settings, updatedById: caller.id, updatedAt: new Date().toISOString() },
    })
    .run();
  recordAudit({
    actor: caller,
    action: "dossier.settings",
    targetType: "proposal",
    targetId: proposalId,
    detail: `${proposal.caseName} v${proposal.version}, seed ${settings.seed}`,
  });
  return settings;
}

/** The proposal as the caller may see it, and whether its account has paid for the dossier. */
export function getDossierAccess(caller: SessionUser, proposalId: number) {
  const proposal = getProposalOrThrow(caller, proposalId);
  const grant =
    db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposal.id)).get() ?? null;
  return { proposal, grant, price: readDossierPrice() };
}
