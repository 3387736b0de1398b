/**
 * Torque units accepted at the input boundary, with their factor to N·m.
 * Factors: NIST SP 811 (2008), Appendix B.9 — ozf·in 7.061 552 E−03, lbf·in 1.129 848 E−01,
 * lbf·ft 1.355 818 E+00; kgf·cm = 9.806 65 E−02 (kgf·m 9.806 65, exact).
 */
export const TORQUE_FACTORS_TO_NM = {
  "N·m": 1,
  "mN·m": 1e-3,
  "ozf·in": 7.061552e-3,
  "lbf·in": 1.129848e-1,
  "lbf·ft": 1.355818,
  "kgf·cm": 9.80665e-2,
} as const;

export type TorqueUnit = keyof typeof TORQUE_FACTORS_TO_NM;

/** Spellings seen in datasheets and spreadsheets, mapped to the canonical unit. */
const TORQUE_ALIASES: Record<string, TorqueUnit> = {
  "N·m": "N·m",
  "N.m": "N·m",
  Nm: "N·m",
  "N-m": "N·m",
  "mN·m": "mN·m",
  "mN.m": "mN·m",
  mNm: "mN·m",
  "mN-m": "mN·m",
  "ozf·in": "ozf·in",
  "ozf.in": "ozf·in",
  "ozf-in": "ozf·in",
  ozfin: "ozf·in",
  "oz·in": "ozf·in",
  "oz.in": "ozf·in",
  "oz-in": "ozf·in",
  ozin: "ozf·in",
  "lbf·in": "lbf·in",
  "lbf.in": "lbf·in",
  "lbf-in": "lbf·in",
  "lb·in": "lbf·in",
  "lb-in": "lbf·in",
  "lbf·ft": "lbf·ft",
  "lbf.ft": "lbf·ft",
  "lbf-ft": "lbf·ft",
  "lb·ft": "lbf·ft",
  "lb-ft": "lbf·ft",
  "kgf·cm": "kgf·cm",
  "kgf.cm": "kgf·cm",
  "kgf-cm": "kgf·cm",
  "kg·cm": "kgf·cm",
  "kg-cm": "kgf·cm",
};

export const TORQUE_UNIT_NAMES = Object.keys(TORQUE_FACTORS_TO_NM) as TorqueUnit[];

/** The canonical unit for a spelling, or undefined when the unit is not a torque unit we know. */
export function canonicalTorqueUnit(unit: string): TorqueUnit | undefined {
  // "⋅" (dot operator) and "*" are common stand-ins for the middle dot.
  return TORQUE_ALIASES[unit.trim().replace(/[⋅*]/g, "·")];
}

export function torqueToNm(value: number, unit: TorqueUnit): number {
  return value * TORQUE_FACTORS_TO_NM[unit];
}

export const rpmToRadPerS = (rpm: number): number => (2 * Math.PI * rpm) / 60;

/**
 * Moment-of-inertia units accepted at the input boundary, with their factor to kg·m².
 * NIST SP 811 (2008), Appendix B.9: lb·in² 2.926 397 E−04, lb·ft² 4.214 011 E−02,
 * ozf·in·s² 7.061 552 E−03; oz·in² 1.828 997 E−05 (from the definitions of the ounce-mass and
 * the inch); kg·cm² 1 E−04 and g·cm² 1 E−07 exactly.
 */
export const INERTIA_FACTORS_TO_KG_M2 = {
  "kg·m²": 1,
  "kg·cm²": 1e-4,
  "g·cm²": 1e-7,
  "ozf·in·s²": 7.061552e-3,
  "lb·in²": 2.926397e-4,
  "lb·ft²": 4.214011e-2,
  "oz·in²": 1.828997e-5,
} as const;

export type InertiaUnit = keyof typeof INERTIA_FACTORS_TO_KG_M2;
export const INERTIA_UNIT_NAMES = Object.keys(INERTIA_FACTORS_TO_KG_M2) as InertiaUnit[];

/** Spellings with ASCII stand-ins ("kg.cm^2", "kgcm2", "oz-in-s^2") mapped to the canonical unit. */
export function canonicalInertiaUnit(unit: string): InertiaUnit | undefined {
  const key = unit
    .trim()
    .toLowerCase()
    .replace(/[·⋅*.\-\s]/g, "")
    .replace(/\^?2|²/g, "2");
  const byKey: Record<string, InertiaUnit> = {
    kgm2: "kg·m²",
    kgcm2: "kg·cm²",
    gcm2: "g·cm²",
    ozfins2: "ozf·in·s²",
    ozins2: "ozf·in·s²",
    lbin2: "lb·in²",
    lbmin2: "lb·in²",
    lbft2: "lb·ft²",
    lbmft2: "lb·ft²",
    ozin2: "oz·in²",
    ozmin2: "oz·in²",
  };
  return byKey[key];
}

export function inertiaToKgM2(value: number, unit: InertiaUnit): number {
  return value * INERTIA_FACTORS_TO_KG_M2[unit];
}

/** Standard acceleration of gravity, m/s² (exact by definition: CGPM 1901, NIST SP 330). */
export const STANDARD_GRAVITY = 9.80665;
