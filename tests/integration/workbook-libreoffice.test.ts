import Decimal from "decimal.js";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import fixtureCase from "@/tests/fixtures/engine-case.json";
import handCase from "@/tests/fixtures/engine-hand-case.json";
import {
  caseInputSchema,
  evaluateCase,
  evaluateParsedCase,
  VALUE_SOURCES,
  type CaseResult,
  type ParsedCase,
  type Scenario,
} from "@/lib/engine";
import { asStoredV1Result } from "@/tests/support/stored-v1-result";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import { BEYOND_HORIZON, buildProposalWorkbook } from "@/lib/workbook";
import { IRR_NO_RATE_WORDS } from "@/lib/results/format";
import { PAYBACK_STATUS_LABELS } from "@/lib/glossary";
import {
  DISCOUNTED_COLUMN,
  TYPED_SHARE_LABEL,
  summarySourcesTop,
} from "@/lib/workbook/summary-sheet";
import { valueReliance } from "@/lib/results/value-reliance";
import { SCENARIOS } from "@/lib/workbook/layout";
import {
  machineBlockHeader,
  MACHINE_ALL_COLUMN,
  machineSourceColumn,
} from "@/lib/workbook/summary-machines";
import { machineValueTable } from "@/lib/results/machine-value";
import { sourceTotals } from "@/lib/results/source-totals";
import { caller } from "../support/callers";
import {
  cachedFormulaValues,
  definedNameTarget,
  definedNameValue,
  recalculateWithLibreOffice,
  sofficeVersion,
  withoutCachedFormulaValues,
  xlsxParts,
} from "@/tests/support/libreoffice";

const META = {
  title: "Retrofit proposal",
  accountName: "Invented packaging plant",
  siteName: "Hall 2",
  caseName: "Cartoner line",
  version: 1,
  engineVersion: "1.0.0",
  generatedAt: "2025-01-15T09:30:00.000Z",
};

const HYPERLINK_LABEL = '=HYPERLINK("http://example.invalid","open me")';

/** The hand case with a kit so dear that neither payback is reached within the 5-year horizon. */
function beyondHorizonCase() {
  const raw = structuredClone(handCase);
  raw.axes[0].retrofit.kit.price = "20000";
  raw.axes[0].label = HYPERLINK_LABEL;
  return raw;
}

/** Builds the workbook, removes every cached formula value, and has LibreOffice Calc recalculate it. */
async function recalculated(
  raw: unknown,
  edit?: (workbook: ExcelJS.Workbook) => void,
): Promise<{ result: CaseResult; calc: ExcelJS.Workbook; rate: number; input: ParsedCase }> {
  // Without LibreOffice every test fails (none is skipped), with the package to install.
  sofficeVersion();
  const input = caseInputSchema.parse(raw);
  const result = evaluateParsedCase(input);
  let stripped = await withoutCachedFormulaValues(await buildProposalWorkbook(input, result, META));
  if (edit) {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(stripped as unknown as ArrayBuffer);
    edit(workbook);
    stripped = Buffer.from(await workbook.xlsx.writeBuffer());
  }
  // LibreOffice keeps a value cached beside a formula instead of computing it: none may be left.
  let formulas = 0;
  for (const [part, xml] of xlsxParts(stripped)) {
    if (!part.startsWith("xl/worksheets/")) continue;
    formulas += (xml.match(/<f[ >]/g) ?? []).length;
    expect(cachedFormulaValues(xml), part).toEqual([]);
  }
  expect(formulas).toBeGreaterThan(600);
  const calc = new ExcelJS.Workbook();
  await calc.xlsx.load(recalculateWithLibreOffice(stripped) as unknown as ArrayBuffer);
  return { result, calc, rate: input.finance.discountRatePct, input };
}

const SCENARIO_NAMES: [string, keyof CaseResult["scenarios"]][] = [
  ["Physics", "physics"],
  ["BandLow", "bandLow"],
  ["BandHigh", "bandHigh"],
];

