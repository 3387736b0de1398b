import type { ParsedMotor } from "./schema";

/** Temperature coefficient of annealed copper at 20 °C (IACS, IEC 60028). */
export const COPPER_ALPHA_PER_K = 0.00393;

/** Insulation class limits, °C (IEC 60085, Table 1). */
export const INSULATION_CLASS_LIMIT_C = { B: 130, F: 155, H: 180 } as const;

export type StepMode = "full" | "half" | "half-compensated" | "micro";

/**
 * Current-vector magnitude at standstill per unit of per-phase setting (docs/model.md (Torque at speed)): two
 * phases on in full step give √2·I; an uncompensated half step rests on its weaker, one-phase
 * step.
 */
export function holdVectorFactor(mode: StepMode): number {
  return mode === "full" ? Math.SQRT2 : 1;
}

/**
 * Current-vector magnitude while running per unit of setting: the amplitude of the fundamental
 * of the stepped current (Fourier series of the quasi-square or staircase wave): full step
 * (4/π)·I, half step (4/π)·sin 67.5°·I, compensated half step (8/π)·sin 22.5°·I, microstep I.
 */
export function runVectorFactor(mode: StepMode): number {
  switch (mode) {
    case "full":
      return 4 / Math.PI;
    case "half":
      return (4 / Math.PI) * Math.sin((67.5 * Math.PI) / 180);
    case "half-compensated":
      return (8 / Math.PI) * Math.sin((22.5 * Math.PI) / 180);
    case "micro":
      return 1;
  }
}

/** docs/model.md (Torque at speed) table: copper loss per I²·R of the per-phase setting. */
export function copperFactor(mode: StepMode): number {
  switch (mode) {
    case "full":
      return 2;
    case "half":
      return 1.5;
    case "half-compensated":
    case "micro":
      return 1;
  }
}

type StepGeometry = {
  stepAngleDeg: number;
  stepsPerRev: number;
  resolutionDeg: number;
  electricalCycleDeg: number;
};
const geometries = new Map<string, StepGeometry>();

/**
 * Full step θ_s = 90°/Nr and the angles that follow from it (docs/model.md (Torque at speed)). Fleets repeat a
 * few motors and modes on thousands of axes, so each combination is worked out once and its
 * (frozen) object shared by every axis that has it.
 */
export function stepGeometry(rotorTeeth: number, mode: StepMode, microsteps: number): StepGeometry {
  const key = `${rotorTeeth}/${mode}/${microsteps}`;
  let geometry = geometries.get(key);
  if (geometry === undefined) {
    geometry = Object.freeze(computeStepGeometry(rotorTeeth, mode, microsteps));
    if (geometries.size > 1024) geometries.clear();
    geometries.set(key, geometry);
  }
  return geometry;
}

function computeStepGeometry(rotorTeeth: number, mode: StepMode, microsteps: number) {
  const stepAngleDeg = 90 / rotorTeeth;
  const resolutionDeg =
    mode === "full"
      ? stepAngleDeg
      : mode === "micro"
        ? stepAngleDeg / microsteps
        : stepAngleDeg / 2;
  return {
    stepAngleDeg,
    stepsPerRev: 4 * rotorTeeth,
    resolutionDeg,
    electricalCycleDeg: 360 / rotorTeeth,
  };
}

/** Microstep currents of phase A and B at microstep index i of k per full step (sin/cos). */
export function microstepCurrents(index: number, microsteps: number): { a: number; b: number } {
  const angle = (index * Math.PI) / (2 * microsteps);
  return { a: Math.sin(angle), b: Math.cos(angle) };
}

/** k1 = T_H / (√2·I_R): the datasheet holding torque has two phases on at rated current. */
export function torqueConstant(motor: ParsedMotor): number {
  return motor.holdingTorqueNm / (Math.SQRT2 * motor.ratedCurrentA);
}

export function resistanceAt(r20: number, tempC: number): number {
  return r20 * (1 + COPPER_ALPHA_PER_K * (tempC - 20));
}

export const electricalHz = (rotorTeeth: number, rpm: number): number => (rotorTeeth * rpm) / 60;

/** P_fe = kh·f_e + ke·f_e². */
export function ironLossW(motor: ParsedMotor, rpm: number): number {
  const fe = electricalHz(motor.rotorTeeth, rpm);
  return motor.hysteresisWPerHz * fe + motor.eddyWPerHz2 * fe * fe;
}

/**
 * T_drag = P_fe/ω_m for n > 0, 0 at standstill. At a speed so small (10^-320 rpm) that ω_m
 * underflows to 0 the quotient would be 0/0; its limit there is the hysteresis drag
 * N_r·k_h/(2π), since P_fe/ω_m = N_r·(k_h + k_e·f_e)/(2π).
 */
export function dragTorqueNm(motor: ParsedMotor, rpm: number): number {
  if (rpm <= 0) return 0;
  const omega = (2 * Math.PI * rpm) / 60;
  if (omega === 0) return (motor.rotorTeeth * motor.hysteresisWPerHz) / (2 * Math.PI);
  return ironLossW(motor, rpm) / omega;
}
