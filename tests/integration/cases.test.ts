import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { getAxisOrThrow, listAxes, listAxesForExport, updateAxis } from "@/db/queries/axes";
import { recordAudit } from "@/db/queries/audit";
import {
  buildCaseInput,
  createCase,
  getCaseOrThrow,
  listCases,
  updateAssumptions,
} from "@/db/queries/cases";
import {
  listCaseAxes,
  setAxisRetrofit,
  setCaseAxes,
  suggestKitsForCase,
} from "@/db/queries/case-axes";
import { getProposalOrThrow, listProposals } from "@/db/queries/proposal-versions";
import { freezeProposal } from "@/server/cases/freeze";
import { caseResult } from "@/server/cases/results";
import { listKits, listMotors, saveKit } from "@/db/queries/catalogue";
import { listSites } from "@/db/queries/sites";
import { caseInputSchema, evaluateCase, suggestKit, type KitInput } from "@/lib/engine";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { axisRetrofitSchema, caseAssumptionsSchema } from "@/lib/validations/case";
import { axisInputSchema as axisFormSchema } from "@/lib/validations/installed-base";
import { kitInputSchema as kitCatalogueSchema } from "@/lib/validations/catalogue";
import { caseResultSchema } from "../support/case-result-schema";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const engineer2 = () => caller("engineer2@example.com");
const manager = () => caller("manager@example.com");
const reviewer = () => caller("reviewer@example.com");

const siteNamed = (name: string) => listSites(manager()).find((s) => s.name === name)!;
const caseNamed = (name: string) => listCases(manager()).find((c) => c.name === name)!;

// A fresh case on a site with the first `count` axes of the site picked.
function newCase(who = engineer(), siteName = "North hall", count = 6) {
  const site = siteNamed(siteName);
  const row = createCase(who, {
    name: `Test case ${Math.random().toString(36).slice(2)}`,
    siteId: site.id,
  });
  // In id order: the first machines' axes, a mix of frame sizes, speeds and loads.
  const picked = listAxesForExport(who, site.id, 0, count).axes;
  setCaseAxes(
    who,
    row.id,
    picked.map((a) => a.id),
  );
  return { id: row.id, site, axisIds: picked.map((a) => a.id) };
}

// Database rows hold null where the forms leave a field out.
const nullsAsAbsent = <T extends object>(row: T) =>
  Object.fromEntries(Object.entries(row).filter(([, v]) => v !== null));

function withTariff(caseId: number, tariff: string) {
  const { assumptions } = getCaseOrThrow(engineer(), caseId);
  updateAssumptions(
    engineer(),
    caseId,
    caseAssumptionsSchema.parse({
      ...assumptions,
      finance: { ...assumptions.finance, tariffPerKWh: tariff },
    }),
  );
}

describe("the demo cases", () => {
  it("seeds seven cases at all five stages, five of them frozen as version 1 with a quote in the pipeline", () => {
    const all = listCases(manager());
    expect(all).toHaveLength(7);
    expect(new Set(all.map((c) => c.stage))).toEqual(
      new Set(["draft", "modelled", "proposed", "won", "lost"]),
    );
    expect(all.every((c) => c.axisCount >= 3 && c.axisCount <= 48)).toBe(true);
    const underReview = caseNamed("North hall cartoners, phase 1");
    expect(underReview).toMatchObject({
      stage: "proposed",
      accountName: "Cartonia Packaging Plant",
      latestVersion: 1,
    });
    expect(all.filter((c) => c.latestVersion !== null)).toHaveLength(5);
    const [version] = listProposals(engineer(), underReview.id);
    expect(version.changes).toEqual(["First version"]);
    expect(version.stage).toBe("sent");
    // No draft or modelled case has a proposal yet.
    expect(
      all.filter((c) => c.stage === "draft" || c.stage === "modelled").map((c) => c.latestVersion),
    ).toEqual([null, null]);
  });

  it("gives each case the result of evaluateCase on exactly the input it stores, which the engine's schema accepts", () => {
    for (const c of listCases(manager())) {
      const input = buildCaseInput(manager(), c.id);
      const parsed = caseInputSchema.safeParse(input);
      expect(parsed.success, JSON.stringify(parsed.error?.issues.slice(0, 3))).toBe(true);
      const result = caseResult(manager(), c.id);
      expect(result).toEqual(evaluateCase(input));
      caseResultSchema.parse(result);
      expect(result.axes).toHaveLength(listCaseAxes(manager(), c.id).length);
    }
  });

  it("builds the input from the site, the case's assumptions, its axes' rows and their kits", () => {
    const c = caseNamed("North hall cartoners, phase 1");
    const input = buildCaseInput(engineer(), c.id);
    const site = siteNamed("North hall");
    expect(input.currency).toBe(site.currency);
    expect(input.finance).toEqual(c.assumptions.finance);
    expect(input.finance.tariffPerKWh).toBe(site.tariffPerKWh);
    const rows = listCaseAxes(engineer(), c.id);
    expect(input.axes.map((a) => a.id).sort()).toEqual(rows.map((r) => String(r.axisId)).sort());
    // Machines are exactly those of the picked axes, with their ids as strings.
    expect(new Set(input.machines.map((m) => m.id))).toEqual(
      new Set(rows.map((r) => String(r.machineId))),
    );
    const first = rows[0];
    const axis = input.axes.find((a) => a.id === String(first.axisId))!;
    expect(axis.retrofit.kit.id).toBe(first.kitCode);
    expect(axis.retrofit.kit.price).toBe(first.kitPrice);
    expect(axis.retrofit.discountPct).toBe(first.discountPct);
  });

  it("serves a repeated result of an unchanged case without recomputing, and a new one after an edit", () => {
    const { id } = newCase(engineer(), "North hall", 4);
    const first = caseResult(engineer(), id);
    expect(caseResult(engineer(), id)).toBe(first);
    withTariff(id, "0.30");
    const second = caseResult(engineer(), id);
    expect(second).not.toBe(first);
    expect(second).toEqual(evaluateCase(buildCaseInput(engineer(), id)));
  });
});

