import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditLog, axes, machines } from "@/db/schema";
import { createAxis, listAxes } from "@/db/queries/axes";
import {
  duplicateMachine,
  listMachineAxes,
  MACHINE_AXES_PAGE_SIZE,
} from "@/db/queries/machine-series";
import { createMachine, listMachines } from "@/db/queries/machines";
import { createSite, listSites, listSitesPage } from "@/db/queries/sites";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import {
  axisInputSchema,
  duplicateMachineSchema,
  machineAxisListSchema,
  siteInputSchema,
  siteListSchema,
} from "@/lib/validations/installed-base";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const axisValues = (machineId: number, label: string, quantity = 1) =>
  axisInputSchema.parse({
    machineId,
    label,
    quantity,
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

const machineValues = (name: string) => ({
  name,
  line: "Line 9",
  downtimeHours: 3,
  throughputGainPct: 1.5,
  marginPerOutputHour: "12.50",
});

describe("the site's machine table counts each machine's own axes", () => {
  it("gives axis rows and axes with quantity per machine, not one for every machine", () => {
    const site = listSites(engineer())[0];
    const machine = createMachine(engineer(), site.id, machineValues("Counted press"));
    createAxis(engineer(), axisValues(machine.id, "Counted axis A", 3));
    createAxis(engineer(), axisValues(machine.id, "Counted axis B", 2));
    const rows = listMachines(engineer(), site.id);
    const counted = rows.find((m) => m.id === machine.id)!;
    expect(counted).toMatchObject({ axisRows: 2, axisUnits: 5 });
    // Every machine agrees with the axes list filtered to it (the seed gives several per machine).
    for (const m of rows) {
      const list = listAxes(engineer(), site.id, { machineId: m.id });
      expect(m.axisRows).toBe(list.total);
    }
    expect(rows.some((m) => m.axisRows > 1)).toBe(true);
  });
});

describe("duplicating a machine of a series", () => {
  function source() {
    const site = listSites(engineer())[0];
    const machine = createMachine(engineer(), site.id, machineValues(`Series ${Date.now()}`));
    const a = createAxis(engineer(), { ...axisValues(machine.id, "Feed", 2), assetTag: "AT-1" });
    db.update(axes)
      .set({
        motion: { kind: "indexing" } as never,
        event: { scrapCost: "12" } as never,
        pullOutCurve: [{ rpm: 100, torqueNm: 1 }],
      })
      .where(eq(axes.id, a.id))
      .run();
    createAxis(engineer(), axisValues(machine.id, "Lift"));
    return { site, machine };
  }

  it("names the field when the new name is missing, and refuses a name the site has", () => {
    const parsed = duplicateMachineSchema.safeParse({ name: "  " });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0]).toMatchObject({
      path: ["name"],
      message: "Enter the new machine's name",
    });
    const { site, machine } = source();
    const before = db.select().from(machines).where(eq(machines.siteId, site.id)).all().length;
    const axesBefore = db.select().from(axes).where(eq(axes.siteId, site.id)).all().length;
    expect(() => duplicateMachine(engineer(), machine.id, machine.name.toUpperCase())).toThrow(
      new ConflictError(`This site already has a machine named "${machine.name.toUpperCase()}"`),
    );
    expect(db.select().from(machines).where(eq(machines.siteId, site.id)).all()).toHaveLength(
      before,
    );
    expect(db.select().from(axes).where(eq(axes.siteId, site.id)).all()).toHaveLength(axesBefore);
  });

  it("is not found in another engineer's account and refused to a reviewer", () => {
    const { machine } = source();
    expect(() => duplicateMachine(engineer2(), machine.id, "Copy")).toThrow(NotFoundError);
    expect(() => duplicateMachine(reviewer(), machine.id, "Copy")).toThrow(ForbiddenError);
  });

  it("copies the machine and every column of its axes but the asset tags, and audits it", () => {
    const { machine } = source();
    const copy = duplicateMachine(manager(), machine.id, `${machine.name} copy`);
    expect(copy).toMatchObject({ ...machineValues(`${machine.name} copy`), axisRows: 2 });
    const strip = ({
      id: _i,
      machineId: _m,
      createdAt: _c,
      assetTag: _t,
      ...rest
    }: typeof axes.$inferSelect) => rest;
    const original = db
      .select()
      .from(axes)
      .where(eq(axes.machineId, machine.id))
      .orderBy(axes.id)
      .all();
    const copied = db.select().from(axes).where(eq(axes.machineId, copy.id)).orderBy(axes.id).all();
    expect(copied.map(strip)).toEqual(original.map(strip));
    expect(original[0].assetTag).toBe("AT-1");
    expect(copied.map((a) => a.assetTag)).toEqual([null, null]);
    expect(copied[0].motion).toEqual({ kind: "indexing" });
    const audit = db
      .select()
      .from(auditLog)
      .where(eq(auditLog.action, "machine.duplicate"))
      .all()
      .at(-1)!;
    expect(audit.actorEmail).toBe("manager@example.com");
    expect(audit.detail).toBe(
      `"${machine.name} copy" copied from "${machine.name}" on site "${listSites(manager()).find((s) => s.id === machine.siteId)!.name}" with 2 axis rows`,
    );
  });
});

