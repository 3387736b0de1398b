import fs from "node:fs";
import Decimal from "decimal.js";
import path from "node:path";
import ExcelJS from "exceljs";
import { eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { createAxis, getAxisOrThrow, updateAxis } from "@/db/queries/axes";
import {
  buildCaseInput,
  createCase,
  getCaseOrThrow,
  listCases,
  updateAssumptions,
} from "@/db/queries/cases";
import { setCaseAxes } from "@/db/queries/case-axes";
import { freezeProposal } from "@/server/cases/freeze";
import { caseResult } from "@/server/cases/results";
import { commitImport } from "@/db/queries/imports";
import { listMachines } from "@/db/queries/machines";
import { getProposalSnapshotOrThrow, listProposalsFor } from "@/db/queries/proposals";
import { openQuoteFor } from "@/db/queries/quote-open";
import { listSites } from "@/db/queries/sites";
import { axes, cases, proposals } from "@/db/schema";
import { caseInputSchema, ENGINE_VERSION, evaluateCase } from "@/lib/engine";
import { caseAssumptionsSchema } from "@/lib/validations/case";
import { axisApiSchema, axisInputSchema as axisFormSchema } from "@/lib/validations/installed-base";
import { checkImportFile } from "@/lib/import/run-import";
import { templateCsv } from "@/lib/import/template";
import { buildProposalWorkbook } from "@/lib/workbook";
import { caseResultSchemaV1 } from "../support/case-result-schema";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const northHall = () => listSites(engineer()).find((s) => s.name === "North hall")!;

// An invented NEMA 23 axis on 48 V whose duty comes from a vertical screw (docs/model.md (Motion from the mechanism)), with
// its step-loss events costed from what one causes (docs/model.md (The business case)) and a mid-band dip (docs/model.md (Torque at speed)).
function screwAxisBody(machineId: number) {
  return {
    machineId,
    label: `Z lift ${Math.random().toString(36).slice(2, 8)}`,
    holdingTorqueNm: 1.26,
    ratedCurrentA: 2.8,
    phaseResistanceOhm: 0.9,
    phaseInductanceMh: 2.5,
    busVoltageV: 48,
    currentSettingA: 2.8,
    hoursPerYear: 6000,
    stepLossEventsPerYear: 4,
    motion: {
      mechanism: "screw",
      leadMm: 10,
      massKg: 6,
      inclineDeg: 90,
      frictionCoeff: 0.05,
      motorInertiaKgM2: { value: 480, unit: "g·cm²" },
      loadInertiaKgM2: 0.000012,
      stroke: 150,
      moveTimeS: 0.5,
      dwellTimeS: 1.5,
    },
    event: { downtimeMinutes: 20, scrapParts: 3, scrapCostPerPart: "4.80", restartLaborHours: 0.5 },
    resonance: { fromRpm: 400, toRpm: 700, deratePct: 30 },
  };
}

describe("an axis with motion, an event build-up and a resonance band (docs/contracts.md (Case input))", () => {
  it("is stored as the engine parsed it and comes back unchanged", () => {
    const machine = listMachines(engineer(), northHall().id)[0];
    const body = screwAxisBody(machine.id);
    const created = createAxis(engineer(), axisApiSchema.parse(body));
    const stored = getAxisOrThrow(engineer(), created.id);
    // NIST SP 811 (2008) App. B.9 via the SI prefixes: 1 g·cm² = 1 E−07 kg·m².
    expect(stored.motion?.motorInertiaKgM2).toBeCloseTo(480e-7, 15);
    expect(stored.motion).toMatchObject({ mechanism: "screw", leadMm: 10, stroke: 150 });
    expect(stored.event).toEqual({
      downtimeMinutes: 20,
      scrapParts: 3,
      scrapCostPerPart: "4.80",
      restartLaborHours: 0.5,
    });
    expect(stored.resonance).toEqual({ fromRpm: 400, toRpm: 700, deratePct: 30 });
    // The typed duty figures were left out: placeholders, and the cost per event stays "0".
    expect([stored.speedRpm, stored.loadTorqueNm, stored.costPerEvent]).toEqual([0, 0, "0"]);
  });

  it("the axis form saving other fields keeps the stored motion, event and resonance", () => {
    const machine = listMachines(engineer(), northHall().id)[0];
    const created = createAxis(engineer(), axisApiSchema.parse(screwAxisBody(machine.id)));
    const {
      id: _id,
      siteId: _s,
      createdAt: _c,
      motion,
      event,
      resonance,
      ...fields
    } = getAxisOrThrow(engineer(), created.id);
    const form = axisFormSchema.parse({
      ...Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== null)),
      label: `${fields.label} renamed`,
    });
    updateAxis(engineer(), created.id, form);
    const after = getAxisOrThrow(engineer(), created.id);
    expect(after.label).toBe(`${fields.label} renamed`);
    expect({ motion: after.motion, event: after.event, resonance: after.resonance }).toEqual({
      motion,
      event,
      resonance,
    });
    // The JSON API states the whole axis: an object left out is removed.
    const { event: _e, resonance: _r, ...withoutEvent } = screwAxisBody(machine.id);
    updateAxis(engineer(), created.id, axisApiSchema.parse(withoutEvent));
    expect(getAxisOrThrow(engineer(), created.id)).toMatchObject({ event: null, resonance: null });
  });

  it("goes into the case input as motion, event and resonance, without the typed duty or a cost per event, and evaluates with v2", () => {
    const site = northHall();
    const machine = listMachines(engineer(), site.id)[0];
    const screw = createAxis(engineer(), axisApiSchema.parse(screwAxisBody(machine.id)));
    const typed = db.select().from(axes).where(eq(axes.siteId, site.id)).limit(1).get()!;
    const created = createCase(engineer(), { name: "Motion round trip", siteId: site.id });
    setCaseAxes(engineer(), created.id, [typed.id, screw.id]);

    const input = buildCaseInput(engineer(), created.id);
    const screwInput = input.axes.find((a) => a.id === String(screw.id))!;
    expect(screwInput.duty).toEqual({
      hoursPerYear: 6000,
      ambientC: 40,
      motion: getAxisOrThrow(engineer(), screw.id).motion,
    });
    expect(screwInput.reliability).toEqual({
      stepLossEventsPerYear: 4,
      event: {
        downtimeMinutes: 20,
        scrapParts: 3,
        scrapCostPerPart: "4.80",
        restartLaborHours: 0.5,
      },
      avoidedPct: 90,
    });
    expect(screwInput.drive.resonance).toEqual({ fromRpm: 400, toRpm: 700, deratePct: 30 });
    const typedInput = input.axes.find((a) => a.id === String(typed.id))!;
    expect(typedInput.duty).toMatchObject({ speedRpm: typed.speedRpm, movePct: typed.movePct });
    expect(typedInput.duty).not.toHaveProperty("motion");
    expect(typedInput.reliability).toMatchObject({ costPerEvent: typed.costPerEvent });
    expect(typedInput.reliability).not.toHaveProperty("event");
    expect(caseInputSchema.safeParse(input).success).toBe(true);

    const result = caseResult(engineer(), created.id);
    expect(result.engineVersion).toBe("2.0.0");
    const screwResult = result.axes.find((a) => a.id === String(screw.id))!;
    const typedResult = result.axes.find((a) => a.id === String(typed.id))!;
    expect(typedResult.motion).toBeNull();
    expect(screwResult.motion).not.toBeNull();
    // docs/model.md (Motion from the mechanism) relations, not figures: a vertical screw holds its load at rest; it dwells, so it holds.
    const motion = screwResult.motion!;
    expect(motion.speedRpm).toBeGreaterThan(0);
    expect(motion.peakTorqueNm).toBeGreaterThanOrEqual(motion.loadTorqueNm);
    expect(motion.holdTorqueNm).toBeGreaterThan(0);
    expect(motion.movePct + motion.holdPct).toBeCloseTo(100, 9);
    expect(motion.holdPct).toBeGreaterThan(0);
    expect(screwResult.warnings).toContain("HOLDING_LOAD");
    // The same case as the engine evaluates it from the JSON alone.
    expect(evaluateCase(JSON.parse(JSON.stringify(input))).axes).toEqual(result.axes);
  });

  it("its event is priced as docs/model.md (The business case) builds it: the same flows as the equal cost per event", () => {
    const site = northHall();
    const machine = listMachines(engineer(), site.id)[0];
    const screw = createAxis(engineer(), axisApiSchema.parse(screwAxisBody(machine.id)));
    const created = createCase(engineer(), { name: "Event priced", siteId: site.id });
    setCaseAxes(engineer(), created.id, [screw.id]);
    const input = buildCaseInput(engineer(), created.id);
    input.finance = { ...input.finance, downtimeCostPerHour: "300", laborRatePerHour: "60" };
    // docs/model.md (The business case): downtimeMinutes/60·downtimeCostPerHour + scrapParts·scrapCostPerPart +
    // restartLaborHours·laborRatePerHour, here 20/60·300 + 3·4.80 + 0.5·60.
    const cost = new Decimal(20)
      .div(60)
      .mul(300)
      .plus(new Decimal(3).mul("4.80"))
      .plus(new Decimal("0.5").mul(60));
    const { event: _event, ...reliability } = input.axes[0].reliability!;
    const typed = {
      ...input,
      axes: [{ ...input.axes[0], reliability: { ...reliability, costPerEvent: cost.toFixed() } }],
    };
    const withEvent = evaluateCase(input);
    const withCost = evaluateCase(typed);
    expect(new Decimal(withEvent.totals.reliabilityPerYear).gt(0)).toBe(true);
    expect(withEvent.totals.reliabilityPerYear).toBe(withCost.totals.reliabilityPerYear);
    expect(withEvent.scenarios.physics.cashFlows).toEqual(withCost.scenarios.physics.cashFlows);
  });

  it("a new proposal of it carries engine 2.0.0", () => {
    const site = northHall();
    const machine = listMachines(engineer(), site.id)[0];
    const screw = createAxis(engineer(), axisApiSchema.parse(screwAxisBody(machine.id)));
    const created = createCase(engineer(), { name: "Motion proposal", siteId: site.id });
    setCaseAxes(engineer(), created.id, [screw.id]);
    const proposal = freezeProposal(engineer(), created.id);
    expect(proposal.engineVersion).toBe(ENGINE_VERSION);
    expect(proposal.result.engineVersion).toBe("2.0.0");
    expect(proposal.result.axes[0].motion).not.toBeNull();
  });
});