describe("the cached result follows every input it is built from", () => {
  const admin = () => caller("admin@example.com");

  it("recomputes after a kit price change in the catalogue and an axis edit on the site, and not after unrelated writes", () => {
    const { id, axisIds } = newCase(engineer(), "North hall", 3);
    const first = caseResult(engineer(), id);

    // Neither the case nor its rows change: only the kit in the catalogue does.
    const kitId = listCaseAxes(engineer(), id)[0].kitId;
    const kit = listKits(admin(), { includeRetired: true }).find((k) => k.id === kitId)!;
    const dearer = new Decimal(kit.price).plus(100).toFixed(2);
    saveKit(admin(), kitCatalogueSchema.parse({ ...nullsAsAbsent(kit), price: dearer }), kit.id);
    const afterKit = caseResult(engineer(), id);
    expect(afterKit).not.toBe(first);
    expect(afterKit).toEqual(evaluateCase(buildCaseInput(engineer(), id)));
    expect(new Decimal(afterKit.totals.capex).gt(first.totals.capex)).toBe(true);

    // An axis of the case edited on its site page: its load torque doubles.
    const axis = getAxisOrThrow(engineer(), axisIds[0]);
    const load = axis.loadTorqueNm * 2;
    updateAxis(
      engineer(),
      axis.id,
      axisFormSchema.parse({
        ...nullsAsAbsent(axis),
        loadTorqueNm: load,
        peakTorqueNm: Math.max(axis.peakTorqueNm, load),
      }),
    );
    const afterAxis = caseResult(engineer(), id);
    expect(afterAxis).not.toBe(afterKit);
    expect(afterAxis).toEqual(evaluateCase(buildCaseInput(engineer(), id)));

    // A sign-in's audit record touches no input table: the same result object is served.
    recordAudit({ actor: engineer(), action: "test.unrelated", targetType: "user" });
    expect(caseResult(engineer(), id)).toBe(afterAxis);
  });
});

