import {
  DEFAULT_MECHANISM_EFFICIENCY_PCT,
  type MotionResult,
  type ParsedMotion,
} from "@/lib/engine";
import { MOTION_FIELDS as M } from "@/lib/fields";
import { sheetHeader } from "./axes-input-columns";
import type { AxisColumn, AxisRowContext } from "./axis-column";
import { FORMATS } from "./formats";

/*
 * The mechanism and move of axes sized from their machine (docs/model.md (Motion from the mechanism)), and what the
 * engine derived from them. The duty columns beside them already show the derived speed,
 * torques and shares; axes with typed duty figures leave these cells empty.
 */

const GROUP = "Mechanism and move";

const motionOf = (r: AxisRowContext): ParsedMotion | undefined => r.axis.duty.motion;
/** A result stored by engine v1 has no motion block. */
const derivedOf = (r: AxisRowContext): MotionResult | null =>
  (r.result as { motion?: MotionResult | null }).motion ?? null;

const input = (
  key: string,
  header: string,
  format: string,
  value: (motion: ParsedMotion) => number | string | null | undefined,
  width = 10,
): AxisColumn => ({
  key,
  group: GROUP,
  header,
  width,
  format,
  value: (r) => {
    const motion = motionOf(r);
    return motion ? (value(motion) ?? null) : null;
  },
});

export const AXIS_MOTION_COLUMNS: readonly AxisColumn[] = [
  {
    key: "mechanism",
    group: GROUP,
    header: "Sized from", // the mechanism, or "typed duty"
    width: 11,
    value: (r) => motionOf(r)?.mechanism ?? "typed duty",
  },
  input("pitchRadius", sheetHeader(M.radiusMm), FORMATS.pct2, (m) => m.radiusMm),
  input("lead", sheetHeader(M.leadMm), FORMATS.pct2, (m) => m.leadMm),
  input(
    "gearRatio",
    sheetHeader(M.gearRatio, "motor turns per shaft turn"),
    FORMATS.pct2,
    (m) => m.gearRatio,
  ),
  input(
    "mechanismEff",
    sheetHeader(M.efficiencyPct),
    FORMATS.pct,
    (m) => m.efficiencyPct ?? DEFAULT_MECHANISM_EFFICIENCY_PCT[m.mechanism],
  ),
  input("gearEff", sheetHeader(M.gearEfficiencyPct), FORMATS.pct, (m) => m.gearEfficiencyPct),
  input("mass", sheetHeader(M.massKg), FORMATS.pct2, (m) => m.massKg),
  input("loadInertia", sheetHeader(M.loadInertiaKgM2), "0.000E+00", (m) => m.loadInertiaKgM2, 12),
  input(
    "rotorInertia",
    sheetHeader(M.motorInertiaKgM2),
    "0.000E+00",
    (m) => m.motorInertiaKgM2,
    12,
  ),
  input("incline", sheetHeader(M.inclineDeg), FORMATS.pct, (m) => m.inclineDeg),
  input("friction", sheetHeader(M.frictionCoeff), FORMATS.physics, (m) => m.frictionCoeff),
  input("processForce", sheetHeader(M.externalForceN), FORMATS.pct2, (m) => m.externalForceN),
  input(
    "processTorque",
    sheetHeader(M.externalTorqueNm),
    FORMATS.physics,
    (m) => m.externalTorqueNm,
  ),
  input("stroke", sheetHeader(M.stroke, "mm or °"), FORMATS.pct2, (m) => m.stroke),
  input("moveTime", sheetHeader(M.moveTimeS), FORMATS.physics, (m) => m.moveTimeS),
  input("accelShare", sheetHeader(M.accelSharePct), FORMATS.pct, (m) => m.accelSharePct),
  input("dwell", sheetHeader(M.dwellTimeS), FORMATS.physics, (m) => m.dwellTimeS),
  input("returnMove", sheetHeader(M.returnMove), "@", (m) => (m.returnMove ? "yes" : "no"), 8),
  input("energized", sheetHeader(M.energizedPct), FORMATS.pct, (m) => m.energizedPct),
  input("maxInertiaRatio", sheetHeader(M.maxInertiaRatio), FORMATS.pct2, (m) => m.maxInertiaRatio),
  {
    key: "mechPower",
    group: GROUP,
    header: "Mean mechanical power while moving (W)",
    width: 12,
    format: FORMATS.pct2,
    value: (r) => derivedOf(r)?.meanMechPowerW ?? null,
  },
  {
    key: "reflectedInertia",
    group: GROUP,
    header: "Load inertia at the motor (kg·m²)",
    width: 12,
    format: "0.000E+00",
    value: (r) => derivedOf(r)?.reflectedInertiaKgM2 ?? null,
  },
  {
    key: "inertiaRatio",
    group: GROUP,
    header: "Load-to-rotor inertia ratio",
    width: 10,
    format: FORMATS.pct2,
    value: (r) => {
      const derived = derivedOf(r);
      if (!derived) return null;
      return derived.inertiaRatio ?? "rotor inertia unknown";
    },
  },
];