describe("an import with motion and event columns", () => {
  it("commits the template's motion row with its motion and event, and the case input carries them", async () => {
    const site = northHall();
    const checked = await checkImportFile(new TextEncoder().encode(templateCsv()), "template.csv", {
      site: { hoursPerYear: site.hoursPerYear, ambientC: site.ambientC },
    });
    expect(checked.result.errors).toEqual([]);
    const rows = checked.result.rows.map(({ sourceRow: _r, ...axis }) => ({
      ...axis,
      label: `${axis.label} ${Math.random().toString(36).slice(2, 8)}`,
    }));
    commitImport(
      engineer(),
      site.id,
      { fileName: "template.csv", sizeBytes: 1, rowsRead: rows.length, errorCount: 0 },
      rows,
    );
    const stored = rows.map((r) => db.select().from(axes).where(eq(axes.label, r.label)).get()!);
    expect(stored.map((a) => a.motion?.mechanism ?? null)).toEqual([null, "screw"]);
    expect(stored[1].event).toEqual({
      downtimeMinutes: 20,
      scrapParts: 3,
      scrapCostPerPart: "4.80",
      restartLaborHours: 0.5,
    });
    const created = createCase(engineer(), { name: "Imported motion", siteId: site.id });
    setCaseAxes(
      engineer(),
      created.id,
      stored.map((a) => a.id),
    );
    const input = buildCaseInput(engineer(), created.id);
    const lift = input.axes.find((a) => a.id === String(stored[1].id))!;
    expect(lift.duty.motion).toEqual(stored[1].motion);
    expect(lift.reliability?.event).toEqual(stored[1].event);
    const result = caseResult(engineer(), created.id);
    expect(result.axes.find((a) => a.id === String(stored[1].id))!.motion).not.toBeNull();
    expect(result.axes.find((a) => a.id === String(stored[0].id))!.motion).toBeNull();
  });
});