/** Each defined name against the engine: money to the cent, ratios and years to 1e-9. */
function expectEngineFigures(calc: ExcelJS.Workbook, result: CaseResult): Record<string, unknown> {
  const seen: Record<string, unknown> = {};
  const value = (name: string) => (seen[name] = definedNameValue(calc, name));
  const money = (name: string, expected: string) => {
    const v = value(name);
    expect(typeof v, name).toBe("number");
    expect(
      Math.abs((v as number) - Number(expected)),
      `${name}: Calc ${v}, engine ${expected}`,
    ).toBeLessThan(0.005);
  };
  const close = (name: string, expected: number | null, whenNull: string) => {
    const v = value(name);
    if (expected === null) expect(v, name).toBe(whenNull);
    else {
      expect(typeof v, `${name}: ${JSON.stringify(v)}`).toBe("number");
      expect(
        Math.abs((v as number) - expected),
        `${name}: Calc ${v}, engine ${expected}`,
      ).toBeLessThan(1e-9);
    }
  };
  money("Capex", result.totals.capex);
  close("EnergySaved_kWh", result.totals.energySavedKWhPerYear, "");
  for (const [suffix, key] of SCENARIO_NAMES) {
    const s: Scenario = result.scenarios[key];
    money(`NPV_${suffix}`, s.npv);
    close(`IRR_${suffix}`, s.irr, IRR_NO_RATE_WORDS);
    close(`Payback_${suffix}`, s.paybackYears, BEYOND_HORIZON);
    close(`DiscountedPayback_${suffix}`, s.discountedPaybackYears, BEYOND_HORIZON);
    close(`ROI_${suffix}`, s.roiPct, "n/a");
    // Engine v2 (docs/model.md (The business case)); a stored v1 result has no payback status of its own.
    if (s.paybackStatus !== undefined)
      expect(value(`PaybackStatus_${suffix}`)).toBe(PAYBACK_STATUS_LABELS[s.paybackStatus]);
  }
  // Break-even of the physics scenario: a tariff per kWh and a factor, to 1e-9.
  if (result.breakEven !== undefined) {
    close("BreakEven_Tariff", numberOrNull(result.breakEven.tariffPerKWh), "none");
    close("BreakEven_StepLossFactor", result.breakEven.stepLossFactor, "none");
  }
  return seen;
}

const numberOrNull = (money: string | null) => (money === null ? null : Number(money));

/**
 * The value-by-source block as Calc computed it (docs/model.md (The business case)): each source of each year
 * equals the engine's to the cent, and the year's cash flow in the year table is their sum.
 */
function expectSourcesAddUp(
  calc: ExcelJS.Workbook,
  result: CaseResult,
  horizon: number,
  rate: number,
): void {
  const sheet = calc.getWorksheet("Cash flow");
  if (!sheet) throw new Error("no Cash flow sheet");
  const number = (row: number, column: number) => {
    const cell = sheet.getCell(row, column);
    const v = cell.type === ExcelJS.ValueType.Formula ? cell.result : cell.value;
    expect(typeof v, `${cell.address}: ${JSON.stringify(v)}`).toBe("number");
    return v as number;
  };
  for (const [key, start, flowColumn] of [
    ["physics", 69, 3],
    ["bandLow", 79, 9],
    ["bandHigh", 89, 15],
  ] as const) {
    const s = result.scenarios[key];
    for (let t = 1; t <= horizon; t++) {
      let sum = 0;
      VALUE_SOURCES.forEach((source, i) => {
        const v = number(start + 1 + i, 2 + t);
        sum += v;
        expect(
          Math.abs(v - Number(s.bySource[source][t - 1])),
          `${key} ${source} year ${t}`,
        ).toBeLessThan(0.005);
      });
      const flow = number(3 + t, flowColumn);
      expect(Math.abs(sum - flow), `${key} year ${t}: sources ${sum}, flow ${flow}`).toBeLessThan(
        1e-6,
      );
      expect(Math.abs(flow - Number(s.cashFlows[t])), `${key} year ${t}`).toBeLessThan(0.005);
    }
  }
  expectSummaryBreakdown(calc, result, rate);
}

/**
 * The Summary's value by source over the horizon, as Calc recalculates its live sums, equals
 * the engine's per-source sums to the cent, and its total row equals the sum of the flows.
 */
