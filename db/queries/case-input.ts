import Decimal from "decimal.js";
import {
  suggestKit,
  type AxisInput,
  type CaseInput,
  type KitInput,
  type MarginsInput,
  type MotorInput,
} from "../../lib/engine";
import { AXIS_FIELDS, optionalTextKeys } from "../../lib/fields";
import { caseAssumptionsSchema, type CaseAssumptions } from "../../lib/validations/case";
import type { Axis, CaseAxis, Kit, Machine, Motor, Site } from "../schema";

// Rows of the database turned into the engine's input (docs/model.md). Pure functions, no
// connection: the queries and the demo seed (which runs inside its own transaction) share them,
// so a seeded case evaluates exactly as one built through the app.

type MotorFields = Pick<
  Motor,
  | "rotorTeeth"
  | "holdingTorqueNm"
  | "ratedCurrentA"
  | "phaseResistanceOhm"
  | "phaseInductanceMh"
  | "thermalResistanceKPerW"
  | "ratedTempRiseK"
  | "insulationClass"
  | "hysteresisWPerHz"
  | "eddyWPerHz2"
>;

export type RetrofitTerms = Pick<
  CaseAxis,
  "discountPct" | "installHours" | "commissioningCost" | "maintenanceSavingPerYear"
>;

export const DEFAULT_RETROFIT_TERMS: RetrofitTerms = {
  discountPct: 0,
  installHours: 0,
  commissioningCost: "0",
  maintenanceSavingPerYear: "0",
};

// Optional engine fields are left out rather than set to undefined, so that the input reads the
// same as an object and as the JSON stored in a proposal.
export function motorInputOf(row: MotorFields): MotorInput {
  return {
    rotorTeeth: row.rotorTeeth,
    holdingTorqueNm: row.holdingTorqueNm,
    ratedCurrentA: row.ratedCurrentA,
    phaseResistanceOhm: row.phaseResistanceOhm,
    phaseInductanceMh: row.phaseInductanceMh,
    ...(row.thermalResistanceKPerW == null
      ? {}
      : { thermalResistanceKPerW: row.thermalResistanceKPerW }),
    ratedTempRiseK: row.ratedTempRiseK,
    insulationClass: row.insulationClass,
    hysteresisWPerHz: row.hysteresisWPerHz,
    eddyWPerHz2: row.eddyWPerHz2,
  };
}

// The kit's code is its id in the engine: it reads in suggestion reasons, results and workbooks,
// and it is unique in the catalogue.
export function kitInputOf(kit: Kit, motor: Motor | null): KitInput {
  return {
    id: kit.code,
    name: kit.name,
    price: kit.price,
    sensing: kit.sensing,
    ...(motor ? { motor: motorInputOf(motor) } : {}),
    ...(kit.maxCurrentPeakA == null ? {} : { maxCurrentPeakA: kit.maxCurrentPeakA }),
    ...(kit.busVoltageV == null ? {} : { busVoltageV: kit.busVoltageV }),
    efficiencyPct: kit.efficiencyPct,
    standbyW: kit.standbyW,
    ...(kit.encoderW == null ? {} : { encoderW: kit.encoderW }),
    minCurrentPct: kit.minCurrentPct,
    sensorlessMinRpm: kit.sensorlessMinRpm,
  };
}

// With motion, docs/model.md (Motion from the mechanism) derives the duty figures and ignores any sent: the typed columns
// (placeholders when left blank) stay out, so the input says where the figures come from.
function dutyInputOf(axis: Axis): AxisInput["duty"] {
  if (axis.motion)
    return { hoursPerYear: axis.hoursPerYear, ambientC: axis.ambientC, motion: axis.motion };
  return {
    hoursPerYear: axis.hoursPerYear,
    movePct: axis.movePct,
    holdPct: axis.holdPct,
    speedRpm: axis.speedRpm,
    loadTorqueNm: axis.loadTorqueNm,
    peakTorqueNm: axis.peakTorqueNm,
    holdTorqueNm: axis.holdTorqueNm,
    ambientC: axis.ambientC,
  };
}

// The engine refuses costPerEvent beside an event (docs/model.md (The business case)): a stored event is the cost.
function reliabilityInputOf(axis: Axis): AxisInput["reliability"] {
  return {
    stepLossEventsPerYear: axis.stepLossEventsPerYear,
    ...(axis.event ? { event: axis.event } : { costPerEvent: axis.costPerEvent }),
    avoidedPct: axis.avoidedPct,
  };
}