describe("case assumptions of engine v2 (docs/contracts.md (Case input) finance)", () => {
  it("migration 0007 writes the engine's defaults into a case stored before, and leaves set values alone", () => {
    const site = northHall();
    const fresh = createCase(engineer(), { name: "Stored before v2", siteId: site.id });
    const set = createCase(engineer(), { name: "Already taxed", siteId: site.id });
    const { assumptions } = getCaseOrThrow(engineer(), fresh.id);
    const {
      inflationPct: _i,
      taxRatePct: _t,
      depreciationYears: _d,
      ...v1Finance
    } = assumptions.finance;
    // As a v1 case was stored: its finance without the three v2 keys.
    db.update(cases)
      .set({ assumptions: { ...assumptions, finance: v1Finance } as typeof assumptions })
      .where(eq(cases.id, fresh.id))
      .run();
    updateAssumptions(
      engineer(),
      set.id,
      caseAssumptionsSchema.parse({
        ...assumptions,
        finance: { ...assumptions.finance, taxRatePct: 30 },
      }),
    );
    db.$client.exec(fs.readFileSync(path.resolve("drizzle/0007_case-finance-v2.sql"), "utf8"));
    const defaults = caseAssumptionsSchema.parse({ ...assumptions, finance: v1Finance }).finance;
    expect(getCaseOrThrow(engineer(), fresh.id).assumptions.finance).toEqual(defaults);
    expect(defaults).toMatchObject({ inflationPct: 0, taxRatePct: 0, depreciationYears: 5 });
    expect(getCaseOrThrow(engineer(), set.id).assumptions.finance.taxRatePct).toBe(30);
  });

  it("what the form saves flows into the engine's finance", () => {
    const site = northHall();
    const created = createCase(engineer(), { name: "Tax and inflation", siteId: site.id });
    const { assumptions } = getCaseOrThrow(engineer(), created.id);
    updateAssumptions(
      engineer(),
      created.id,
      caseAssumptionsSchema.parse({
        ...assumptions,
        finance: {
          ...assumptions.finance,
          inflationPct: 2.5,
          taxRatePct: 25,
          depreciationYears: 7,
        },
      }),
    );
    expect(buildCaseInput(engineer(), created.id).finance).toMatchObject({
      inflationPct: 2.5,
      taxRatePct: 25,
      depreciationYears: 7,
    });
  });

  it("refuses a tax rate of 100 % and depreciation outside 1…30 years, naming the field", () => {
    const site = northHall();
    const base = caseAssumptionsSchema.parse({
      finance: { tariffPerKWh: site.tariffPerKWh },
      margins: {},
      band: {},
      sensitivity: {},
      thermal: {},
    });
    const bad = caseAssumptionsSchema.safeParse({
      ...base,
      finance: { ...base.finance, taxRatePct: 100, depreciationYears: 0, inflationPct: -100 },
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path.join("."))).toEqual(
      expect.arrayContaining([
        "finance.taxRatePct",
        "finance.depreciationYears",
        "finance.inflationPct",
      ]),
    );
  });
});