function expectSummaryBreakdown(calc: ExcelJS.Workbook, result: CaseResult, rate: number): void {
  const sheet = calc.getWorksheet("Summary");
  if (!sheet) throw new Error("no Summary sheet");
  const top = summarySourcesTop(sheet);
  expect(top, "value-by-source block on the Summary").not.toBeNull();
  const cents = (v: Decimal.Value) => new Decimal(v).toFixed(2);
  (["physics", "bandLow", "bandHigh"] as const).forEach((key, j) => {
    const s = result.scenarios[key];
    const read = (row: number, column = 2 + j) => {
      const cell = sheet.getCell(row, column);
      expect(cell.type, cell.address).toBe(ExcelJS.ValueType.Formula);
      expect(typeof cell.result, `${cell.address}: ${JSON.stringify(cell.result)}`).toBe("number");
      return cell.result as number;
    };
    VALUE_SOURCES.forEach((source, i) => {
      const engine = s.bySource[source].reduce((acc, v) => acc.plus(v), new Decimal(0));
      expect(cents(read(top! + 1 + i)), `Summary ${key} ${source}`).toBe(cents(engine));
    });
    const flows = s.cashFlows.slice(1).reduce((acc, v) => acc.plus(v), new Decimal(0));
    expect(cents(read(top! + 1 + VALUE_SOURCES.length)), `Summary ${key} total`).toBe(cents(flows));
    // Discounted at the case's rate: each source against the engine's figures discounted in
    // Decimal (lib/results/source-totals.ts), and the discounted total less the up-front cost
    // against the engine's NPV.
    const discounted = DISCOUNTED_COLUMN + j;
    sourceTotals(s, rate).forEach((t, i) =>
      expect(cents(read(top! + 1 + i, discounted)), `Summary ${key} ${t.source} discounted`).toBe(
        cents(t.discounted),
      ),
    );
    expect(
      cents(read(top! + 2 + VALUE_SOURCES.length, discounted)),
      `Summary ${key} NPV from the discounted sources`,
    ).toBe(cents(s.npv));
    // The share resting on typed figures, as the screens state it in whole percent
    // (lib/results/value-reliance.ts): Calc's live formula rounds to the same.
    const shareRow = top! + 3 + VALUE_SOURCES.length;
    expect(sheet.getCell(shareRow, 1).value).toBe(TYPED_SHARE_LABEL);
    const reliance = valueReliance(s);
    expect(reliance, `${key}: value over the horizon`).not.toBeNull();
    // The screens never round a share short of the whole up to 100 % (wholePercent).
    const share = read(shareRow);
    const rounded = Math.round(share * 100);
    expect(rounded === 100 && share < 1 ? 99 : rounded, `Summary ${key} typed share`).toBe(
      reliance!.typedPct,
    );
  });
}

/**
 * The Summary's per-machine blocks (each scenario, over the horizon then discounted), as Calc
 * recalculates their live formulas: every machine, the case-wide row and the total, each source
 * and all of them, equal the engine's split (lib/engine/machine-value.ts) to the cent; the total
 * row is the case's own figure.
 */
function expectMachineBlocks(calc: ExcelJS.Workbook, result: CaseResult, input: ParsedCase): void {
  const sheet = calc.getWorksheet("Summary");
  if (!sheet) throw new Error("no Summary sheet");
  const cents = (v: Decimal.Value) => new Decimal(v).toFixed(2);
  for (const scenario of SCENARIOS) {
    const table = machineValueTable(result, input, scenario);
    expect(table.rows.length).toBe(input.machines.length + 2);
    for (const [discounted, measure] of [
      [false, "horizon"],
      [true, "discounted"],
    ] as const) {
      const header = machineBlockHeader(scenario, discounted);
      let top = 0;
      sheet.eachRow((row, n) => {
        if (row.getCell(1).value === header) top = n;
      });
      expect(top, header).toBeGreaterThan(0);
      table.rows.forEach((expected, k) => {
        const r = top + 1 + k;
        if (expected.kind === "machine") expect(sheet.getCell(r, 1).value).toBe(expected.name);
        const read = (column: number) => {
          const cell = sheet.getCell(r, column);
          expect(cell.type, cell.address).toBe(ExcelJS.ValueType.Formula);
          expect(typeof cell.result, `${cell.address}: ${JSON.stringify(cell.result)}`).toBe(
            "number",
          );
          return cell.result as number;
        };
        const label = `${scenario} ${expected.name} ${measure}`;
        for (const source of VALUE_SOURCES)
          expect(cents(read(machineSourceColumn(source))), `${label} ${source}`).toBe(
            cents(expected.values[measure][source]),
          );
        expect(cents(read(MACHINE_ALL_COLUMN)), `${label} all`).toBe(cents(expected.all[measure]));
      });
    }
  }
}

