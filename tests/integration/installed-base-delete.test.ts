import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import {
  auditLog,
  axes,
  caseAxes,
  caseRemovedAxes,
  cases,
  deletionUndo,
  machines,
  proposals,
  sites,
} from "@/db/schema";
import { listRemovedAxes } from "@/db/queries/case-removed-axes";
import { listCaseAxes, setCaseAxes } from "@/db/queries/case-axes";
import { createCase, listCases } from "@/db/queries/cases";
import {
  deleteAxis,
  deleteMachine,
  deleteSite,
  getPendingUndo,
  undoDeletion,
} from "@/db/queries/installed-base-delete";
import {
  axisDeletionImpact,
  describeImpact,
  machineDeletionImpact,
  siteDeletionImpact,
} from "@/db/queries/installed-base-impact";
import { createAxis, listAxes } from "@/db/queries/axes";
import { createMachine, listMachines } from "@/db/queries/machines";
import { getProposalSnapshotOrThrow, listProposalsFor } from "@/db/queries/proposals";
import { getDossierAccess, getDossierSettings } from "@/db/queries/dossiers";
import { pipeline } from "@/db/queries/pipeline";
import { buildDossier } from "@/lib/dossier";
import { createSite, listSites } from "@/db/queries/sites";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { parseFrozenInput } from "@/lib/results/stored-input-problems";
import { axisInputSchema, siteInputSchema } from "@/lib/validations/installed-base";
import { buildProposalWorkbook } from "@/lib/workbook";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const rawProposal = (id: number) =>
  db.get<{ input: string; result: string }>(
    sql`select input, result from proposals where id = ${id}`,
  );

const lastAudit = (action: string) =>
  db.select().from(auditLog).where(eq(auditLog.action, action)).all().at(-1);

const axisValues = (machineId: number, label: string) =>
  axisInputSchema.parse({
    machineId,
    label,
    holdingTorqueNm: 1.2,
    ratedCurrentA: 2.8,
    phaseResistanceOhm: 0.9,
    phaseInductanceMh: 3.2,
    busVoltageV: 48,
    currentSettingA: 2.8,
    hoursPerYear: 4000,
    movePct: 40,
    holdPct: 40,
    speedRpm: 300,
    loadTorqueNm: 0.25,
    peakTorqueNm: 0.45,
  });

// An open case of the engineer that holds an issued proposal, with one of its axes.
function openCaseWithProposal() {
  const found = listCases(engineer()).find(
    (c) => c.stage === "proposed" && c.latestVersion !== null,
  )!;
  const proposal = db.select().from(proposals).where(eq(proposals.caseId, found.id)).get()!;
  return { found, proposal, axes: listCaseAxes(engineer(), found.id) };
}

// A fresh site of the engineer's first account with one machine of `n` axes, and a draft case
// using all of them.
function freshSite(name: string, n = 3) {
  const account = listSites(engineer())[0].accountId;
  const site = createSite(
    engineer(),
    account,
    siteInputSchema.parse({
      name,
      currency: "EUR",
      tariffPerKWh: "0.2",
      ambientC: 25,
      hoursPerYear: 4000,
    }),
  );
  const machine = createMachine(engineer(), site.id, {
    name: `${name} press`,
    line: null,
    downtimeHours: 1,
    throughputGainPct: 0,
    marginPerOutputHour: "0",
  });
  const axisIds = Array.from(
    { length: n },
    (_, i) => createAxis(engineer(), axisValues(machine.id, `${name} axis ${i + 1}`)).id,
  );
  const draft = createCase(engineer(), { siteId: site.id, name: `${name} case` });
  setCaseAxes(engineer(), draft.id, axisIds);
  return { site, machine, axisIds, draft };
}

