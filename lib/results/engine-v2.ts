import Decimal from "decimal.js";
import {
  VALUE_SOURCES,
  type AxisResult,
  type CaseResult,
  type MotionResult,
  type PaybackStatus,
  type Scenario,
  type ValueSource,
} from "@/lib/engine";
import { Money, roundMoney } from "@/lib/engine/money";
import { formatNumber, formatPayback } from "./format";

/**
 * The figures engine 2 adds to a result, read defensively: a proposal frozen under engine 1.0.0
 * keeps its stored result, which has none of them, and must still render — so each section asks
 * here whether its figures exist and hides itself when they do not.
 */

/** Stored results are JSON from older engines; their v2 fields may be missing altogether. */
type Stored<T> = { [K in keyof T]?: T[K] };

export function hasBreakEven(result: CaseResult): boolean {
  const breakEven = (result as Stored<CaseResult>).breakEven;
  return breakEven !== undefined && breakEven !== null;
}

export function hasValueBySource(scenario: Scenario): boolean {
  const bySource = (scenario as Stored<Scenario>).bySource;
  return bySource !== undefined && bySource !== null;
}

/** The axis's motion block, or null when it has none or the result predates it. */
export function axisMotion(axis: AxisResult): MotionResult | null {
  return (axis as Stored<AxisResult>).motion ?? null;
}

/** What today's drive holds at standstill, or null when the result predates the figure. */
export function holdingCapability(axis: AxisResult): number | null {
  const value = (axis.openLoop as { holdingCapabilityNm?: number }).holdingCapabilityNm;
  return typeof value === "number" ? value : null;
}

export function hasHoldingCapability(result: CaseResult): boolean {
  return result.axes.some((axis) => holdingCapability(axis) !== null);
}

// ---------------------------------------------------------------- payback

const PAYBACK_STATUS_WORDS: Record<PaybackStatus, string> = {
  reached: "within the horizon",
  "beyond-horizon": "after the horizon",
  never: "never",
};

/** The status in plain words; older results without it read from the payback itself. */
export function paybackStatusWords(scenario: Scenario): string {
  const status = (scenario as Stored<Scenario>).paybackStatus;
  if (status) return PAYBACK_STATUS_WORDS[status];
  return scenario.paybackYears === null ? "not within the horizon" : "within the horizon";
}

/**
 * The payback as a reader wants it: when it comes, and whether that is inside the horizon.
 * "1 year 2 months, within the horizon" · "after the 5-year horizon: the last year still adds money"
 * · "never: the yearly flows do not cover the outlay".
 */
export function paybackSentence(scenario: Scenario, horizonYears: number): string {
  const status = (scenario as Stored<Scenario>).paybackStatus;
  if (scenario.paybackYears !== null) {
    return `${formatPayback(scenario.paybackYears)}, within the horizon`;
  }
  if (status === "beyond-horizon") {
    return `after the ${horizonYears}-year horizon: the yearly flow is still positive at its end`;
  }
  if (status === "never") {
    return "never: the yearly flow is not positive by the end of the horizon";
  }
  return formatPayback(null, horizonYears);
}

/** The payback for a headline figure: "1 year 2 months", "after the 5-year horizon", "never". */
export function paybackShort(scenario: Scenario, horizonYears: number): string {
  if (scenario.paybackYears !== null) return formatPayback(scenario.paybackYears);
  const status = (scenario as Stored<Scenario>).paybackStatus;
  if (status === "beyond-horizon") return `after the ${horizonYears}-year horizon`;
  if (status === "never") return "never";
  return formatPayback(null, horizonYears);
}

/** A clause for a page's lead line: "paid back in 1 year 2 months as modelled". */
export function paybackLead(scenario: Scenario, horizonYears: number): string {
  if (scenario.paybackYears !== null) {
    const when = formatPayback(scenario.paybackYears);
    return when === "immediate"
      ? "paid back at once as modelled"
      : `paid back in ${when} as modelled`;
  }
  const status = (scenario as Stored<Scenario>).paybackStatus;
  if (status === "beyond-horizon")
    return `paid back after the ${horizonYears}-year horizon as modelled`;
  if (status === "never") return "never paid back as modelled";
  return `not paid back within ${horizonYears} years as modelled`;
}

// ---------------------------------------------------------------- break-even