/** The fixture case with inflation, tax, depreciation and event costs built up (engine v2). */
function financeV2Case() {
  const raw = structuredClone(fixtureCase) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- edited freely before parsing
  Object.assign(raw.finance, {
    horizonYears: 7,
    inflationPct: 3.5,
    taxRatePct: 27,
    depreciationYears: 4,
    // A project cost that puts NPV just below 0, so that both break-even values exist.
    projectOneTimeCost: "21000",
  });
  for (const machine of raw.machines) machine.throughputGainPct = 0;
  for (const axis of raw.axes) {
    const events = axis.reliability?.stepLossEventsPerYear ?? 3;
    axis.reliability = {
      stepLossEventsPerYear: events,
      avoidedPct: 85,
      event: {
        downtimeMinutes: 25,
        scrapParts: 6,
        scrapCostPerPart: "4.20",
        restartLaborHours: 0.75,
      },
    };
  }
  return raw;
}

/** Types a value into the input cell a defined name points at. */
function setInput(workbook: ExcelJS.Workbook, name: string, value: number): void {
  const { sheet, address } = definedNameTarget(workbook, name);
  const cell = workbook.getWorksheet(sheet)?.getCell(address);
  if (!cell) throw new Error(`no cell for ${name}`);
  cell.value = value;
}

/** A money figure by defined name against the engine's, to the cent. */
function money(calc: ExcelJS.Workbook, name: string, expected: string): void {
  const v = definedNameValue(calc, name);
  expect(typeof v, name).toBe("number");
  expect(
    Math.abs((v as number) - Number(expected)),
    `${name}: Calc ${v}, engine ${expected}`,
  ).toBeLessThan(0.005);
}

