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
