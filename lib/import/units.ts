import {
  canonicalInertiaUnit,
  canonicalTorqueUnit,
  INERTIA_FACTORS_TO_KG_M2,
  INERTIA_UNIT_NAMES,
  TORQUE_FACTORS_TO_NM,
  TORQUE_UNIT_NAMES,
} from "@/lib/engine/units";
import type { ImportField, QuantityKind } from "./fields";

/** SI (stored) unit of each convertible quantity; inductance is stored in mH, speed in rpm. */
export const SI_UNITS = {
  torque: "N·m",
  inductance: "mH",
  speed: "rpm",
  inertia: "kg·m²",
} as const;

/** 1 H = 1000 mH: the prefix milli is 10⁻³ (NIST SP 811, ch. 4, SI prefixes). */
export const INDUCTANCE_FACTORS_TO_MH = { mH: 1, H: 1000 } as const;

/** 1 rev/s = 60 rpm: 1 min = 60 s (NIST SP 811, ch. 5, units accepted for use with the SI). */
export const SPEED_FACTORS_TO_RPM = { rpm: 1, "rev/s": 60 } as const;

/** Spellings of the inductance and speed units, lower-cased with spaces removed. */
const INDUCTANCE_ALIASES: Record<string, keyof typeof INDUCTANCE_FACTORS_TO_MH> = {
  mh: "mH",
  h: "H",
};
const SPEED_ALIASES: Record<string, keyof typeof SPEED_FACTORS_TO_RPM> = {
  rpm: "rpm",
  "r/min": "rpm",
  "rev/min": "rpm",
  "1/min": "rpm",
  "min⁻¹": "rpm",
  "min-1": "rpm",
  "rev/s": "rev/s",
  "r/s": "rev/s",
  rps: "rev/s",
  "1/s": "rev/s",
};

/**
 * ASCII and look-alike spellings of the fixed units of "none" fields, lower-cased with spaces
 * removed: a CSV saved in a legacy code page loses "Ω", "²" and "°", so plain spellings count too.
 */
const FIXED_ALIASES: Record<string, readonly string[]> = {
  A: ["a", "amp", "amps", "ampere", "amperes"],
  Ω: ["ω", "Ω", "ohm", "ohms"],
  "K/W": ["k/w"],
  K: ["k", "kelvin"],
  "W/Hz": ["w/hz"],
  "W/Hz²": ["w/hz²", "w/hz^2", "w/hz2"],
  V: ["v", "volt", "volts"],
  "%": ["%", "percent", "pct"],
  h: ["h", "hours", "h/year", "h/yr", "hours/year"],
  "°C": ["°c", "℃", "degc", "c", "ºc"],
  W: ["w", "watt", "watts"],
  mm: ["mm", "millimetre", "millimetres", "millimeter", "millimeters"],
  kg: ["kg", "kilogram", "kilograms"],
  "°": ["°", "º", "deg", "degree", "degrees"],
  N: ["n", "newton", "newtons"],
  s: ["s", "sec", "second", "seconds"],
  min: ["min", "minute", "minutes"],
};

/** A unit a column is read in, and its factor to the field's SI unit. */
export interface ColumnUnit {
  unit: string;
  factor: number;
}

/**
 * Header text `Label [unit]` (or `Label (unit)`) split into its label and unit.
 * A header without a trailing bracket has no unit; empty brackets count as no unit.
 */
export function splitHeader(header: string): { label: string; unit: string | null } {
  const match = /^(.*?)\s*[[(]([^[\]()]*)[\])]\s*$/.exec(header);
  if (match === null) return { label: header.trim(), unit: null };
  const unit = match[2].trim();
  return { label: match[1].trim(), unit: unit === "" ? null : unit };
}

const squash = (unit: string): string => unit.trim().toLowerCase().replace(/\s+/g, "");

/**
 * The unit `unitText` names for `field`, with its factor to the field's SI unit, or undefined
 * when it is not a unit of that quantity. Without a unit the column is in the SI unit.
 * Torque spellings and factors are the engine's (lib/engine/units.ts, NIST SP 811 App. B.9).
 */
export function resolveColumnUnit(
  field: ImportField,
  unitText: string | null,
): ColumnUnit | undefined {
  if (unitText === null) return { unit: field.unit ?? "", factor: 1 };
  switch (field.quantity) {
    case "torque": {
      // "N m", "oz in": a space is a common stand-in for the middle dot.
      const unit = canonicalTorqueUnit(unitText.trim().replace(/\s+/g, "·"));
      return unit === undefined ? undefined : { unit, factor: TORQUE_FACTORS_TO_NM[unit] };
    }
    case "inductance": {
      const unit = INDUCTANCE_ALIASES[squash(unitText)];
      return unit === undefined ? undefined : { unit, factor: INDUCTANCE_FACTORS_TO_MH[unit] };
    }
    case "speed": {
      const unit = SPEED_ALIASES[squash(unitText)];
      return unit === undefined ? undefined : { unit, factor: SPEED_FACTORS_TO_RPM[unit] };
    }
    case "inertia": {
      // Spellings and factors are the engine's (lib/engine/units.ts, NIST SP 811 App. B.9).
      const unit = canonicalInertiaUnit(unitText);
      return unit === undefined ? undefined : { unit, factor: INERTIA_FACTORS_TO_KG_M2[unit] };
    }
    case "none": {
      if (field.unit === null) return undefined;
      const spelled = squash(unitText);
      const accepted = FIXED_ALIASES[field.unit] ?? [field.unit.toLowerCase()];
      return accepted.includes(spelled) ? { unit: field.unit, factor: 1 } : undefined;
    }
  }
}

/** The units a header of this field may name, canonical spellings, for messages and help. */
export function supportedUnits(field: ImportField): readonly string[] {
  return unitsOf(field.quantity, field.unit);
}

function unitsOf(quantity: QuantityKind, unit: string | null): readonly string[] {
  switch (quantity) {
    case "torque":
      return TORQUE_UNIT_NAMES;
    case "inductance":
      return Object.keys(INDUCTANCE_FACTORS_TO_MH);
    case "speed":
      return Object.keys(SPEED_FACTORS_TO_RPM);
    case "inertia":
      return INERTIA_UNIT_NAMES;
    case "none":
      return unit === null ? [] : [unit];
  }
}

/**
 * A value in a column's unit, in the SI unit. The product is rounded to 12 significant digits
 * so that 2.5 H reads 2500 mH, not 2500.0000000000005: the NIST factors carry 7 digits, so the
 * rounding drops nothing that was measured.
 */
export function toSi(value: number, factor: number): number {
  if (factor === 1) return value;
  return Number((value * factor).toPrecision(12));
}
