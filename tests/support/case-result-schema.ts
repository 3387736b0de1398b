import { z } from "zod";

// The CaseResult contract other tools read (docs/model.md docs/contracts.md (Case result)), written out independently of the
// engine's own TypeScript types. Strict objects: a missing or an extra key fails the parse.
// caseResultSchemaV1 is the contract of engine 1.0.0, which proposals issued before keep.
const money = z.string().regex(/^-?\d+(\.\d+)?$/, "money is a plain decimal string");
const num = z.number().finite();
const nullableNum = num.nullable();

const loop = {
  currentMoveA: num,
  currentHoldA: num,
  resistanceHotOhm: num,
  windingTempC: nullableNum,
  copperLossMoveW: num,
  copperLossHoldW: num,
  ironLossW: num,
  inputPowerW: z.strictObject({ move: num, hold: num, off: num }),
  energyKWhPerYear: num,
  cabinetHeatW: num,
  coolingKWhPerYear: num,
  torqueAtSpeedNm: num,
  marginPct: nullableNum,
  usableTorqueNm: num,
  maxSpeedRpm: num,
};

const scenario = z.strictObject({
  cashFlows: z.array(money),
  npv: money,
  irr: nullableNum,
  paybackYears: nullableNum,
  discountedPaybackYears: nullableNum,
  roiPct: nullableNum,
});

export const caseResultSchemaV1 = z.strictObject({
  engineVersion: z.string().min(1),
  currency: z.string(),
  axes: z.array(
    z.strictObject({
      id: z.string(),
      machineId: z.string(),
      quantity: z.number().int(),
      warnings: z.array(z.string()),
      geometry: z.strictObject({
        stepAngleDeg: num,
        stepsPerRev: num,
        resolutionDeg: num,
        electricalCycleDeg: num,
      }),
      openLoop: z.strictObject({
        ...loop,
        status: z.enum(["ok", "at-risk", "step-loss"]),
        loadAngleElecDeg: nullableNum,
        loadAngleMechDeg: nullableNum,
      }),
      closedLoop: z.strictObject({ ...loop, status: z.enum(["ok", "at-risk", "undersized"]) }),
      savings: z.strictObject({
        energyKWhPerYear: num,
        energyPct: nullableNum,
        band: z.enum(["below", "within", "above"]),
        coolingKWhPerYear: num,
        tempDropK: nullableNum,
        insulationLifeFactor: nullableNum,
        torqueFreedNm: num,
        torqueFreedPct: nullableNum,
        speedHeadroomPct: nullableNum,
        stepLossEventsAvoided: num,
      }),
      capex: money,
      totals: z.strictObject({
        capex: money,
        energySavedKWhPerYear: num,
        coolingSavedKWhPerYear: num,
      }),
    }),
  ),
  machines: z.array(
    z.strictObject({
      id: z.string(),
      throughputGainPct: num,
      throughputPerYear: money,
      warnings: z.array(z.string()),
    }),
  ),
  totals: z.strictObject({
    capex: money,
    energyOpenLoopKWhPerYear: num,
    energyClosedLoopKWhPerYear: num,
    energySavedKWhPerYear: num,
    coolingSavedKWhPerYear: num,
    reliabilityPerYear: money,
    maintenancePerYear: money,
    throughputPerYear: money,
    co2TonnesPerYear: num,
  }),
  scenarios: z.strictObject({ physics: scenario, bandLow: scenario, bandHigh: scenario }),
  sensitivity: z.array(
    z.strictObject({
      driver: z.enum([
        "tariff",
        "hoursPerYear",
        "loadTorque",
        "kitPrice",
        "laborRate",
        "stepLossEvents",
        "discountRate",
      ]),
      low: z.strictObject({ npv: money, paybackYears: nullableNum }),
      high: z.strictObject({ npv: money, paybackYears: nullableNum }),
    }),
  ),
});

const v1Axis = caseResultSchemaV1.shape.axes.element;
const bySource = z.strictObject({
  energy: z.array(money),
  cooling: z.array(money),
  reliability: z.array(money),
  maintenance: z.array(money),
  throughput: z.array(money),
  service: z.array(money),
  tax: z.array(money),
});
const scenarioV2 = scenario.extend({
  paybackStatus: z.enum(["reached", "beyond-horizon", "never"]),
  bySource,
});

/** The contract of engine 2: v1's keys plus what v2 adds (motion, holding, finance). */
export const caseResultSchema = caseResultSchemaV1.extend({
  engineVersion: z.literal("2.0.0"),
  axes: z.array(
    v1Axis.extend({
      openLoop: v1Axis.shape.openLoop.extend({ holdingCapabilityNm: num }),
      motion: z
        .strictObject({
          speedRpm: num,
          loadTorqueNm: num,
          peakTorqueNm: num,
          holdTorqueNm: num,
          meanMechPowerW: num,
          movePct: num,
          holdPct: num,
          reflectedInertiaKgM2: num,
          inertiaRatio: nullableNum,
        })
        .nullable(),
    }),
  ),
  scenarios: z.strictObject({ physics: scenarioV2, bandLow: scenarioV2, bandHigh: scenarioV2 }),
  sensitivity: z.array(
    caseResultSchemaV1.shape.sensitivity.element.extend({
      driver: z.enum([
        "tariff",
        "hoursPerYear",
        "loadTorque",
        "kitPrice",
        "laborRate",
        "stepLossEvents",
        "discountRate",
        "throughputGain",
        "idleCurrent",
      ]),
    }),
  ),
  breakEven: z.strictObject({ tariffPerKWh: money.nullable(), stepLossFactor: nullableNum }),
});
