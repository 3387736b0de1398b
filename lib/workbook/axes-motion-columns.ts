import {
  DEFAULT_MECHANISM_EFFICIENCY_PCT,
  type MotionResult,
  type ParsedMotion,
} from "@/lib/engine";
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
    header: "Sized from",
    width: 11,
    value: (r) => motionOf(r)?.mechanism ?? "typed duty",
  },
  input("pitchRadius", "Pulley or pinion radius (mm)", FORMATS.pct2, (m) => m.radiusMm),
  input("lead", "Screw lead (mm)", FORMATS.pct2, (m) => m.leadMm),
  input("gearRatio", "Gear ratio (motor turns per shaft turn)", FORMATS.pct2, (m) => m.gearRatio),
  input(
    "mechanismEff",
    "Mechanism efficiency (%)",
    FORMATS.pct,
    (m) => m.efficiencyPct ?? DEFAULT_MECHANISM_EFFICIENCY_PCT[m.mechanism],
  ),
  input("gearEff", "Gear efficiency (%)", FORMATS.pct, (m) => m.gearEfficiencyPct),
  input("mass", "Moving mass (kg)", FORMATS.pct2, (m) => m.massKg),
  input(
    "loadInertia",
    "Load inertia at the shaft (kg·m²)",
    "0.000E+00",
    (m) => m.loadInertiaKgM2,
    12,
  ),
  input("rotorInertia", "Rotor inertia (kg·m²)", "0.000E+00", (m) => m.motorInertiaKgM2, 12),
  input("incline", "Incline (°)", FORMATS.pct, (m) => m.inclineDeg),
  input("friction", "Friction coefficient", FORMATS.physics, (m) => m.frictionCoeff),
  input("processForce", "Process force (N)", FORMATS.pct2, (m) => m.externalForceN),
  input("processTorque", "Process torque (N·m)", FORMATS.physics, (m) => m.externalTorqueNm),
  input("stroke", "Stroke (mm or °)", FORMATS.pct2, (m) => m.stroke),
  input("moveTime", "Move time (s)", FORMATS.physics, (m) => m.moveTimeS),
  input("accelShare", "Accelerating share of a move (%)", FORMATS.pct, (m) => m.accelSharePct),
  input("dwell", "Dwell after a move (s)", FORMATS.physics, (m) => m.dwellTimeS),
  input("returnMove", "Moves back", "@", (m) => (m.returnMove ? "yes" : "no"), 8),
  input("energized", "Cycling share of running hours (%)", FORMATS.pct, (m) => m.energizedPct),
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
