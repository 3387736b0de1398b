import type Decimal from "decimal.js";
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { mersenne } from "pure-rand/generator/mersenne";
import type { PreparedCase } from "@/lib/engine";
import { Money, moneyString } from "@/lib/engine/money";
import {
  UNCERTAINTY_DRIVERS,
  type UncertaintyDriver,
  type UncertaintySettings,
} from "@/lib/validations/dossier";

export const DRAW_COUNT = 1000;
export const PERCENTILES = [10, 50, 90] as const;

export interface Draw {
  /** Each driver's change in % of the case's value, rounded to 1e-4 % — the value used. */
  pct: Record<UncertaintyDriver, number>;
  npv: string;
  paybackYears: number | null;
}

export interface Percentile {
  p: (typeof PERCENTILES)[number];
  npv: string;
  /** null: the payback at this rank lies beyond the horizon. */
  paybackYears: number | null;
}

export interface UncertaintyResult {
  seed: number;
  generator: string;
  draws: Draw[];
  ranges: Omit<UncertaintySettings, "seed">;
  percentiles: Percentile[];
  drawsWithoutPayback: number;
}

/** Nearest rank, Hyndman & Fan (1996) definition 1: the smallest value with at least p % at or below it. */
export function nearestRank(p: number, count: number): number {
  return Math.max(1, Math.ceil((p / 100) * count));
}

const round4 = (x: number) => Math.round(x * 1e4) / 1e4;

/**
 * 1,000 draws of the four drivers, each independent and uniform within its range, from the
 * Mersenne Twister MT19937 seeded with the recorded seed (pure-rand; its seeding mixes small
 * seeds well, where xoroshiro128+'s first outputs stay near 1), in a fixed order per draw: tariff,
 * hours, load, step-loss events. Every draw is the engine's physics scenario with those four
 * factors applied together (PreparedCase.at): the load re-solves every axis's closed loop, the
 * others scale the linear terms of docs/model.md (Energy and cooling) and §8.
 */
export function runUncertainty(
  prepared: PreparedCase,
  settings: UncertaintySettings,
  count = DRAW_COUNT,
): UncertaintyResult {
  const rng = mersenne(settings.seed);
  const draws: Draw[] = [];
  const npvs: Decimal[] = [];
  for (let i = 0; i < count; i++) {
    const pct = {} as Record<UncertaintyDriver, number>;
    const factors: Partial<Record<UncertaintyDriver, Decimal>> = {};
    for (const driver of UNCERTAINTY_DRIVERS) {
      const { lowPct, highPct } = settings[driver];
      const value = round4(lowPct + uniformFloat64(rng) * (highPct - lowPct));
      pct[driver] = value;
      factors[driver] = new Money(value).div(100).plus(1);
    }
    const outcome = prepared.at(factors);
    npvs.push(outcome.npv);
    draws.push({ pct, npv: moneyString(outcome.npv), paybackYears: outcome.paybackYears });
  }

  const byNpv = npvs.map((v, i) => ({ v, i })).sort((a, b) => a.v.comparedTo(b.v) || a.i - b.i);
  // A payback beyond the horizon ranks after every payback reached.
  const paybacks = draws.map((d) => d.paybackYears ?? Infinity).sort((a, b) => a - b);
  const percentiles = PERCENTILES.map((p) => {
    const k = nearestRank(p, count) - 1;
    const payback = paybacks[k];
    return {
      p,
      npv: moneyString(byNpv[k].v),
      paybackYears: Number.isFinite(payback) ? payback : null,
    };
  });
  const { seed, ...ranges } = settings;
  return {
    seed,
    generator: "MT19937 (pure-rand 8.4.2, uniformFloat64), uniform draws, nearest-rank percentiles",
    draws,
    ranges,
    percentiles,
    drawsWithoutPayback: draws.filter((d) => d.paybackYears === null).length,
  };
}