describe("creating and editing a case", () => {
  it("starts from the site's tariff and CO₂ factor and the engine's defaults (docs/contracts.md (Case input))", () => {
    const site = siteNamed("South hall");
    const row = createCase(engineer(), { name: "Defaults check", siteId: site.id });
    const found = getCaseOrThrow(engineer(), row.id);
    expect(found).toMatchObject({
      stage: "draft",
      accountId: site.accountId,
      siteName: "South hall",
      accountName: "Cartonia Packaging Plant",
      ownerName: "Demo Engineer",
      axisCount: 0,
    });
    expect(found.assumptions.finance).toMatchObject({
      tariffPerKWh: site.tariffPerKWh,
      gridKgCo2PerKWh: site.gridKgCo2PerKWh,
      discountRatePct: 8,
      horizonYears: 5,
      coolingCop: null,
    });
    expect(found.assumptions.margins).toEqual({
      openLoopRequiredPct: 40,
      closedLoopRequiredPct: 15,
    });
    expect(found.assumptions.band).toEqual({ lowPct: 25, highPct: 50 });
    expect(found.assumptions.sensitivity).toEqual({ swingPct: 20 });
    expect(found.assumptions.thermal).toEqual({ lifeHalvingK: 10 });
    // Nothing to evaluate before axes are picked: a clear refusal, not a server error.
    expect(() => caseResult(engineer(), row.id)).toThrow(ConflictError);
  });

  it("picks axes of the case's site only, gives new ones a kit, and keeps retrofit terms of axes kept", () => {
    const { id, site, axisIds } = newCase(engineer(), "North hall", 5);
    expect(getCaseOrThrow(engineer(), id).stage).toBe("modelled");
    const terms = axisRetrofitSchema.parse({
      kitId: listCaseAxes(engineer(), id)[0].kitId,
      discountPct: 10,
      installHours: 2,
      commissioningCost: "45.50",
    });
    setAxisRetrofit(engineer(), id, axisIds[0], terms);
    const more = listAxesForExport(engineer(), site.id, 0, 8).axes.map((a) => a.id);
    expect(setCaseAxes(engineer(), id, more)).toEqual({ added: 3, removed: 0, total: 8 });
    const rows = listCaseAxes(engineer(), id);
    expect(rows).toHaveLength(8);
    expect(rows.find((r) => r.axisId === axisIds[0])).toMatchObject({
      discountPct: 10,
      installHours: 2,
      commissioningCost: "45.50",
    });
    expect(setCaseAxes(engineer(), id, more.slice(2))).toEqual({ added: 0, removed: 2, total: 6 });
    const south = listAxes(engineer(), siteNamed("South hall").id).rows[0];
    expect(() => setCaseAxes(engineer(), id, [...more, south.id])).toThrow(NotFoundError);
    expect(listCaseAxes(engineer(), id)).toHaveLength(6);
  });

  it("refuses a kit priced in another currency or retired, and an axis that is not in the case", () => {
    const { id, axisIds, site } = newCase(engineer(), "North hall", 2);
    const retired = listKits(manager(), { includeRetired: true }).find((k) => !k.active)!;
    expect(() =>
      setAxisRetrofit(engineer(), id, axisIds[0], axisRetrofitSchema.parse({ kitId: retired.id })),
    ).toThrow(NotFoundError);
    const dollars = saveKit(
      caller("admin@example.com"),
      kitCatalogueSchema.parse({
        code: "TEST-USD",
        name: "Invented kit priced in dollars",
        price: "150.00",
        currency: "USD",
      }),
    );
    expect(() =>
      setAxisRetrofit(engineer(), id, axisIds[0], axisRetrofitSchema.parse({ kitId: dollars.id })),
    ).toThrow(/priced in USD, this case in EUR/);
    // Suggestions never reach for it either: its price is not in the case's currency.
    expect(suggestKitsForCase(engineer(), id).every((s) => s.kitId !== dollars.id)).toBe(true);
    const outside = listAxesForExport(engineer(), site.id, 10, 1).axes[0].id;
    const kitId = listKits(manager())[0].id;
    expect(() =>
      setAxisRetrofit(engineer(), id, outside, axisRetrofitSchema.parse({ kitId })),
    ).toThrow(NotFoundError);
  });
});