/** A tariff to four decimals, enough for cents per kWh to read as a price. */
export function formatTariff(amount: string, currency: string): string {
  const rounded = new Money(amount).toDecimalPlaces(4, Decimal.ROUND_HALF_EVEN);
  const format = new Intl.NumberFormat("en-GB", {
    style: "currency",
    currency,
    minimumFractionDigits: 2,
    maximumFractionDigits: 4,
  });
  return `${(format.format as unknown as (value: string) => string)(rounded.toFixed())}/kWh`;
}

export interface BreakEvenLine {
  /** "Electricity tariff" / "Step-loss events". */
  term: string;
  /** The value, or the reason there is none. */
  value: string;
  /** One sentence on what it means. */
  note: string;
}

const positive = (amount: string) => new Money(amount).greaterThan(0);

/**
 * The two break-even values of docs/model.md (The business case) in words. The engine returns null both when the NPV
 * does not rise with the driver and when the answer would be negative; the two read very
 * differently, so the slope is read from the case: the tariff moves the NPV only through the
 * energy saved, the lost-step factor only through the value of avoided events.
 */
export function breakEvenLines(
  result: CaseResult,
  todayTariffPerKWh: string | null,
): BreakEvenLine[] | null {
  if (!hasBreakEven(result)) return null;
  const { tariffPerKWh, stepLossFactor } = result.breakEven;
  const npvPositive = !new Money(result.scenarios.physics.npv).isNegative();
  const energySaved = result.totals.energySavedKWhPerYear + result.totals.coolingSavedKWhPerYear;
  const today = todayTariffPerKWh
    ? ` Today's tariff is ${formatTariff(todayTariffPerKWh, result.currency)}.`
    : "";

  let tariff: BreakEvenLine;
  if (tariffPerKWh !== null) {
    tariff = {
      term: "Electricity tariff",
      value: `breaks even at ${formatTariff(tariffPerKWh, result.currency)}`,
      note: `Below this tariff the net present value turns negative.${today}`,
    };
  } else if (energySaved > 0) {
    tariff = {
      term: "Electricity tariff",
      value: "pays back even with free energy",
      note: `The other savings alone repay the investment, so no tariff brings the net present value below zero.${today}`,
    };
  } else {
    tariff = {
      term: "Electricity tariff",
      value: "no break-even tariff",
      note: npvPositive
        ? "The closed loop saves no energy on these axes, so the tariff does not move the net present value; it is positive whatever the tariff."
        : "The closed loop saves no energy on these axes, so a higher tariff does not help; no tariff makes the case pay back.",
    };
  }

  let events: BreakEvenLine;
  const eventsValued = positive(result.totals.reliabilityPerYear);
  if (stepLossFactor !== null && stepLossFactor > 0) {
    events = {
      term: "Step-loss events",
      value: `breaks even at ${formatFactor(stepLossFactor)} the step-loss events entered`,
      note:
        stepLossFactor <= 1
          ? "The case pays back as long as at least this share of the step-loss events entered is really avoided."
          : "The case pays back only if there are this many times more step-loss events than entered.",
    };
  } else if (eventsValued) {
    events = {
      term: "Step-loss events",
      value: "pays back without any avoided step-loss events",
      note: "The net present value is positive even when no step-loss event is avoided; the avoided events add to it.",
    };
  } else {
    events = {
      term: "Step-loss events",
      value: "no break-even count",
      note: npvPositive
        ? "No avoided step-loss events are counted for this case, and it pays back without them."
        : "No avoided step-loss events are counted for this case (none entered, or none the kits can avoid), so they cannot make it pay back.",
    };
  }
  return [tariff, events];
}

/** "0.3×", "0.25×", "2.4×": two significant figures are as much as the input supports. */
export function formatFactor(factor: number): string {
  const digits = factor >= 10 ? 0 : factor >= 1 ? 1 : 2;
  const text = formatNumber(factor, digits)
    .replace(/(\.\d*?)0+$/, "$1")
    .replace(/\.$/, "");
  return `${text}×`;
}

// ---------------------------------------------------------------- value by source

export const VALUE_SOURCE_LABELS: Record<ValueSource, string> = {
  energy: "Drive energy",
  cooling: "Cabinet cooling",
  reliability: "Step-loss events avoided",
  maintenance: "Maintenance",
  throughput: "Added output",
  service: "Service of the closed loop",
  tax: "Tax",
};

export interface ValueSourceRow {
  source: ValueSource;
  label: string;
  /** Years 1..N, as decimal strings rounded to the currency's minor unit. */
  years: string[];
  total: string;
}

