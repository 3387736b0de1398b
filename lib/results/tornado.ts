import type { CaseResult, ParsedCase, SensitivityDriver } from "@/lib/engine";
import { Money } from "@/lib/engine/money";
import { DRIVER_LABELS } from "@/lib/glossary";

// The sensitivity drivers in words come from the glossary.
export { DRIVER_LABELS };

export interface TornadoRow {
  driver: SensitivityDriver;
  label: string;
  lowNpv: string;
  highNpv: string;
  /** NPV at the low end minus the physics NPV (Decimal string). */
  lowChange: string;
  highChange: string;
  lowPaybackYears: number | null;
  highPaybackYears: number | null;
}

export interface Tornado {
  baseNpv: string;
  swingPct: number;
  rows: TornadoRow[];
}

const difference = (a: string, b: string) => {
  const d = new Money(a).minus(b);
  return d.isZero() ? "0" : d.toFixed();
};

/**
 * Each driver moved down and up by the swing, as NPV changes around the physics NPV; the
 * engine already sorts the drivers by how far they move the NPV, widest first.
 */
export function tornado(result: CaseResult, input: ParsedCase | null): Tornado {
  const baseNpv = result.scenarios.physics.npv;
  return {
    baseNpv,
    swingPct: input?.sensitivity.swingPct ?? 20,
    rows: result.sensitivity.map((row) => ({
      driver: row.driver,
      label: DRIVER_LABELS[row.driver],
      lowNpv: row.low.npv,
      highNpv: row.high.npv,
      lowChange: difference(row.low.npv, baseNpv),
      highChange: difference(row.high.npv, baseNpv),
      lowPaybackYears: row.low.paybackYears,
      highPaybackYears: row.high.paybackYears,
    })),
  };
}
