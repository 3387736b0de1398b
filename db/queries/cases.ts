import { and, asc, desc, eq, getTableColumns, inArray, sql } from "drizzle-orm";
import { ZodError } from "zod";
import { db } from "@/db";
import {
  accounts,
  axes,
  caseAxes,
  cases,
  inputRevision,
  kits,
  machines,
  motors,
  proposals,
  quotes,
  sites,
  users,
  type Axis,
  type Proposal,
  type QuoteStage,
} from "@/db/schema";
import { ENGINE_VERSION, type CaseInput, type CaseResult } from "@/lib/engine";
import { storedInputMessage, storedInputProblems } from "@/lib/results/stored-input-problems";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError, StoredInputError } from "@/lib/errors";
import type { AxisRetrofitInput, CaseAssumptions, CreateCaseInput } from "@/lib/validations/case";
import { accountScope, INSTALLED_BASE_ROLES } from "./accounts";
import { recordAudit } from "./audit";
import {
  assembleCaseInput,
  axisInputOf,
  defaultAssumptions,
  DEFAULT_RETROFIT_TERMS,
  kitInputOf,
  kitOptions,
  machineInputOf,
  suggestKitFor,
  type CaseAxisRow,
  type KitOption,
  type RetrofitTerms,
} from "./case-input";
import { proposalChanges } from "./proposal-changes";
import { openQuoteFor } from "./quote-open";
import { getSiteOrThrow } from "./sites";

// Cases are reached through their account, like sites: the caller's account scope is in every
// WHERE. Reviewers see frozen proposals through their own portal, never the working cases.
function scoped(caller: SessionUser) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return accountScope(caller);
}

const caseColumns = {
  ...getTableColumns(cases),
  accountName: accounts.name,
  siteName: sites.name,
  siteCurrency: sites.currency,
  ownerName: users.name,
  // Units, like a site's axis count: an axis row of quantity 4 is four motors to retrofit.
  axisCount: sql<number>`(select coalesce(sum(${axes.quantity}), 0) from ${caseAxes} inner join ${axes} on ${axes.id} = ${caseAxes.axisId} where ${caseAxes.caseId} = ${cases.id})`,
  latestVersion: sql<
    number | null
  >`(select max(${proposals.version}) from ${proposals} where ${proposals.caseId} = ${cases.id})`,
};

function caseQuery() {
  return db
    .select(caseColumns)
    .from(cases)
    .innerJoin(accounts, eq(cases.accountId, accounts.id))
    .innerJoin(sites, eq(cases.siteId, sites.id))
    .innerJoin(users, eq(cases.ownerId, users.id));
}

export type CaseRow = ReturnType<typeof getCaseOrThrow>;

export function listCases(caller: SessionUser) {
  return caseQuery().where(scoped(caller)).orderBy(desc(cases.updatedAt), desc(cases.id)).all();
}

export function getCaseOrThrow(caller: SessionUser, id: number) {
  const row = caseQuery()
    .where(and(eq(cases.id, id), scoped(caller)))
    .get();
  if (!row) throw new NotFoundError("No such case");
  return row;
}

// Strictly later than the previous stamp, so two edits within one millisecond still order.
function touch(caseId: number, previous: string, extra: Partial<typeof cases.$inferInsert> = {}) {
  const stamp = new Date(Math.max(Date.now(), Date.parse(previous) + 1)).toISOString();
  db.update(cases)
    .set({ ...extra, updatedAt: stamp })
    .where(eq(cases.id, caseId))
    .run();
}

export function createCase(caller: SessionUser, input: CreateCaseInput) {
  const site = getSiteOrThrow(caller, input.siteId);
  const [row] = db
    .insert(cases)
    .values({
      accountId: site.accountId,
      siteId: site.id,
      ownerId: caller.id,
      name: input.name,
      assumptions: defaultAssumptions(site),
    })
    .returning()
    .all();
  recordAudit({
    actor: caller,
    action: "case.create",
    targetType: "case",
    targetId: row.id,
    detail: input.name,
  });
  return row;
}

export function updateAssumptions(caller: SessionUser, caseId: number, values: CaseAssumptions) {
  const found = getCaseOrThrow(caller, caseId);
  touch(caseId, found.updatedAt, { assumptions: values });
}

function siteCurrency(siteId: number) {
  return db.select({ currency: sites.currency }).from(sites).where(eq(sites.id, siteId)).get()!
    .currency;
}

function loadKitOptions(currency: string) {
  return kitOptions(currency, db.select().from(kits).all(), db.select().from(motors).all());
}

