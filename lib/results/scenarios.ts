import Decimal from "decimal.js";
import type { CaseResult, ParsedCase, Scenario } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { scenarioLabel } from "@/lib/glossary";
import { bandPosition, bandPositionText, type BandPosition } from "./band";
import { DEFAULT_BAND } from "./case-view";

export const SCENARIO_KEYS = ["physics", "bandLow", "bandHigh"] as const;
export type ScenarioKey = (typeof SCENARIO_KEYS)[number];

// Scenario names in words, with the band fraction they assume, come from the glossary.
export { scenarioLabel };

export interface CashFlowPoint {
  year: number;
  flow: string;
  cumulative: string;
}

export interface CashFlowSeries {
  key: ScenarioKey;
  label: string;
  points: CashFlowPoint[];
}

/** Running sum of a scenario's yearly flows, year 0 (the capex) first, in Decimal. */
export function cumulativeFlows(scenario: Scenario): CashFlowPoint[] {
  let running: Decimal = new Money(0);
  return scenario.cashFlows.map((flow, year) => {
    running = running.plus(flow);
    return { year, flow, cumulative: running.isZero() ? "0" : running.toFixed() };
  });
}

export function cashFlowSeries(
  result: CaseResult,
  input: Pick<ParsedCase, "band"> | null,
): CashFlowSeries[] {
  const band = input?.band ?? DEFAULT_BAND;
  return SCENARIO_KEYS.map((key) => ({
    key,
    label: scenarioLabel(key, band),
    points: cumulativeFlows(result.scenarios[key]),
  }));
}

export interface ScenarioHeadline {
  key: ScenarioKey;
  label: string;
  capex: string;
  npv: string;
  irr: number | null;
  cashFlows: string[];
  paybackYears: number | null;
  discountedPaybackYears: number | null;
  roiPct: number | null;
  /** Drive plus cabinet-cooling energy saved per year, fleet total. */
  energySavedKWhPerYear: number;
  /** Null when the input (and with it the grid factor) is not at hand. */
  co2TonnesPerYear: number | null;
  savingPct: number | null;
  band: BandPosition | null;
  bandText: string;
}

/**
 * The headline figures of each scenario. The band scenarios assume the claimed fraction of
 * today's drive and cooling energy (docs/model.md (The business case)), so their energy and CO₂ follow from the
 * open-loop totals; the physics scenario takes the engine's totals as they are.
 */
export function scenarioHeadlines(
  result: CaseResult,
  input: ParsedCase | null,
): ScenarioHeadline[] {
  const band = input?.band ?? DEFAULT_BAND;
  const openLoopCooling = result.axes.reduce(
    (sum, axis) => sum + axis.quantity * axis.openLoop.coolingKWhPerYear,
    0,
  );
  const openLoopTotal = result.totals.energyOpenLoopKWhPerYear + openLoopCooling;
  const physicsSaved = result.totals.energySavedKWhPerYear + result.totals.coolingSavedKWhPerYear;
  const grid = input?.finance.gridKgCo2PerKWh;

  return SCENARIO_KEYS.map((key) => {
    const scenario = result.scenarios[key];
    const saved =
      key === "physics"
        ? physicsSaved
        : ((key === "bandLow" ? band.lowPct : band.highPct) / 100) * openLoopTotal;
    const savingPct = openLoopTotal > 0 ? (100 * saved) / openLoopTotal : null;
    const co2 =
      key === "physics"
        ? result.totals.co2TonnesPerYear
        : grid === undefined
          ? null
          : (saved * grid) / 1000;
    const position = savingPct === null ? null : bandPosition(savingPct, band);
    return {
      key,
      label: scenarioLabel(key, band),
      capex: result.totals.capex,
      npv: scenario.npv,
      irr: scenario.irr,
      cashFlows: scenario.cashFlows,
      paybackYears: scenario.paybackYears,
      discountedPaybackYears: scenario.discountedPaybackYears,
      roiPct: scenario.roiPct,
      energySavedKWhPerYear: saved,
      co2TonnesPerYear: co2,
      savingPct,
      band: position,
      bandText: bandPositionText(savingPct, band),
    };
  });
}