describe("suggesting kits", () => {
  // The catalogue as the engine's KitInput, written out here from the catalogue rows.
  function catalogueKits(currency: string): KitInput[] {
    const motors = new Map(listMotors(manager(), { includeRetired: true }).map((m) => [m.id, m]));
    return listKits(manager())
      .filter((k) => k.currency === currency)
      .map((k) => {
        const m = k.motorId ? motors.get(k.motorId)! : null;
        return {
          id: k.code,
          name: k.name,
          price: k.price,
          sensing: k.sensing,
          motor: m
            ? {
                rotorTeeth: m.rotorTeeth,
                holdingTorqueNm: m.holdingTorqueNm,
                ratedCurrentA: m.ratedCurrentA,
                phaseResistanceOhm: m.phaseResistanceOhm,
                phaseInductanceMh: m.phaseInductanceMh,
                thermalResistanceKPerW: m.thermalResistanceKPerW ?? undefined,
                ratedTempRiseK: m.ratedTempRiseK,
                insulationClass: m.insulationClass,
                hysteresisWPerHz: m.hysteresisWPerHz,
                eddyWPerHz2: m.eddyWPerHz2,
              }
            : undefined,
          maxCurrentPeakA: k.maxCurrentPeakA ?? undefined,
          busVoltageV: k.busVoltageV ?? undefined,
          efficiencyPct: k.efficiencyPct,
          standbyW: k.standbyW,
          encoderW: k.encoderW ?? undefined,
          minCurrentPct: k.minCurrentPct,
          sensorlessMinRpm: k.sensorlessMinRpm,
        };
      });
  }

  it("puts on each axis the cheapest kit that keeps the closed-loop margin, as suggestKit picks it", () => {
    const { id, axisIds } = newCase(engineer(), "North hall", 12);
    // Start every axis on the dearest kit, so each suggestion has to move it.
    const dearest = listKits(manager())
      .filter((k) => k.currency === "EUR")
      .at(-1)!;
    for (const axisId of axisIds)
      setAxisRetrofit(
        engineer(),
        id,
        axisId,
        axisRetrofitSchema.parse({ kitId: dearest.id, discountPct: 5 }),
      );

    const input = buildCaseInput(engineer(), id);
    const kits = catalogueKits(input.currency);
    const expected = new Map(
      input.axes.map((a) => [a.id, suggestKit(a, kits, input.margins)] as const),
    );
    const suggestions = suggestKitsForCase(engineer(), id);
    expect(suggestions).toHaveLength(axisIds.length);

    const rows = new Map(listCaseAxes(engineer(), id).map((r) => [String(r.axisId), r]));
    const result = caseResult(engineer(), id);
    for (const s of suggestions) {
      const direct = expected.get(String(s.axisId))!;
      expect(s.reason).toBe(direct.reason);
      const row = rows.get(String(s.axisId))!;
      if (direct.kit) {
        expect(row.kitCode).toBe(direct.kit.id);
        // Cheapest among the kits that keep the margin: no fitting kit is cheaper.
        const axisResult = result.axes.find((a) => a.id === String(s.axisId))!;
        expect(axisResult.closedLoop.status).not.toBe("undersized");
        const peak = input.axes.find((a) => a.id === String(s.axisId))!.duty.peakTorqueNm as number;
        expect(axisResult.closedLoop.usableTorqueNm).toBeGreaterThanOrEqual(peak);
        expect(new Decimal(row.kitPrice).lte(dearest.price)).toBe(true);
      } else {
        expect(s.kitId).toBeNull();
        expect(row.kitCode).toBe(dearest.code);
        expect(s.reason).toMatch(/no kit/);
      }
    }
    // The suggestions move axes off the dearest kit: the choice follows each axis's needs (with
    // engine 2's torque at speed the cheapest kit covers every axis of this demo hall).
    expect(suggestions.some((s) => s.kitId !== null && s.kitId !== dearest.id)).toBe(true);
  });
});

describe("frozen proposals", () => {
  it("do not change when their case changes afterwards, and the database refuses to update one", async () => {
    const { id, axisIds } = newCase(engineer(), "North hall", 6);
    const proposal = freezeProposal(engineer(), id);
    expect(proposal.version).toBe(1);
    expect(getCaseOrThrow(engineer(), id).stage).toBe("proposed");
    const frozen = structuredClone(getProposalOrThrow(engineer(), proposal.id));
    expect(frozen.input).toEqual(buildCaseInput(engineer(), id));
    expect(frozen.result).toEqual(evaluateCase(frozen.input));

    withTariff(id, "0.35");
    setCaseAxes(engineer(), id, axisIds.slice(0, 3));
    suggestKitsForCase(engineer(), id);
    const after = getProposalOrThrow(engineer(), proposal.id);
    expect(after.input).toEqual(frozen.input);
    expect(after.result).toEqual(frozen.result);
    expect(caseResult(engineer(), id)).not.toEqual(frozen.result);

    const { db } = await import("@/db");
    expect(() =>
      db.$client.prepare("update proposals set result = '{}' where id = ?").run(proposal.id),
    ).toThrow(/immutable/);
  });

  it("list, for each version, what changed since the one before: a tariff change and its NPV", () => {
    const { id, axisIds } = newCase(engineer(), "North hall", 6);
    withTariff(id, "0.21");
    freezeProposal(engineer(), id);
    withTariff(id, "0.24");
    freezeProposal(engineer(), id);
    setCaseAxes(engineer(), id, axisIds.slice(1));
    freezeProposal(engineer(), id);
    freezeProposal(engineer(), id);

    const versions = listProposals(engineer(), id);
    expect(versions.map((v) => v.version)).toEqual([1, 2, 3, 4]);
    expect(versions[0].changes).toEqual(["First version"]);
    expect(versions[1].changes).toContain("Tariff: 0.21 → 0.24 EUR/kWh");
    expect(versions[1].changes.find((c) => c.startsWith("NPV (physics): "))).toMatch(
      /^NPV \(physics\): -?\d+\.\d{2} → -?\d+\.\d{2} EUR$/,
    );
    expect(versions[2].changes.some((c) => c.startsWith("Axes removed (1): "))).toBe(true);
    expect(versions[3].changes).toEqual(["No change since version 3"]);
    expect(new Decimal(versions[1].npv).gt(versions[0].npv)).toBe(true);
  });
});