/**
 * Picks the case's axes from its site. Axes no longer picked leave with their retrofit; new ones
 * get the engine's suggested kit, or the cheapest active kit when none keeps the margin (the
 * result then shows the axis undersized, which is what the engineer must see).
 */
export function setCaseAxes(caller: SessionUser, caseId: number, axisIds: number[]) {
  const found = getCaseOrThrow(caller, caseId);
  const wanted = [...new Set(axisIds)];
  // Only the wanted rows, in chunks under SQLite's bound-parameter limit: a site may hold tens of
  // thousands of axes.
  const siteAxes = new Map<number, Axis>();
  for (let i = 0; i < wanted.length; i += 500) {
    for (const a of db
      .select()
      .from(axes)
      .where(and(eq(axes.siteId, found.siteId), inArray(axes.id, wanted.slice(i, i + 500))))
      .all())
      siteAxes.set(a.id, a);
  }
  // An axis of another site, or of nobody, is not found: the same answer as for a missing one.
  if (siteAxes.size !== wanted.length) throw new NotFoundError("No such axis on this site");

  const current = new Set(
    db
      .select({ axisId: caseAxes.axisId })
      .from(caseAxes)
      .where(eq(caseAxes.caseId, caseId))
      .all()
      .map((r) => r.axisId),
  );
  const keep = new Set(wanted);
  const removed = [...current].filter((id) => !keep.has(id));
  const added = wanted.filter((id) => !current.has(id));

  let options: KitOption[] = [];
  if (added.length) {
    options = loadKitOptions(siteCurrency(found.siteId));
    if (options.length === 0)
      throw new ConflictError(
        "The catalogue has no active kit priced in this site's currency to propose",
      );
  }
  const newRows = added.map((axisId) => {
    const choice = suggestKitOrExplain(
      caseId,
      siteAxes.get(axisId)!,
      DEFAULT_RETROFIT_TERMS,
      options,
      found.assumptions.margins,
    );
    return { caseId, axisId, kitId: (choice.kit ?? options[0]).row.id };
  });

  db.transaction((tx) => {
    for (let i = 0; i < removed.length; i += 500) {
      tx.delete(caseAxes)
        .where(
          and(eq(caseAxes.caseId, caseId), inArray(caseAxes.axisId, removed.slice(i, i + 500))),
        )
        .run();
    }
    for (let i = 0; i < newRows.length; i += 500) {
      tx.insert(caseAxes)
        .values(newRows.slice(i, i + 500))
        .run();
    }
  });
  // A draft with axes has been modelled: it now has a result to look at.
  touch(
    caseId,
    found.updatedAt,
    found.stage === "draft" && wanted.length > 0 ? { stage: "modelled" } : {},
  );
  return { added: added.length, removed: removed.length, total: wanted.length };
}

/**
 * suggestKitFor, or — for an axis whose stored values the engine refuses (saved before its
 * bounds) — a StoredInputError naming the machine, the axis, the field and where to fix it.
 */
function suggestKitOrExplain(
  caseId: number,
  axis: Axis,
  terms: RetrofitTerms,
  options: KitOption[],
  margins: CaseAssumptions["margins"],
) {
  try {
    return suggestKitFor(axis, terms, options, margins);
  } catch (error) {
    if (!(error instanceof ZodError)) throw error;
    const machine = db.select().from(machines).where(eq(machines.id, axis.machineId)).get();
    const input = {
      machines: machine ? [machineInputOf(machine)] : [],
      axes: [axisInputOf(axis, options[0].input, terms)],
    };
    const issues = error.issues.map((issue) => ({ ...issue, path: ["axes", 0, ...issue.path] }));
    const problems = storedInputProblems(caseId, input, { issues });
    throw new StoredInputError(storedInputMessage(problems), problems);
  }
}

function caseAxisOrThrow(caseId: number, axisId: number) {
  const row = db
    .select()
    .from(caseAxes)
    .where(and(eq(caseAxes.caseId, caseId), eq(caseAxes.axisId, axisId)))
    .get();
  if (!row) throw new NotFoundError("No such axis in this case");
  return row;
}

export function setAxisRetrofit(
  caller: SessionUser,
  caseId: number,
  axisId: number,
  values: AxisRetrofitInput,
) {
  const found = getCaseOrThrow(caller, caseId);
  const current = caseAxisOrThrow(caseId, axisId);
  const kit = db.select().from(kits).where(eq(kits.id, values.kitId)).get();
  // A retired kit may stay where it is already proposed, but is not chosen anew.
  if (!kit || (!kit.active && kit.id !== current.kitId)) throw new NotFoundError("No such kit");
  const currency = siteCurrency(found.siteId);
  if (kit.currency !== currency)
    throw new ConflictError(
      `Kit ${kit.code} is priced in ${kit.currency}, this case in ${currency}`,
    );
  db.update(caseAxes)
    .set(values)
    .where(and(eq(caseAxes.caseId, caseId), eq(caseAxes.axisId, axisId)))
    .run();
  touch(caseId, found.updatedAt);
}

