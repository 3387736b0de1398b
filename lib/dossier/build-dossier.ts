import {
  prepareCase,
  resultOf,
  sensitivityOf,
  type CaseResult,
  type ParsedCase,
  type SensitivityRow,
} from "@/lib/engine";
import type { UncertaintySettings } from "@/lib/validations/dossier";
import { axisDetail, type AxisDetail } from "./axis-detail";
import { monthlyCashFlow, type MonthlyCashFlow } from "./monthly";
import { paybackGrid, type PaybackGrid } from "./payback-grid";
import { runUncertainty, type UncertaintyResult } from "./uncertainty";

export const DOSSIER_SWINGS_PCT = [10, 20, 30] as const;

/** Everything the dossier adds to a proposal, all computed by the engine from the frozen input. */
export interface Dossier {
  result: CaseResult;
  monthly: MonthlyCashFlow;
  paybackGrid: PaybackGrid;
  sensitivity: { swingPct: number; rows: SensitivityRow[] }[];
  axes: AxisDetail[];
  uncertainty: UncertaintyResult;
}

/**
 * Builds the dossier of a case: its physics evaluated once (prepareCase), the CaseResult the
 * proposal workbook shows, then the months, the tariff × hours table, the sensitivity at three
 * swings, the per-axis detail and the seeded draws — each a recomputation of the same physics
 * scenario with changed drivers. Pure: the same input and settings give the same dossier.
 */
export function buildDossier(input: ParsedCase, settings: UncertaintySettings): Dossier {
  const prepared = prepareCase(input);
  const result = resultOf(prepared);
  return {
    result,
    monthly: monthlyCashFlow(result.scenarios.physics.cashFlows),
    paybackGrid: paybackGrid(prepared),
    sensitivity: DOSSIER_SWINGS_PCT.map((swingPct) => ({
      swingPct,
      rows: sensitivityOf(prepared, swingPct),
    })),
    axes: input.axes.map((axis, i) => axisDetail(input, axis, result.axes[i])),
    uncertainty: runUncertainty(prepared, settings),
  };
}
