import { torqueSpeedCurve, type ParsedAxis, type ParsedMargins } from "@/lib/engine";
import type { CurvePoint } from "@/lib/engine/curves";

export interface TorqueSpeedView {
  axisId: string;
  /** Torque capability of each loop; the open loop may stop where its datasheet curve ends. */
  open: CurvePoint[];
  closed: CurvePoint[];
  /** Capability less the required margin: T·(1 − required/100), docs/model.md (Torque margin and speed). */
  openUsable: CurvePoint[];
  closedUsable: CurvePoint[];
  operatingPoint: { speedRpm: number; peakTorqueNm: number };
  openRequiredPct: number;
  closedRequiredPct: number;
  /** Right end of the speed axis: where both loops have run out of torque, rounded up. */
  maxRpm: number;
}

// Fine enough that the corner where the drive runs out of voltage reads as a bend, not a kink.
const SAMPLES = 241;
// With field weakening the torque falls off slowly and seldom reaches 0 below 6000 rpm: the
// chart ends where both loops keep less than a tenth of their standstill torque.
const MIN_TORQUE_FRACTION = 0.1;

const usable = (curve: CurvePoint[], requiredPct: number): CurvePoint[] =>
  curve.map((p) => ({ rpm: p.rpm, torqueNm: p.torqueNm * (1 - requiredPct / 100) }));

/** The smallest step of 1, 2.5 or 5 × 10^k rpm that divides the range into at most eight. */
function niceStep(rpm: number): number {
  const raw = rpm / 8;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  return [1, 2.5, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ?? raw;
}

const niceCeil = (rpm: number) => Math.ceil(rpm / niceStep(rpm)) * niceStep(rpm);

/** Last speed at which the curve still carries a visible share of its standstill torque. */
function lastUsefulRpm(curve: CurvePoint[]): number {
  const floor = (curve[0]?.torqueNm ?? 0) * MIN_TORQUE_FRACTION;
  let last = 0;
  for (const p of curve) if (p.torqueNm > floor) last = p.rpm;
  return last;
}

/**
 * Chart series of one axis: both loops' capability, their usable-torque lines and the
 * operating point (speed while moving, peak torque). The speed axis is cut where both curves
 * have fallen to nothing, so that 6000 rpm of zeros does not squash the part that matters.
 */
export function torqueSpeedView(
  axis: ParsedAxis,
  margins: ParsedMargins,
  // An axis sized from its mechanism (docs/model.md (Motion from the mechanism)) has its speed and peak in the result only.
  derived?: { speedRpm: number; peakTorqueNm: number } | null,
): TorqueSpeedView {
  const openFull = torqueSpeedCurve(axis, "open", SAMPLES);
  const closedFull = torqueSpeedCurve(axis, "closed", SAMPLES);
  const speedRpm = derived?.speedRpm ?? axis.duty.speedRpm ?? 0;
  const peakTorqueNm = derived?.peakTorqueNm ?? axis.duty.peakTorqueNm ?? 0;
  const wanted = Math.max(
    lastUsefulRpm(openFull),
    lastUsefulRpm(closedFull),
    speedRpm * 1.25,
    // A datasheet curve is shown to its last measured point.
    axis.motor.pullOutCurve ? (openFull[openFull.length - 1]?.rpm ?? 0) : 0,
  );
  const closedEnd = closedFull[closedFull.length - 1]?.rpm ?? wanted;
  // The operating point always stays on the chart, even beyond the 6000 rpm the curves cover.
  const maxRpm = Math.max(Math.min(closedEnd, niceCeil(Math.max(wanted, 1))), speedRpm);
  const clip = (curve: CurvePoint[]) => curve.filter((p) => p.rpm <= maxRpm + 1e-9);
  const open = clip(openFull);
  const closed = clip(closedFull);
  return {
    axisId: axis.id,
    open,
    closed,
    openUsable: usable(open, margins.openLoopRequiredPct),
    closedUsable: usable(closed, margins.closedLoopRequiredPct),
    operatingPoint: { speedRpm, peakTorqueNm },
    openRequiredPct: margins.openLoopRequiredPct,
    closedRequiredPct: margins.closedLoopRequiredPct,
    maxRpm,
  };
}

export interface TorqueSpeedTableRow {
  rpm: number;
  /** Null beyond the end of a datasheet curve, where nothing was measured. */
  open: number | null;
  openUsable: number | null;
  closed: number | null;
  closedUsable: number | null;
}

/** Linear interpolation between samples; null outside the sampled range. */
function valueAt(curve: CurvePoint[], rpm: number): number | null {
  if (curve.length === 0) return null;
  const last = curve[curve.length - 1];
  if (rpm < curve[0].rpm - 1e-9 || rpm > last.rpm + 1e-9) return null;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1];
    const b = curve[i];
    if (rpm <= b.rpm + 1e-9) {
      const span = b.rpm - a.rpm;
      return span <= 0
        ? b.torqueNm
        : a.torqueNm + ((rpm - a.rpm) / span) * (b.torqueNm - a.torqueNm);
    }
  }
  return last.torqueNm;
}

/** The chart's curves at round speeds (half the tick step), plus the operating speed. */
export function torqueSpeedTable(view: TorqueSpeedView): TorqueSpeedTableRow[] {
  const step = niceStep(Math.max(view.maxRpm, 1)) / 2;
  const speeds = new Set<number>();
  for (let rpm = 0; rpm <= view.maxRpm + 1e-9; rpm += step) speeds.add(Math.round(rpm * 100) / 100);
  speeds.add(view.operatingPoint.speedRpm);
  return [...speeds]
    .sort((a, b) => a - b)
    .map((rpm) => ({
      rpm,
      open: valueAt(view.open, rpm),
      openUsable: valueAt(view.openUsable, rpm),
      closed: valueAt(view.closed, rpm),
      closedUsable: valueAt(view.closedUsable, rpm),
    }));
}
