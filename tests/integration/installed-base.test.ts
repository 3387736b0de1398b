import { describe, expect, it } from "vitest";
import { createAxis, getAxisOrThrow, listAxes, AXES_PAGE_SIZE } from "@/db/queries/axes";
import { commitImport, listImports, machinesToCreate } from "@/db/queries/imports";
import { createMachine, getMachineOrThrow, listMachines } from "@/db/queries/machines";
import { createSite, getSiteOrThrow, listSites } from "@/db/queries/sites";
import { listKits, listMotors, saveKit, setCatalogueActive } from "@/db/queries/catalogue";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { axisInputSchema, siteInputSchema } from "@/lib/validations/installed-base";
import { kitInputSchema } from "@/lib/validations/catalogue";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");

function siteOf(accountName: string) {
  return listSites(manager()).find((s) => s.accountName === accountName)!;
}

const axisValues = (machineId: number) =>
  axisInputSchema.parse({
    machineId,
    label: "Invented test axis",
    holdingTorqueNm: { value: 180, unit: "oz·in" },
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

describe("the seeded installed base (docs/product.md, Demo scenario)", () => {
  it("holds a few hundred axes on three invented accounts, and a catalogue of kits and motors", () => {
    const sites = listSites(manager());
    expect(new Set(sites.map((s) => s.accountName)).size).toBe(3);
    const axes = sites.reduce((n, s) => n + s.axisCount, 0);
    expect(axes).toBeGreaterThanOrEqual(200);
    expect(axes).toBeLessThan(1000);
    expect(listKits(manager()).length).toBeGreaterThanOrEqual(10);
    expect(
      listMotors(manager())
        .map((m) => m.frameSize)
        .sort(),
    ).toEqual(expect.arrayContaining([17, 23, 34]));
  });
});

describe("who reaches which site, machine and axis (cross-account)", () => {
  it("an engineer lists only the sites of accounts they own or are shared on", () => {
    expect(new Set(listSites(engineer()).map((s) => s.accountName))).toEqual(
      new Set(["Cartonia Packaging Plant", "Webline Print Finishing"]),
    );
  });

  it("another engineer's site, machine and axis are not found, exactly like missing ids", () => {
    const lab = siteOf("Pipetteworks Lab Automation");
    expect(() => getSiteOrThrow(engineer(), lab.id)).toThrow(NotFoundError);
    expect(() => listSites(engineer(), lab.accountId)).toThrow(NotFoundError);
    const machine = listMachines(engineer2(), lab.id)[0];
    expect(() => getMachineOrThrow(engineer(), machine.id)).toThrow(NotFoundError);
    const axis = listAxes(engineer2(), lab.id).rows[0];
    expect(() => getAxisOrThrow(engineer(), axis.id)).toThrow(NotFoundError);
    expect(() => getAxisOrThrow(engineer(), 99_999_999)).toThrow(NotFoundError);
    expect(() => createAxis(engineer(), axisValues(machine.id))).toThrow(NotFoundError);
    expect(() =>
      createMachine(engineer(), lab.id, {
        name: "Sneaky",
        line: null,
        downtimeHours: 0,
        throughputGainPct: 0,
        marginPerOutputHour: "0",
      }),
    ).toThrow(NotFoundError);
  });

  it("a reviewer reaches none of the installed base", () => {
    const reviewer = caller("reviewer@example.com");
    expect(() => listSites(reviewer)).toThrow(ForbiddenError);
    expect(() => getSiteOrThrow(reviewer, siteOf("Cartonia Packaging Plant").id)).toThrow(
      ForbiddenError,
    );
    expect(() => listKits(reviewer)).toThrow(ForbiddenError);
  });
});

describe("the axes table pages, sorts and filters on the server", () => {
  it("gives 50 rows a page with the total, sorted and filtered", () => {
    const north = listSites(manager()).find((s) => s.name === "North hall")!;
    const first = listAxes(engineer(), north.id, { page: 1 });
    expect(first.rows).toHaveLength(AXES_PAGE_SIZE);
    expect(first.total).toBe(north.axisCount);
    const last = listAxes(engineer(), north.id, { page: first.pageCount });
    expect(last.rows.length).toBe(first.total - (first.pageCount - 1) * AXES_PAGE_SIZE);
    const bySpeed = listAxes(engineer(), north.id, { sort: "speedRpm", dir: "desc" }).rows.map(
      (r) => r.speedRpm,
    );
    expect(bySpeed).toEqual([...bySpeed].sort((a, b) => b - a));
    const feeds = listAxes(engineer(), north.id, { q: "carton feed" });
    expect(feeds.total).toBeGreaterThan(0);
    expect(feeds.rows.every((r) => r.label === "Carton feed")).toBe(true);
  });
});

describe("editing the installed base", () => {
  it("stores a torque typed in ozf·in as N·m by the NIST SP 811 factor (7.061552E-03)", () => {
    const site = siteOf("Cartonia Packaging Plant");
    const machine = listMachines(engineer(), site.id)[0];
    const row = createAxis(engineer(), axisValues(machine.id));
    expect(row.holdingTorqueNm).toBeCloseTo(180 * 7.061552e-3, 12);
    expect(row.siteId).toBe(site.id);
  });

  it("keeps an axis's asset tag, a field added through the registry only, and drops an empty one", () => {
    const machine = listMachines(engineer(), siteOf("Cartonia Packaging Plant").id)[0];
    const typed = axisInputSchema.parse({ ...axisValues(machine.id), assetTag: " MX-0042 " });
    const tagged = createAxis(engineer(), typed);
    expect(getAxisOrThrow(engineer(), tagged.id).assetTag).toBe("MX-0042");
    const blank = axisInputSchema.parse({ ...axisValues(machine.id), assetTag: "" });
    expect(createAxis(engineer(), blank).assetTag).toBeNull();
    expect(
      axisInputSchema.safeParse({ ...axisValues(machine.id), assetTag: "T".repeat(41) }).success,
    ).toBe(false);
  });

  it("refuses a second site of the same name in one account", () => {
    const site = siteOf("Webline Print Finishing");
    const input = siteInputSchema.parse({
      name: site.name.toUpperCase(),
      currency: "eur",
      tariffPerKWh: "0.2",
      hoursPerYear: 5000,
    });
    expect(input.currency).toBe("EUR");
    expect(() => createSite(engineer(), site.accountId, input)).toThrow(ConflictError);
  });

  it("says what is wrong with an axis, field by field", () => {
    const result = axisInputSchema.safeParse({
      ...axisValues(1),
      movePct: 70,
      holdPct: 50,
      peakTorqueNm: 0.1,
    });
    expect(result.success).toBe(false);
    const messages = Object.fromEntries(
      result.error!.issues.map((i) => [i.path.join("."), i.message]),
    );
    expect(messages.holdPct).toBe("move % + hold % is 120; together they must be at most 100");
    expect(messages.peakTorqueNm).toBe("must be at least the load torque (0.25 N·m)");
  });
});

describe("committing an import", () => {
  it("creates the machines a file names and records the import", () => {
    const site = siteOf("Webline Print Finishing");
    const { machineId: _m, ...fields } = axisValues(1);
    expect(
      machinesToCreate(engineer(), site.id, [
        "Web press 01",
        "Brand-new folder",
        "brand-new FOLDER",
      ]),
    ).toEqual(["Brand-new folder"]);
    const before = listMachines(engineer(), site.id).length;
    const out = commitImport(
      engineer(),
      site.id,
      { fileName: "x.csv", sizeBytes: 10, rowsRead: 2, errorCount: 0 },
      [
        { ...fields, machineName: "Brand-new folder" },
        { ...fields, label: "Second", machineName: "Web press 01" },
      ],
    );
    expect(out).toMatchObject({ imported: 2, machinesCreated: 1 });
    expect(listMachines(engineer(), site.id)).toHaveLength(before + 1);
    expect(listImports(engineer(), site.id)[0]).toMatchObject({
      fileName: "x.csv",
      rowsImported: 2,
      userEmail: "engineer@example.com",
    });
  });

  it("is all-or-nothing: a row the database refuses leaves no machine and no axis behind", () => {
    const site = siteOf("Cartonia Packaging Plant");
    const { machineId: _m, ...fields } = axisValues(1);
    const machinesBefore = listMachines(engineer(), site.id).length;
    const axesBefore = listAxes(engineer(), site.id).total;
    const broken = {
      ...fields,
      machineName: "Another new machine",
      holdingTorqueNm: null as unknown as number,
    };
    expect(() =>
      commitImport(
        engineer(),
        site.id,
        { fileName: "bad.csv", sizeBytes: 10, rowsRead: 2, errorCount: 0 },
        [{ ...fields, machineName: "Another new machine" }, broken],
      ),
    ).toThrow();
    expect(listMachines(engineer(), site.id)).toHaveLength(machinesBefore);
    expect(listAxes(engineer(), site.id).total).toBe(axesBefore);
  });
});

describe("the catalogue", () => {
  it("only administrators change it; retired kits leave the default list", () => {
    const admin = caller("admin@example.com");
    const input = kitInputSchema.parse({
      code: "CL-TEST",
      name: "Invented test kit",
      price: "99.50",
      currency: "EUR",
    });
    expect(() => saveKit(engineer(), input)).toThrow(ForbiddenError);
    const kit = saveKit(admin, input);
    expect(() => saveKit(admin, input)).toThrow(ConflictError);
    setCatalogueActive(admin, "kit", kit.id, false);
    expect(listKits(engineer()).some((k) => k.id === kit.id)).toBe(false);
    expect(listKits(engineer(), { includeRetired: true }).some((k) => k.id === kit.id)).toBe(true);
  });
});