export type KitSuggestionRow = { axisId: number; kitId: number | null; reason: string };

/**
 * Runs the engine's suggestKit on every axis of the case with the active kits of its currency
 * and applies each suggestion; an axis for which no kit keeps the margin keeps its kit, and
 * the reason says why none fits.
 */
export function suggestKitsForCase(caller: SessionUser, caseId: number): KitSuggestionRow[] {
  const found = getCaseOrThrow(caller, caseId);
  const options = loadKitOptions(siteCurrency(found.siteId));
  const rows = db
    .select({ axis: axes, retrofit: caseAxes })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .where(eq(caseAxes.caseId, caseId))
    .orderBy(asc(axes.id))
    .all();
  const suggestions = rows.map(({ axis, retrofit }) => {
    const choice = suggestKitOrExplain(caseId, axis, retrofit, options, found.assumptions.margins);
    return {
      axisId: axis.id,
      kitId: choice.kit?.row.id ?? null,
      reason: choice.reason,
      changed: choice.kit != null && choice.kit.row.id !== retrofit.kitId,
    };
  });
  const changes = suggestions.filter((s) => s.changed);
  if (changes.length) {
    db.transaction((tx) => {
      for (const s of changes) {
        tx.update(caseAxes)
          .set({ kitId: s.kitId! })
          .where(and(eq(caseAxes.caseId, caseId), eq(caseAxes.axisId, s.axisId)))
          .run();
      }
    });
    touch(caseId, found.updatedAt);
  }
  return suggestions.map(({ axisId, kitId, reason }) => ({ axisId, kitId, reason }));
}

// The case's axes with their machine and retrofit, for the case page's tables.
export function listCaseAxes(caller: SessionUser, caseId: number) {
  return listCaseAxesOf(getCaseOrThrow(caller, caseId));
}

/** listCaseAxes for a case the caller has already been checked against (a getCaseOrThrow row). */
export function listCaseAxesOf(found: CaseRow) {
  const caseId = found.id;
  return db
    .select({
      axisId: axes.id,
      label: axes.label,
      quantity: axes.quantity,
      machineId: machines.id,
      machineName: machines.name,
      kitId: kits.id,
      kitCode: kits.code,
      kitName: kits.name,
      kitPrice: kits.price,
      kitActive: kits.active,
      discountPct: caseAxes.discountPct,
      installHours: caseAxes.installHours,
      commissioningCost: caseAxes.commissioningCost,
      maintenanceSavingPerYear: caseAxes.maintenanceSavingPerYear,
    })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .innerJoin(machines, eq(machines.id, axes.machineId))
    .innerJoin(kits, eq(kits.id, caseAxes.kitId))
    .where(eq(caseAxes.caseId, caseId))
    .orderBy(asc(machines.name), asc(axes.label), asc(axes.id))
    .all();
}

/** The CaseInput built from the rows of a case already fetched in the caller's scope. */
export function caseInputOf(found: CaseRow): CaseInput {
  const rows = db
    .select({ axis: axes, retrofit: caseAxes, kit: kits, kitMotor: motors })
    .from(caseAxes)
    .innerJoin(axes, eq(axes.id, caseAxes.axisId))
    .innerJoin(kits, eq(kits.id, caseAxes.kitId))
    .leftJoin(motors, eq(motors.id, kits.motorId))
    .where(eq(caseAxes.caseId, found.id))
    .orderBy(asc(axes.id))
    .all();
  const machineRows = db
    .select()
    .from(machines)
    .where(
      inArray(
        machines.id,
        db
          .select({ id: axes.machineId })
          .from(caseAxes)
          .innerJoin(axes, eq(axes.id, caseAxes.axisId))
          .where(eq(caseAxes.caseId, found.id)),
      ),
    )
    .all();
  // Kits repeat over thousands of axes; one KitInput per kit keeps the input small to build.
  const kitInputs = new Map<number, ReturnType<typeof kitInputOf>>();
  const axisRows: CaseAxisRow[] = rows.map(({ axis, retrofit, kit, kitMotor }) => {
    let kitInput = kitInputs.get(kit.id);
    if (!kitInput) kitInputs.set(kit.id, (kitInput = kitInputOf(kit, kitMotor)));
    return { axis, kit: kitInput, terms: retrofit };
  });
  return assembleCaseInput(siteCurrency(found.siteId), found.assumptions, machineRows, axisRows);
}