// A proposal issued by engine 1.0.0 (tests/fixtures/proposal-v1.json: what that engine printed).
const V1 = JSON.parse(fs.readFileSync(path.resolve("tests/fixtures/proposal-v1.json"), "utf8"));

function insertV1Proposal() {
  const target = listCases(engineer())[0];
  return db.transaction((tx) => {
    const [{ last }] = tx
      .select({ last: sql<number>`max(${proposals.version})` })
      .from(proposals)
      .where(eq(proposals.caseId, target.id))
      .all();
    const [row] = tx
      .insert(proposals)
      .values({
        caseId: target.id,
        version: (last ?? 0) + 1,
        input: V1.input,
        result: V1.result,
        engineVersion: V1.engineVersion,
        createdById: engineer().id,
      })
      .returning()
      .all();
    openQuoteFor(tx, row, target.ownerId);
    return row;
  });
}

describe("a proposal issued with engine 1.0.0", () => {
  it("the fixture is a v1 result by the v1 contract", () => {
    expect(caseResultSchemaV1.parse(V1.result).engineVersion).toBe("1.0.0");
  });

  it("still reads with its frozen input, result and engine version 1.0.0", () => {
    const row = insertV1Proposal();
    const { quote, input, result } = getProposalSnapshotOrThrow(engineer(), row.id);
    expect(quote.engineVersion).toBe("1.0.0");
    expect(result).toEqual(V1.result);
    expect(input).toEqual(V1.input);
    expect(caseResultSchemaV1.parse(result).engineVersion).toBe("1.0.0");
    expect(listProposalsFor(engineer()).some((p) => p.id === row.id)).toBe(true);
    // Frozen: the database refuses any change (drizzle/0002 trigger).
    expect(() =>
      db.update(proposals).set({ engineVersion: "2.0.0" }).where(eq(proposals.id, row.id)).run(),
    ).toThrow();
  });

  it("its workbook opens: built from the frozen v1 result, it names engine 1.0.0", async () => {
    const row = insertV1Proposal();
    const { quote, input, result } = getProposalSnapshotOrThrow(engineer(), row.id);
    // What GET /api/v1/proposals/{id}/workbook does (the e2e test calls the route itself).
    const bytes = await buildProposalWorkbook(caseInputSchema.parse(input), result, {
      title: `${quote.caseName}: retrofit proposal, version ${quote.version}`,
      accountName: quote.accountName,
      siteName: quote.siteName,
      caseName: quote.caseName,
      version: quote.version,
      engineVersion: quote.engineVersion,
      generatedAt: new Date().toISOString(),
    });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
    expect(workbook.worksheets.length).toBeGreaterThan(1);
    let named = false;
    workbook.eachSheet((sheet) =>
      sheet.eachRow((r) => {
        const values = (r.values as unknown[]).slice(1);
        if (values[0] === "Engine version" && values[1] === "1.0.0") named = true;
      }),
    );
    expect(named).toBe(true);
  });
});
