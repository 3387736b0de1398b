import { and, asc, eq, inArray } from "drizzle-orm";
import { ZodError } from "zod";
import { db } from "@/db";
import { axes, caseAxes, kits, machines, motors, type Axis } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { ConflictError, NotFoundError, StoredInputError } from "@/lib/errors";
import { storedInputMessage, storedInputProblems } from "@/lib/results/stored-input-problems";
import {
  RETROFIT_LABELS,
  type AxisRetrofitInput,
  type BulkRetrofitInput,
  type CaseAssumptions,
} from "@/lib/validations/case";
import { recordAudit } from "./audit";
import {
  axisInputOf,
  DEFAULT_RETROFIT_TERMS,
  kitOptions,
  machineInputOf,
  suggestKitFor,
  type KitOption,
  type RetrofitTerms,
} from "./case-input";
import { getCaseOrThrow, touchCase, type CaseRow } from "./cases";

// A case's axes and their retrofit (kit, discount, install hours): picking them from the site,
// the kit suggestion, one axis's terms, and the rows the case page lists.

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
    options = loadKitOptions(found.siteCurrency);
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
  touchCase(
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
  const currency = found.siteCurrency;
  if (kit.currency !== currency)
    throw new ConflictError(
      `Kit ${kit.code} is priced in ${kit.currency}, this case in ${currency}`,
    );
  db.update(caseAxes)
    .set(values)
    .where(and(eq(caseAxes.caseId, caseId), eq(caseAxes.axisId, axisId)))
    .run();
  touchCase(caseId, found.updatedAt);
}

/**
 * Sets the given terms (kit, discount, install hours, commissioning cost) on many axes of the case
 * in one step; blank terms stay as they are on each axis. Everything is checked before anything is
 * written, and the rows, the case's stamp and the one audit row go in one transaction.
 */
export function setCaseAxesRetrofit(caller: SessionUser, caseId: number, input: BulkRetrofitInput) {
  const found = getCaseOrThrow(caller, caseId);
  const wanted = [...new Set(input.axisIds)];
  let inCase = 0;
  for (let i = 0; i < wanted.length; i += 500) {
    inCase += db
      .select({ axisId: caseAxes.axisId })
      .from(caseAxes)
      .where(and(eq(caseAxes.caseId, caseId), inArray(caseAxes.axisId, wanted.slice(i, i + 500))))
      .all().length;
  }
  if (inCase !== wanted.length) throw new NotFoundError("No such axis in this case");

  const changes: Partial<AxisRetrofitInput> = {};
  const said: string[] = [];
  if (input.kitId !== undefined) {
    const kit = db.select().from(kits).where(eq(kits.id, input.kitId)).get();
    if (!kit) throw new NotFoundError(`${RETROFIT_LABELS.kitId}: no such kit in the catalogue`);
    // Unlike one axis's edit, a bulk step never spreads a retired kit to more axes.
    if (!kit.active)
      throw new ConflictError(
        `${RETROFIT_LABELS.kitId} ${kit.code} is retired: choose an active kit of the catalogue`,
      );
    if (kit.currency !== found.siteCurrency)
      throw new ConflictError(
        `${RETROFIT_LABELS.kitId} ${kit.code} is priced in ${kit.currency}, this case in ${found.siteCurrency}`,
      );
    changes.kitId = kit.id;
    said.push(`kit ${kit.code}`);
  }
  if (input.discountPct !== undefined) {
    changes.discountPct = input.discountPct;
    said.push(`discount ${input.discountPct} %`);
  }
  if (input.installHours !== undefined) {
    changes.installHours = input.installHours;
    said.push(`install hours ${input.installHours}`);
  }
  if (input.commissioningCost !== undefined) {
    changes.commissioningCost = input.commissioningCost;
    said.push(`commissioning cost ${input.commissioningCost} ${found.siteCurrency}`);
  }
  if (said.length === 0)
    throw new ConflictError(
      "Fill in at least one of kit, discount %, install hours or commissioning cost to set",
    );

  db.transaction((tx) => {
    for (let i = 0; i < wanted.length; i += 500) {
      tx.update(caseAxes)
        .set(changes)
        .where(and(eq(caseAxes.caseId, caseId), inArray(caseAxes.axisId, wanted.slice(i, i + 500))))
        .run();
    }
    // Same connection, so inside the transaction: a failure here leaves no row changed.
    touchCase(caseId, found.updatedAt);
    recordAudit({
      actor: caller,
      action: "case.bulk-retrofit",
      targetType: "case",
      targetId: caseId,
      detail: `${found.name}: ${wanted.length} ${wanted.length === 1 ? "axis" : "axes"}; ${said.join(", ")}`,
    });
  });
  return { changed: wanted.length, fields: said };
}

export type KitSuggestionRow = { axisId: number; kitId: number | null; reason: string };

/**
 * Runs the engine's suggestKit on every axis of the case with the active kits of its currency
 * and applies each suggestion; an axis for which no kit keeps the margin keeps its kit, and
 * the reason says why none fits.
 */
export function suggestKitsForCase(caller: SessionUser, caseId: number): KitSuggestionRow[] {
  const found = getCaseOrThrow(caller, caseId);
  const options = loadKitOptions(found.siteCurrency);
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
    touchCase(caseId, found.updatedAt);
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