describe("deleting an axis", () => {
  it("is refused to a reviewer and not found in another engineer's account", () => {
    const theirs = listSites(engineer2()).find(
      (s) => !listSites(engineer()).some((m) => m.id === s.id),
    )!;
    const axis = listAxes(engineer2(), theirs.id).rows[0];
    expect(() => deleteAxis(engineer(), axis.id)).toThrow(NotFoundError);
    expect(() => axisDeletionImpact(engineer(), axis.id)).toThrow(NotFoundError);
    expect(() => deleteAxis(reviewer(), axis.id)).toThrow(ForbiddenError);
    expect(db.select().from(axes).where(eq(axes.id, axis.id)).get()).toBeDefined();
  });

  it("leaves an issued proposal byte for byte, its views complete, and tells the open case", async () => {
    const { found, proposal, axes: used } = openCaseWithProposal();
    const before = rawProposal(proposal.id);
    const target = used[0];
    const impact = axisDeletionImpact(engineer(), target.axisId);
    expect(impact.openCaseCount).toBeGreaterThanOrEqual(1);
    expect(describeImpact(impact)).toContain(
      `Deleting axis ${target.label} on machine ${target.machineName}`,
    );
    expect(describeImpact(impact)).toContain("Issued proposals keep their frozen figures.");

    const done = deleteAxis(engineer(), target.axisId);
    expect(done.label).toBe(`axis ${target.label} on ${target.machineName}`);

    expect(rawProposal(proposal.id)).toEqual(before);
    const snapshot = getProposalSnapshotOrThrow(engineer(), proposal.id);
    expect(
      snapshot.input.axes.some((a) => a.id === String(target.axisId) || a.label === target.label),
    ).toBe(true);
    const workbook = await buildProposalWorkbook(
      parseFrozenInput({ ...snapshot.quote, input: snapshot.input }),
      snapshot.result,
      {
        title: "t",
        accountName: snapshot.quote.accountName,
        siteName: snapshot.quote.siteName,
        caseName: snapshot.quote.caseName,
        version: snapshot.quote.version,
        engineVersion: snapshot.quote.engineVersion,
        generatedAt: new Date().toISOString(),
      },
    );
    expect(workbook.byteLength).toBeGreaterThan(1000);
    expect(listProposalsFor(engineer()).some((p) => p.id === proposal.id)).toBe(true);
    expect(pipeline(manager()).quotes.some((q) => q.id === proposal.id)).toBe(true);
    // The dossier is built from the frozen input too, every axis of it still there.
    const access = getDossierAccess(engineer(), proposal.id);
    const frozen = parseFrozenInput(access.proposal);
    const dossier = buildDossier(frozen, getDossierSettings(engineer(), proposal.id));
    expect(dossier.result).toEqual(snapshot.result);

    const removed = listRemovedAxes(engineer(), found.id);
    expect(removed).toEqual([
      expect.objectContaining({
        axisLabel: target.label,
        machineName: target.machineName,
        removedWith: "axis",
        removedByName: engineer().name,
      }),
    ]);
    const audit = lastAudit("axis.delete")!;
    expect(audit.actorEmail).toBe("engineer@example.com");
    expect(audit.detail).toContain(`"${target.label}"`);
    expect(audit.detail).toContain(`machine "${target.machineName}"`);

    // Undo: the same id back, the case's row back with its terms, the notice gone.
    const caseRowsBefore = db
      .select()
      .from(caseAxes)
      .where(eq(caseAxes.axisId, target.axisId))
      .all();
    expect(caseRowsBefore).toEqual([]);
    undoDeletion(engineer(), done.undoId);
    expect(db.select().from(axes).where(eq(axes.id, target.axisId)).get()?.label).toBe(
      target.label,
    );
    const back = listCaseAxes(engineer(), found.id).find((a) => a.axisId === target.axisId)!;
    expect(back).toEqual(target);
    expect(listRemovedAxes(engineer(), found.id)).toEqual([]);
    expect(lastAudit("axis.undo-delete")?.detail).toBe(`restored ${done.label}`);
    expect(() => undoDeletion(engineer(), done.undoId)).toThrow(NotFoundError);
  });

  it("lets a manager delete, refuses the undo to anyone else and after it expires", () => {
    const { axisIds, draft } = freshSite("Undo rules");
    const done = deleteAxis(manager(), axisIds[0]);
    expect(getPendingUndo(manager(), done.undoId)?.label).toBe(done.label);
    expect(getPendingUndo(engineer(), done.undoId)).toBeNull();
    // Someone else's undo does not exist for them: the deleted item's name is not told.
    expect(() => undoDeletion(engineer(), done.undoId)).toThrow(
      new NotFoundError("Nothing to undo: the deletion has expired or was undone"),
    );
    expect(listRemovedAxes(engineer(), draft.id)).toHaveLength(1);
    db.update(deletionUndo)
      .set({ expiresAt: new Date(Date.now() - 1000).toISOString() })
      .where(eq(deletionUndo.id, done.undoId))
      .run();
    expect(() => undoDeletion(manager(), done.undoId)).toThrow(ConflictError);
    expect(() => undoDeletion(manager(), done.undoId)).toThrow(/Too late to undo/);
    expect(db.select().from(axes).where(eq(axes.id, axisIds[0])).get()).toBeUndefined();
    // The next delete purges the expired entry.
    deleteAxis(manager(), axisIds[1]);
    expect(
      db.select().from(deletionUndo).where(eq(deletionUndo.id, done.undoId)).get(),
    ).toBeUndefined();
  });
});