// The axis's optional text fields of the registry (lib/fields), those it has: carried to the workbook.
const TEXT_KEYS = optionalTextKeys(AXIS_FIELDS) as (keyof Axis)[];
function textsOf(axis: Axis): Record<string, string> {
  const texts: Record<string, string> = {};
  for (const key of TEXT_KEYS) if (typeof axis[key] === "string") texts[key] = axis[key] as string;
  return texts;
}

export function axisInputOf(axis: Axis, kit: KitInput, terms: RetrofitTerms): AxisInput {
  return {
    id: String(axis.id),
    label: axis.label,
    machineId: String(axis.machineId),
    quantity: axis.quantity,
    ...textsOf(axis),
    motor: {
      ...motorInputOf(axis),
      ...(axis.pullOutCurve ? { pullOutCurve: axis.pullOutCurve } : {}),
    },
    drive: {
      busVoltageV: axis.busVoltageV,
      currentSettingA: axis.currentSettingA,
      currentConvention: axis.currentConvention,
      stepMode: axis.stepMode,
      microsteps: axis.microsteps,
      idleCurrentPct: axis.idleCurrentPct,
      efficiencyPct: axis.driveEfficiencyPct,
      standbyW: axis.driveStandbyW,
      ...(axis.resonance ? { resonance: axis.resonance } : {}),
    },
    duty: dutyInputOf(axis),
    reliability: reliabilityInputOf(axis),
    retrofit: {
      kit,
      discountPct: terms.discountPct,
      installHours: terms.installHours,
      commissioningCost: terms.commissioningCost,
      maintenanceSavingPerYear: terms.maintenanceSavingPerYear,
    },
  };
}

export function machineInputOf(machine: Machine): CaseInput["machines"][number] {
  return {
    id: String(machine.id),
    name: machine.name,
    downtimeHours: machine.downtimeHours,
    throughputGainPct: machine.throughputGainPct,
    marginPerOutputHour: machine.marginPerOutputHour,
  };
}

// A new case starts from its site's tariff and grid factor; everything else is the engine's
// default (docs/model.md), to be replaced by the customer's own figures.
export function defaultAssumptions(
  site: Pick<Site, "tariffPerKWh" | "gridKgCo2PerKWh">,
): CaseAssumptions {
  return caseAssumptionsSchema.parse({
    finance: { tariffPerKWh: site.tariffPerKWh, gridKgCo2PerKWh: site.gridKgCo2PerKWh },
  });
}

export type CaseAxisRow = { axis: Axis; kit: KitInput; terms: RetrofitTerms };

// The whole CaseInput: machines are those of the picked axes, in id order like the axes.
export function assembleCaseInput(
  currency: string,
  assumptions: CaseAssumptions,
  machines: Machine[],
  rows: CaseAxisRow[],
): CaseInput {
  return {
    currency,
    finance: assumptions.finance,
    margins: assumptions.margins,
    band: assumptions.band,
    sensitivity: assumptions.sensitivity,
    thermal: assumptions.thermal,
    machines: [...machines].sort((a, b) => a.id - b.id).map(machineInputOf),
    axes: [...rows]
      .sort((a, b) => a.axis.id - b.axis.id)
      .map((r) => axisInputOf(r.axis, r.kit, r.terms)),
  };
}

export type KitOption = { row: Kit; input: KitInput };

// The kits a case may choose from: active, priced in the case's currency (a price in another
// currency would be summed as if it were this one), cheapest first by exact decimal price.
export function kitOptions(currency: string, kitRows: Kit[], motorRows: Motor[]): KitOption[] {
  const motorsById = new Map(motorRows.map((m) => [m.id, m]));
  return kitRows
    .filter((k) => k.currency === currency && k.active)
    .sort((a, b) => new Decimal(a.price).comparedTo(b.price) || a.code.localeCompare(b.code))
    .map((row) => ({
      row,
      input: kitInputOf(row, row.motorId == null ? null : (motorsById.get(row.motorId) ?? null)),
    }));
}

export type KitChoice = { kit: KitOption | null; reason: string };

// The engine's suggestion (the cheapest kit, after the axis's discount, that keeps the
// closed-loop margin) with the axis's current retrofit terms.
export function suggestKitFor(
  axis: Axis,
  terms: RetrofitTerms,
  options: KitOption[],
  margins: MarginsInput,
): KitChoice {
  if (options.length === 0) {
    return { kit: null, reason: "the catalogue has no active kit priced in this currency" };
  }
  const input = axisInputOf(axis, options[0].input, terms);
  const suggestion = suggestKit(
    input,
    options.map((o) => o.input),
    margins,
  );
  const kit = suggestion.kit
    ? (options.find((o) => o.input.id === suggestion.kit!.id) ?? null)
    : null;
  return { kit, reason: suggestion.reason };
}