/** The exact CaseInput the engine receives for this case, built from its rows now. */
export function buildCaseInput(caller: SessionUser, caseId: number): CaseInput {
  return caseInputOf(getCaseOrThrow(caller, caseId));
}

/** The input revision: it moves with every write to a table a case input is built from. */
export function currentInputRevision(): number {
  return db
    .select({ revision: inputRevision.revision })
    .from(inputRevision)
    .where(eq(inputRevision.id, 1))
    .get()!.revision;
}

/**
 * Stores the case's next proposal version: the input as the engine received it, its result and
 * the engine version. Nothing updates a proposal afterwards (the database refuses it); its sales
 * side starts as a quote ready to send, and replaces the case's older open quotes. Freezing
 * (evaluate, then store) is server/cases/freeze.ts.
 */
export function storeProposalVersion(
  caller: SessionUser,
  found: CaseRow,
  input: CaseInput,
  result: CaseResult,
): Proposal {
  const caseId = found.id;
  const proposal = db.transaction((tx) => {
    const [{ last }] = tx
      .select({ last: sql<number | null>`max(${proposals.version})` })
      .from(proposals)
      .where(eq(proposals.caseId, caseId))
      .all();
    const [row] = tx
      .insert(proposals)
      .values({
        caseId,
        version: (last ?? 0) + 1,
        input,
        result,
        engineVersion: ENGINE_VERSION,
        createdById: caller.id,
      })
      .returning()
      .all();
    openQuoteFor(tx, row, found.ownerId);
    return row;
  });
  // Sending a proposal moves a case still being modelled to "proposed"; won and lost stay.
  if (found.stage === "draft" || found.stage === "modelled")
    touch(caseId, found.updatedAt, { stage: "proposed" });
  recordAudit({
    actor: caller,
    action: "proposal.freeze",
    targetType: "proposal",
    targetId: proposal.id,
    detail: `${found.name} v${proposal.version}`,
  });
  return proposal;
}

export type ProposalSummary = {
  id: number;
  caseId: number;
  version: number;
  engineVersion: string;
  createdAt: string;
  createdById: number;
  createdByName: string;
  currency: string;
  capex: string;
  npv: string;
  paybackYears: number | null;
  stage: QuoteStage;
  changes: string[];
};

/** The case's proposals, oldest first, each with what changed since the version before. */
export function listProposals(caller: SessionUser, caseId: number): ProposalSummary[] {
  return listProposalsOf(getCaseOrThrow(caller, caseId));
}

/** listProposals for a case the caller has already been checked against (a getCaseOrThrow row). */
export function listProposalsOf(found: CaseRow): ProposalSummary[] {
  const caseId = found.id;
  const rows = db
    .select({ ...getTableColumns(proposals), createdByName: users.name, stage: quotes.stage })
    .from(proposals)
    .innerJoin(users, eq(users.id, proposals.createdById))
    .innerJoin(quotes, eq(quotes.proposalId, proposals.id))
    .where(eq(proposals.caseId, caseId))
    .orderBy(asc(proposals.version))
    .all();
  return rows.map((row, i) => ({
    id: row.id,
    caseId: row.caseId,
    version: row.version,
    engineVersion: row.engineVersion,
    createdAt: row.createdAt,
    createdById: row.createdById,
    createdByName: row.createdByName,
    currency: row.result.currency,
    capex: row.result.totals.capex,
    npv: row.result.scenarios.physics.npv,
    paybackYears: row.result.scenarios.physics.paybackYears,
    stage: row.stage,
    changes: proposalChanges(i === 0 ? null : rows[i - 1], row, i === 0 ? 0 : rows[i - 1].version),
  }));
}

/** Proposals with the names of their case, account and site; the caller adds the scope. */
export function proposalWithCaseQuery() {
  return db
    .select({
      ...getTableColumns(proposals),
      caseName: cases.name,
      accountId: cases.accountId,
      accountName: accounts.name,
      siteId: cases.siteId,
      siteName: sites.name,
    })
    .from(proposals)
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(accounts, eq(accounts.id, cases.accountId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .$dynamic();
}

export function getProposalOrThrow(caller: SessionUser, id: number) {
  const row = proposalWithCaseQuery()
    .where(and(eq(proposals.id, id), scoped(caller)))
    .get();
  if (!row) throw new NotFoundError("No such proposal");
  return row;
}