describe("deleting a machine", () => {
  it("states its axes and the open cases that use them, then writes a notice per case and axis", () => {
    const { machine, axisIds, draft } = freshSite("Machine delete", 4);
    const impact = machineDeletionImpact(engineer(), machine.id);
    expect(impact).toMatchObject({ axisRows: 4, openCaseCount: 1, openCaseAxisRows: 4 });
    expect(describeImpact(impact)).toBe(
      `Deleting machine ${machine.name} removes its 4 axes. 1 open case uses 4 of them and will list them as removed. Issued proposals keep their frozen figures.`,
    );
    expect(() => deleteMachine(reviewer(), machine.id)).toThrow(ForbiddenError);
    expect(() => deleteMachine(engineer2(), machine.id)).toThrow(NotFoundError);

    const done = deleteMachine(engineer(), machine.id);
    expect(db.select().from(axes).where(eq(axes.machineId, machine.id)).all()).toEqual([]);
    const removed = listRemovedAxes(engineer(), draft.id);
    expect(removed.map((r) => r.removedWith)).toEqual(["machine", "machine", "machine", "machine"]);
    expect(removed.map((r) => r.machineName)).toEqual(Array(4).fill(machine.name));
    expect(lastAudit("machine.delete")?.detail).toContain(`machine "${machine.name}"`);

    undoDeletion(engineer(), done.undoId);
    expect(listMachines(engineer(), machine.siteId).map((m) => m.id)).toEqual([machine.id]);
    expect(
      listCaseAxes(engineer(), draft.id)
        .map((a) => a.axisId)
        .sort((a, b) => a - b),
    ).toEqual(axisIds);
    expect(listRemovedAxes(engineer(), draft.id)).toEqual([]);
  });

  it("writes nothing when the undo fails half-way (a machine of the same name was added since)", () => {
    const { site, machine, draft } = freshSite("Half way", 2);
    const done = deleteMachine(engineer(), machine.id);
    createMachine(engineer(), site.id, {
      name: machine.name,
      line: null,
      downtimeHours: 0,
      throughputGainPct: 0,
      marginPerOutputHour: "0",
    });
    expect(() => undoDeletion(engineer(), done.undoId)).toThrow(ConflictError);
    // The notices were deleted first inside the transaction: the rollback kept them.
    expect(listRemovedAxes(engineer(), draft.id)).toHaveLength(2);
    expect(db.select().from(machines).where(eq(machines.id, machine.id)).get()).toBeUndefined();
    expect(db.select().from(caseAxes).where(eq(caseAxes.caseId, draft.id)).all()).toEqual([]);
    expect(
      db.select().from(deletionUndo).where(eq(deletionUndo.id, done.undoId)).get(),
    ).toBeDefined();
  });
});

describe("deleting a site", () => {
  it("is refused, naming the cases, while its cases hold issued proposals", () => {
    const { found } = openCaseWithProposal();
    const impact = siteDeletionImpact(engineer(), found.siteId);
    expect(impact.blockingCaseNames).toContain(found.name);
    const axisCount = db.select().from(axes).where(eq(axes.siteId, found.siteId)).all().length;
    expect(() => deleteSite(engineer(), found.siteId)).toThrow(ConflictError);
    expect(() => deleteSite(engineer(), found.siteId)).toThrow(
      new RegExp(`cannot be deleted: .*${found.name}.*Archive the account instead`),
    );
    expect(db.select().from(sites).where(eq(sites.id, found.siteId)).get()).toBeDefined();
    expect(db.select().from(axes).where(eq(axes.siteId, found.siteId)).all()).toHaveLength(
      axisCount,
    );
  });

  it("takes its cases without proposals along, and undo puts everything back with the same ids", () => {
    const { site, machine, axisIds, draft } = freshSite("Whole site", 2);
    const impact = siteDeletionImpact(engineer(), site.id);
    expect(impact).toMatchObject({
      machineCount: 1,
      axisRows: 2,
      caseNames: [draft.name],
      blockingCaseNames: [],
    });
    expect(describeImpact(impact)).toContain(
      `Its 1 case without proposals goes with it: ${draft.name}.`,
    );
    expect(() => deleteSite(reviewer(), site.id)).toThrow(ForbiddenError);
    expect(() => deleteSite(engineer2(), site.id)).toThrow(NotFoundError);

    const done = deleteSite(engineer(), site.id);
    expect(db.select().from(cases).where(eq(cases.id, draft.id)).get()).toBeUndefined();
    expect(lastAudit("site.delete")?.detail).toContain(`site "${site.name}"`);

    undoDeletion(engineer(), done.undoId);
    expect(db.select().from(sites).where(eq(sites.id, site.id)).get()?.name).toBe(site.name);
    expect(db.select().from(machines).where(eq(machines.id, machine.id)).get()?.name).toBe(
      machine.name,
    );
    expect(
      db
        .select()
        .from(caseAxes)
        .where(and(eq(caseAxes.caseId, draft.id)))
        .all()
        .map((r) => r.axisId)
        .sort((a, b) => a - b),
    ).toEqual(axisIds);
    expect(
      db.select().from(caseRemovedAxes).where(eq(caseRemovedAxes.caseId, draft.id)).all(),
    ).toEqual([]);
  });
});