describe("paged lists of the installed base", () => {
  it("pages, sorts and filters a machine's axes in SQL", () => {
    const site = listSites(engineer())[0];
    const machine = createMachine(engineer(), site.id, machineValues("Long machine"));
    for (let i = 1; i <= MACHINE_AXES_PAGE_SIZE + 2; i++)
      createAxis(engineer(), axisValues(machine.id, `Axis ${String(i).padStart(2, "0")}`));
    const first = listMachineAxes(engineer(), machine.id, machineAxisListSchema.parse({}));
    expect(first).toMatchObject({ total: MACHINE_AXES_PAGE_SIZE + 2, page: 1, pageCount: 2 });
    expect(first.rows[0].label).toBe("Axis 01");
    const second = listMachineAxes(
      engineer(),
      machine.id,
      machineAxisListSchema.parse({ page: "9", dir: "desc" }),
    );
    expect(second.page).toBe(2);
    expect(second.rows.map((r) => r.label)).toEqual(["Axis 02", "Axis 01"]);
    const filtered = listMachineAxes(
      engineer(),
      machine.id,
      machineAxisListSchema.parse({ q: "1_" }),
    );
    expect(filtered.total).toBe(0);
    expect(listMachineAxes(engineer(), machine.id, { q: "Axis 1" }).total).toBe(10);
    expect(() => listMachineAxes(engineer2(), machine.id)).toThrow(NotFoundError);
  });

  it("pages, sorts and filters an account's sites, in the caller's scope", () => {
    const accountId = listSites(engineer())[0].accountId;
    for (const n of ["Zeta works", "Alpha works", "Mid_works"])
      createSite(
        engineer(),
        accountId,
        siteInputSchema.parse({
          name: n,
          currency: "EUR",
          tariffPerKWh: "0.2",
          ambientC: 25,
          hoursPerYear: 4000,
        }),
      );
    const works = listSitesPage(engineer(), accountId, siteListSchema.parse({ q: "works" }));
    expect(works.rows.map((s) => s.name)).toEqual(["Alpha works", "Mid_works", "Zeta works"]);
    const underscore = listSitesPage(engineer(), accountId, siteListSchema.parse({ q: "_" }));
    expect(underscore.rows.map((s) => s.name)).toEqual(["Mid_works"]);
    const byMachines = listSitesPage(
      engineer(),
      accountId,
      siteListSchema.parse({ sort: "machines", dir: "desc" }),
    );
    const counts = byMachines.rows.map((s) => s.machineCount);
    expect(counts).toEqual([...counts].sort((a, b) => b - a));
    expect(counts[0]).toBeGreaterThan(0);
    const other = listSites(engineer2()).find(
      (s) => !listSites(engineer()).some((m) => m.accountId === s.accountId),
    )!;
    expect(() => listSitesPage(engineer(), other.accountId)).toThrow(NotFoundError);
  });
});
