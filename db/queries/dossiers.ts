import crypto from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import {
  accounts,
  appSettings,
  cases,
  dossierGrants,
  dossierSettings,
  proposals,
  quotes,
} from "@/db/schema";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import {
  DEFAULT_RANGES,
  MAX_SEED,
  dossierPriceSchema,
  uncertaintySettingsSchema,
  type DossierPrice,
  type UncertaintySettings,
} from "@/lib/validations/dossier";
import { recordAudit } from "./audit";
import { getProposalOrThrow, proposalWithCaseQuery } from "./proposal-versions";
import { proposalScope } from "./proposals";

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
 * The proposal whose dossier the caller may reach. The vendor's people reach it through their
 * accounts; the customer's reviewer (the dossier is bought for their investment committee) only
 * a proposal sent to their own account, as in their portal. Anything else is not found.
 */
function dossierProposalOrThrow(caller: SessionUser, proposalId: number) {
  if (caller.role !== "reviewer") return getProposalOrThrow(caller, proposalId);
  const row = proposalWithCaseQuery()
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .where(and(eq(proposals.id, proposalId), proposalScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such proposal");
  return row;
}

/**
 * The uncertainty ranges and seed of a proposal's dossier. The first read records the default
 * ranges with a fresh random seed, so that every later build of the dossier draws the same.
 * Reviewers read them; only the vendor's people change them (saveDossierSettings).
 */
export function getDossierSettings(caller: SessionUser, proposalId: number): UncertaintySettings {
  dossierProposalOrThrow(caller, proposalId);
  const row = db
    .select()
    .from(dossierSettings)
    .where(eq(dossierSettings.proposalId, proposalId))
    .get();
  if (row) return uncertaintySettingsSchema.parse(row.settings);
  const settings: UncertaintySettings = { seed: crypto.randomInt(0, MAX_SEED), ...DEFAULT_RANGES };
  // Recording the defaults is not an edit: a reviewer who reads first is not named as its author.
  const updatedById = caller.role === "reviewer" ? null : caller.id;
  db.insert(dossierSettings)
    .values({ proposalId, settings, updatedById })
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
  const proposal = dossierProposalOrThrow(caller, proposalId);
  const grant =
    db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposal.id)).get() ?? null;
  return { proposal, grant, price: readDossierPrice() };
}

/**
 * Whether a proposal the caller may see has its dossier paid for; false for one they may not
 * see. A light check for links, without reading the frozen input.
 */
export function isDossierPaid(caller: SessionUser, proposalId: number): boolean {
  const row = db
    .select({ id: dossierGrants.id })
    .from(dossierGrants)
    .innerJoin(proposals, eq(proposals.id, dossierGrants.proposalId))
    .leftJoin(quotes, eq(quotes.proposalId, proposals.id))
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .where(and(eq(dossierGrants.proposalId, proposalId), proposalScope(caller)))
    .get();
  return row !== undefined;
}
