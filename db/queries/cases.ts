import { and, asc, desc, eq, getTableColumns, inArray, sql } from "drizzle-orm";
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
  sites,
  users,
} from "@/db/schema";
import type { CaseInput } from "@/lib/engine";
import { assertRole, type SessionUser } from "@/lib/auth/session-user";
import { NotFoundError } from "@/lib/errors";
import type { CaseAssumptions, CreateCaseInput } from "@/lib/validations/case";
import { accountScope, assertAccountOpen, INSTALLED_BASE_ROLES } from "./accounts";
import { recordAudit } from "./audit";
import { assembleCaseInput, defaultAssumptions, kitInputOf, type CaseAxisRow } from "./case-input";
import { getSiteOrThrow } from "./sites";

// Cases are reached through their account, like sites: the caller's account scope is in every
// WHERE. Reviewers see frozen proposals through their own portal, never the working cases.
export function caseScope(caller: SessionUser) {
  assertRole(caller, ...INSTALLED_BASE_ROLES);
  return accountScope(caller);
}

export const caseColumns = {
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

export function caseQuery() {
  return db
    .select(caseColumns)
    .from(cases)
    .innerJoin(accounts, eq(cases.accountId, accounts.id))
    .innerJoin(sites, eq(cases.siteId, sites.id))
    .innerJoin(users, eq(cases.ownerId, users.id));
}

export type CaseRow = ReturnType<typeof getCaseOrThrow>;

export function listCases(caller: SessionUser) {
  return caseQuery().where(caseScope(caller)).orderBy(desc(cases.updatedAt), desc(cases.id)).all();
}

export function getCaseOrThrow(caller: SessionUser, id: number) {
  const row = caseQuery()
    .where(and(eq(cases.id, id), caseScope(caller)))
    .get();
  if (!row) throw new NotFoundError("No such case");
  return row;
}

// Strictly later than the previous stamp, so two edits within one millisecond still order.
export function touchCase(
  caseId: number,
  previous: string,
  extra: Partial<typeof cases.$inferInsert> = {},
) {
  const stamp = new Date(Math.max(Date.now(), Date.parse(previous) + 1)).toISOString();
  db.update(cases)
    .set({ ...extra, updatedAt: stamp })
    .where(eq(cases.id, caseId))
    .run();
}

export function createCase(caller: SessionUser, input: CreateCaseInput) {
  const site = getSiteOrThrow(caller, input.siteId);
  assertAccountOpen(site.accountId);
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
  touchCase(caseId, found.updatedAt, { assumptions: values });
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
  return assembleCaseInput(found.siteCurrency, found.assumptions, machineRows, axisRows);
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