/**
 * The physics scenario's yearly flows split by where the money comes from, with the sum of each
 * row; the rows add up to the cash flows (docs/model.md (The business case)), which the last row states for checking.
 * Rows that are zero in every year are left out, so a case without tax shows no tax row.
 */
export function valueBySource(
  scenario: Scenario,
  currency: string,
): { rows: ValueSourceRow[]; flows: ValueSourceRow | null } | null {
  if (!hasValueBySource(scenario)) return null;
  const rows: ValueSourceRow[] = [];
  for (const source of VALUE_SOURCES) {
    const years = scenario.bySource[source] ?? [];
    if (years.every((y) => new Money(y).isZero())) continue;
    rows.push({
      source,
      label: VALUE_SOURCE_LABELS[source],
      years: years.map((y) => roundMoney(y, currency)),
      total: roundMoney(sum(years), currency),
    });
  }
  const yearly = scenario.cashFlows.slice(1);
  return {
    rows,
    flows:
      yearly.length > 0
        ? {
            source: "energy",
            label: "Cash flow of the year",
            years: yearly.map((y) => roundMoney(y, currency)),
            total: roundMoney(sum(yearly), currency),
          }
        : null,
  };
}

const sum = (values: readonly string[]) =>
  values.reduce((acc, v) => acc.plus(v), new Money(0) as Decimal).toFixed();

// ---------------------------------------------------------------- motion

export interface MotionRow {
  axisId: string;
  speedRpm: number;
  loadTorqueNm: number;
  peakTorqueNm: number;
  holdTorqueNm: number;
  meanMechPowerW: number;
  movePct: number;
  holdPct: number;
  reflectedInertiaKgM2: number;
  inertiaRatio: number | null;
  /** "12 : 1", or why there is no ratio. */
  inertiaRatioText: string;
}

/** The axes whose duty came from their mechanism and move (docs/model.md (Motion from the mechanism)), as the engine used it. */
export function motionRows(result: CaseResult): MotionRow[] {
  const rows: MotionRow[] = [];
  for (const axis of result.axes) {
    const motion = axisMotion(axis);
    if (!motion) continue;
    rows.push({
      axisId: axis.id,
      ...motion,
      inertiaRatioText:
        motion.inertiaRatio === null
          ? "rotor inertia not given"
          : `${formatNumber(motion.inertiaRatio, motion.inertiaRatio < 10 ? 1 : 0)} : 1`,
    });
  }
  return rows;
}

/** "2.53 × 10⁻⁵ kg·m²": inertias of small axes span decades, so they read in powers of ten. */
export function formatInertia(value: number): string {
  if (value === 0) return "0 kg·m²";
  if (Math.abs(value) >= 0.1 && Math.abs(value) < 100) return `${formatNumber(value, 3)} kg·m²`;
  let exponent = Math.floor(Math.log10(Math.abs(value)));
  let mantissa = Number((value / 10 ** exponent).toFixed(2));
  // 9.996·10⁻⁵ rounds to 10.00: carry it into the exponent.
  if (Math.abs(mantissa) >= 10) {
    mantissa /= 10;
    exponent += 1;
  }
  const superscript = String(exponent)
    .replace("-", "⁻")
    .replace(/\d/g, (d) => "⁰¹²³⁴⁵⁶⁷⁸⁹"[Number(d)]);
  return `${formatNumber(mantissa, 2)} × 10${superscript} kg·m²`;
}

// ---------------------------------------------------------------- holding

export interface HoldingView {
  /** What today's drive holds at its idle current (docs/model.md (Torque margin and speed)). */
  capabilityNm: number;
  /** The load at standstill, when the axis carries one (null also while the input is unknown). */
  loadNm: number | null;
  /** Whether the load is known: from the motion block or the entered duty. */
  loadKnown: boolean;
  slips: boolean;
}

/**
 * Holding at standstill for one axis, or null when the result predates the figure. The load is
 * the motion block's when there is one, else the duty's as entered.
 */
export function holdingView(axis: AxisResult, enteredHoldNm: number | null): HoldingView | null {
  const capabilityNm = holdingCapability(axis);
  if (capabilityNm === null) return null;
  const load = axisMotion(axis)?.holdTorqueNm ?? enteredHoldNm;
  return {
    capabilityNm,
    loadNm: load !== null && load > 0 ? load : null,
    loadKnown: load !== null,
    slips: axis.warnings.includes("OL_HOLD_SLIPS"),
  };
}