describe("LibreOffice Calc recalculating the exported workbook (docs/model.md (Sources of the check values))", () => {
  it("reproduces the engine's figures for the engine fixture case (engine-case.json)", async () => {
    const { result, calc } = await recalculated(fixtureCase);
    const seen = expectEngineFigures(calc, result);
    console.info("engine-case.json, LibreOffice:", JSON.stringify(seen));
  }, 180_000);

  it("reproduces the engine's figures for the hand-checked case (engine-hand-case.json)", async () => {
    const { result, calc } = await recalculated(handCase);
    const seen = expectEngineFigures(calc, result);
    console.info("engine-hand-case.json, LibreOffice:", JSON.stringify(seen));
  }, 180_000);

  it("reproduces inflation, tax, straight-line depreciation, event costs, value by source and break-even (engine v2)", async () => {
    const raw = financeV2Case();
    const { result, calc, rate, input } = await recalculated(raw);
    expect(result.scenarios.physics.bySource.tax.some((t) => Number(t) !== 0)).toBe(true);
    expect(result.breakEven.stepLossFactor).not.toBeNull();
    expect(result.breakEven.tariffPerKWh).not.toBeNull();
    const seen = expectEngineFigures(calc, result);
    expectSourcesAddUp(calc, result, 7, rate);
    expectMachineBlocks(calc, result, input);
    // Depreciation: SLN(Capex, 0, 4) = Capex/4 (LibreOffice Calc help, SLN).
    const depreciation = definedNameValue(calc, "Depreciation_PerYear");
    expect(Math.abs((depreciation as number) - Number(result.totals.capex) / 4)).toBeLessThan(1e-9);
    money(calc, "Reliability_PerYear", result.totals.reliabilityPerYear);
    console.info("finance v2 case, LibreOffice:", JSON.stringify(seen));
  }, 180_000);

  it("moves the break-even tariff with the tax rate and inflation a reviewer types in (engine v2)", async () => {
    const { calc } = await recalculated(financeV2Case(), (workbook) => {
      setInput(workbook, "TaxRate_Pct", 15);
      setInput(workbook, "Inflation_Pct", 6);
      setInput(workbook, "Depreciation_Years", 2);
    });
    const edited = financeV2Case();
    Object.assign(edited.finance, { taxRatePct: 15, inflationPct: 6, depreciationYears: 2 });
    const result = evaluateCase(edited);
    expectEngineFigures(calc, result);
    // The rate was not edited: the fixture's own.
    expectSourcesAddUp(calc, result, 7, edited.finance.discountRatePct);
  }, 180_000);

  it("opens and recalculates the workbook of a proposal issued by engine v1 (no value by source, payback status or break-even stored)", async () => {
    sofficeVersion();
    const input = caseInputSchema.parse(fixtureCase);
    const v1 = asStoredV1Result(evaluateParsedCase(input));
    const stripped = await withoutCachedFormulaValues(
      await buildProposalWorkbook(input, v1, { ...META, engineVersion: "1.0.0" }),
    );
    const calc = new ExcelJS.Workbook();
    await calc.xlsx.load(recalculateWithLibreOffice(stripped) as unknown as ArrayBuffer);
    // Its stored figures, recalculated: a v1 input has no inflation or tax.
    const seen = expectEngineFigures(calc, v1);
    expect(definedNameValue(calc, "PaybackStatus_Physics")).toBe(PAYBACK_STATUS_LABELS.reached);
    console.info("stored v1 result, LibreOffice:", JSON.stringify(seen));
  }, 180_000);

  it("says the payback lies beyond the horizon when the engine finds none, and keeps a formula-like label as text", async () => {
    const { result, calc } = await recalculated(beyondHorizonCase());
    expect(result.scenarios.physics.paybackYears).toBeNull();
    expect(result.scenarios.physics.discountedPaybackYears).toBeNull();
    const seen = expectEngineFigures(calc, result);
    expect(seen.Payback_Physics).toBe(BEYOND_HORIZON);
    console.info("beyond-horizon case, LibreOffice:", JSON.stringify(seen));

    const label = calc.getWorksheet("Axes")?.getCell("A3");
    expect(label?.type).toBe(ExcelJS.ValueType.String);
    expect(label?.value).toBe(HYPERLINK_LABEL);
  }, 180_000);

  it("moves NPV, IRR and payback as the engine does when a reviewer changes the tariff and the horizon in the file", async () => {
    const { calc } = await recalculated(fixtureCase, (workbook) => {
      setInput(workbook, "Tariff", 0.48);
      setInput(workbook, "Horizon_Years", 8);
      setInput(workbook, "DiscountRate_Pct", 11);
    });
    const edited = structuredClone(fixtureCase);
    Object.assign(edited.finance, { tariffPerKWh: "0.48", horizonYears: 8, discountRatePct: 11 });
    const seen = expectEngineFigures(calc, evaluateCase(edited));
    console.info(
      "engine-case.json with tariff 0.48, horizon 8, rate 11 %, LibreOffice:",
      JSON.stringify(seen),
    );
  }, 180_000);
});

describe("LibreOffice Calc recalculating the workbook of every seeded demo case (issue 5)", () => {
  const manager = caller("manager@example.com");
  const demo = listCases(manager);

  it("has the four demo cases to check", () => {
    expect(demo.length).toBeGreaterThanOrEqual(4);
  });

  it.each(demo.map((c) => [c.name, c.id] as const))(
    "%s: every defined name and the Summary's value by source equal the engine's figures",
    async (_name, id) => {
      const { result, calc, rate, input } = await recalculated(buildCaseInput(manager, id));
      expectEngineFigures(calc, result);
      // Each machine's value by source, plain and discounted, as Calc works it out from the
      // Axes and Assumptions sheets, against the engine's split (lib/engine/machine-value.ts).
      expectMachineBlocks(calc, result, input);
      // Every scenario's Summary breakdown by source, plain and discounted, recalculated by Calc, to the cent.
      expectSummaryBreakdown(calc, result, rate);
    },
    180_000,
  );
});