describe("who reaches which case (cross-account)", () => {
  it("another engineer's case, its axes, result and proposals are not found, exactly like missing ids", () => {
    const theirs = caseNamed("Gantry pilot");
    const seededProposal = listProposals(
      engineer(),
      caseNamed("North hall cartoners, phase 1").id,
    )[0];
    expect(listCases(engineer()).map((c) => c.id)).not.toContain(theirs.id);
    const kitId = listKits(manager())[0].id;
    const axisId = listCaseAxes(engineer2(), theirs.id)[0].axisId;
    const { assumptions } = getCaseOrThrow(engineer2(), theirs.id);
    const versionsBefore = listProposals(engineer2(), theirs.id);
    const attempts: [string, () => unknown][] = [
      ["getCaseOrThrow", () => getCaseOrThrow(engineer(), theirs.id)],
      ["buildCaseInput", () => buildCaseInput(engineer(), theirs.id)],
      ["caseResult", () => caseResult(engineer(), theirs.id)],
      ["listCaseAxes", () => listCaseAxes(engineer(), theirs.id)],
      ["updateAssumptions", () => updateAssumptions(engineer(), theirs.id, assumptions)],
      ["setCaseAxes", () => setCaseAxes(engineer(), theirs.id, [])],
      [
        "setAxisRetrofit",
        () => setAxisRetrofit(engineer(), theirs.id, axisId, axisRetrofitSchema.parse({ kitId })),
      ],
      ["suggestKitsForCase", () => suggestKitsForCase(engineer(), theirs.id)],
      ["freezeProposal", () => freezeProposal(engineer(), theirs.id)],
      ["listProposals", () => listProposals(engineer(), theirs.id)],
      ["getProposalOrThrow", () => getProposalOrThrow(engineer2(), seededProposal.id)],
      [
        "createCase",
        () => createCase(engineer(), { name: "Sneaky", siteId: siteNamed("Assembly and test").id }),
      ],
      ["missing case", () => getCaseOrThrow(engineer(), 99_999_999)],
      ["missing proposal", () => getProposalOrThrow(engineer(), 99_999_999)],
    ];
    for (const [name, attempt] of attempts) expect(attempt, name).toThrow(NotFoundError);
    // Nothing was changed on the way.
    expect(getCaseOrThrow(engineer2(), theirs.id).updatedAt).toBe(theirs.updatedAt);
    expect(listProposals(engineer2(), theirs.id)).toEqual(versionsBefore);
  });

  it("an engineer shared on an account works on its cases; managers see every account's", () => {
    const shared = caseNamed("Slitter knife and tension axes");
    expect(getCaseOrThrow(engineer2(), shared.id).accountName).toBe("Webline Print Finishing");
    expect(new Set(listCases(manager()).map((c) => c.accountName)).size).toBe(3);
  });

  it("refuses reviewers: they see frozen proposals in their portal, not the working cases", () => {
    const mine = caseNamed("North hall cartoners, phase 1");
    const proposal = listProposals(engineer(), mine.id)[0];
    expect(() => listCases(reviewer())).toThrow(ForbiddenError);
    expect(() => getCaseOrThrow(reviewer(), mine.id)).toThrow(ForbiddenError);
    expect(() => caseResult(reviewer(), mine.id)).toThrow(ForbiddenError);
    expect(() => freezeProposal(reviewer(), mine.id)).toThrow(ForbiddenError);
    expect(() => getProposalOrThrow(reviewer(), proposal.id)).toThrow(ForbiddenError);
    expect(() =>
      createCase(reviewer(), { name: "Reviewer case", siteId: siteNamed("North hall").id }),
    ).toThrow(ForbiddenError);
  });
});
