import { z } from "zod";
import {
  atLeast,
  bool,
  bounded,
  holdingTorque,
  FIELD_BOUNDS,
  inertia,
  id,
  int,
  list,
  money,
  num,
  obj,
  pct,
  text,
  torque,
  choiceField,
  moneyField,
  numberField,
  optionalTextShape,
  presence,
  torqueField,
} from "./schema-fields";
import {
  AXIS_FIELDS as A,
  EVENT_FIELDS as E,
  KIT_FIELDS as K,
  MOTION_FIELDS as M,
} from "../fields";

/**
 * The input of docs/model.md with its defaults. Objects whose every field has a default use
 * `prefault({})` so that a missing object is parsed — and filled — like an empty one.
 */

const curvePoint = obj({ rpm: bounded("speedRpm"), torqueNm: torque() });

export const motorInputSchema = obj({
  rotorTeeth: numberField(A.rotorTeeth),
  holdingTorqueNm: presence(holdingTorque(), A.holdingTorqueNm),
  ratedCurrentA: numberField(A.ratedCurrentA),
  phaseResistanceOhm: numberField(A.phaseResistanceOhm),
  phaseInductanceMh: numberField(A.phaseInductanceMh),
  thermalResistanceKPerW: numberField(A.thermalResistanceKPerW),
  ratedTempRiseK: numberField(A.ratedTempRiseK),
  insulationClass: choiceField(A.insulationClass),
  hysteresisWPerHz: numberField(A.hysteresisWPerHz),
  eddyWPerHz2: numberField(A.eddyWPerHz2),
  pullOutCurve: list(curvePoint)
    .min(1, "must hold at least one point")
    .superRefine((points, ctx) => {
      for (let i = 1; i < points.length; i++) {
        if (!(points[i].rpm > points[i - 1].rpm)) {
          ctx.addIssue({
            code: "custom",
            path: [i, "rpm"],
            message: `must be greater than the previous point's rpm (${points[i - 1].rpm})`,
          });
        }
      }
    })
    .optional(),
});

export const kitInputSchema = obj({
  id: id(),
  name: text(),
  price: money(),
  sensing: choiceField(K.sensing),
  motor: motorInputSchema.optional(),
  maxCurrentPeakA: numberField(K.maxCurrentPeakA),
  busVoltageV: numberField(K.busVoltageV),
  efficiencyPct: numberField(K.efficiencyPct),
  standbyW: numberField(K.standbyW),
  // docs/model.md: 0.5 W, 0 when sensorless; kitEncoderW() fills it since the default depends on sensing.
  encoderW: numberField(K.encoderW),
  minCurrentPct: numberField(K.minCurrentPct),
  sensorlessMinRpm: numberField(K.sensorlessMinRpm),
});

/** docs/model.md (Torque at speed): an open-loop mid-band dip, a model rather than a measured curve. */
const resonanceSchema = obj({
  fromRpm: bounded("speedRpm"),
  toRpm: bounded("speedRpm"),
  deratePct: pct(),
}).superRefine((r, ctx) => {
  if (r.toRpm < r.fromRpm)
    ctx.addIssue({
      code: "custom",
      path: ["toRpm"],
      message: `must be at least fromRpm (${r.fromRpm})`,
    });
});

const driveSchema = obj({
  busVoltageV: numberField(A.busVoltageV),
  currentSettingA: numberField(A.currentSettingA),
  currentConvention: choiceField(A.currentConvention),
  stepMode: choiceField(A.stepMode),
  microsteps: numberField(A.microsteps),
  idleCurrentPct: numberField(A.idleCurrentPct),
  efficiencyPct: numberField(A.driveEfficiencyPct),
  standbyW: numberField(A.driveStandbyW),
  resonance: resonanceSchema.optional(),
});

export { MECHANISMS, type Mechanism } from "../fields";

/** docs/model.md (Motion from the mechanism): one axis's mechanism and move profile. */
export const motionInputSchema = obj({
  mechanism: choiceField(M.mechanism),
  radiusMm: numberField(M.radiusMm),
  leadMm: numberField(M.leadMm),
  // absent = belt 95, rack 90, screw 90, rotary 100 (common practice)
  efficiencyPct: numberField(M.efficiencyPct),
  gearRatio: numberField(M.gearRatio),
  gearEfficiencyPct: numberField(M.gearEfficiencyPct),
  massKg: numberField(M.massKg),
  loadInertiaKgM2: presence(inertia(), M.loadInertiaKgM2),
  // 0 means unknown (MOTOR_INERTIA_UNKNOWN); a known rotor lies within its own bound.
  motorInertiaKgM2: inertia()
    .refine(
      // Not a number when the unit was refused (its issue does not abort): no second message.
      (kgM2) => typeof kgM2 !== "number" || kgM2 === 0 || kgM2 >= FIELD_BOUNDS.rotorInertiaKgM2.min,
      `must be 0 (unknown) or at least ${FIELD_BOUNDS.rotorInertiaKgM2.min} kg·m²`,
    )
    .default(M.motorInertiaKgM2.default),
  // Its own wording: "(vertical)" says what the upper end is.
  inclineDeg: atLeast(FIELD_BOUNDS.inclineDeg.min)
    .max(FIELD_BOUNDS.inclineDeg.max, `must be at most ${FIELD_BOUNDS.inclineDeg.max} (vertical)`)
    .default(M.inclineDeg.default),
  frictionCoeff: numberField(M.frictionCoeff),
  externalForceN: numberField(M.externalForceN),
  externalTorqueNm: torqueField(M.externalTorqueNm),
  stroke: numberField(M.stroke),
  moveTimeS: numberField(M.moveTimeS),
  accelSharePct: numberField(M.accelSharePct),
  dwellTimeS: numberField(M.dwellTimeS),
  returnMove: presence(bool(), M.returnMove),
  energizedPct: numberField(M.energizedPct),
  maxInertiaRatio: numberField(M.maxInertiaRatio),
});

/** The radius or lead each mechanism needs; checks the types it relies on. */
function checkMotion(motion: unknown, ctx: z.RefinementCtx): void {
  if (typeof motion !== "object" || motion === null) return;
  const m = motion as Record<string, unknown>;
  if ((m.mechanism === "belt" || m.mechanism === "rack") && m.radiusMm === undefined)
    ctx.addIssue({
      code: "custom",
      path: ["radiusMm"],
      message: `required for a ${m.mechanism}: the pitch radius of the ${m.mechanism === "belt" ? "pulley" : "pinion"} in mm`,
    });
  if (m.mechanism === "screw" && m.leadMm === undefined)
    ctx.addIssue({
      code: "custom",
      path: ["leadMm"],
      message: "required for a screw: the lead in mm per screw turn",
    });
}

const dutySchema = obj({
  hoursPerYear: numberField(A.hoursPerYear),
  // Required unless motion supplies them (checkAxisDuty); ignored when motion is given.
  movePct: numberField(A.movePct).optional(),
  holdPct: numberField(A.holdPct).optional(),
  speedRpm: numberField(A.speedRpm).optional(),
  loadTorqueNm: torqueField(A.loadTorqueNm).optional(),
  peakTorqueNm: torqueField(A.peakTorqueNm).optional(),
  holdTorqueNm: torqueField(A.holdTorqueNm),
  ambientC: numberField(A.ambientC),
  motion: motionInputSchema.superRefine(checkMotion, { when: () => true }).optional(),
});

/** docs/model.md (The business case): the cost of one step-loss event, built up from what it causes. */
export const stepLossEventSchema = obj({
  downtimeMinutes: numberField(E.downtimeMinutes),
  scrapParts: numberField(E.scrapParts),
  scrapCostPerPart: moneyField(E.scrapCostPerPart),
  restartLaborHours: numberField(E.restartLaborHours),
});

const reliabilitySchema = obj({
  stepLossEventsPerYear: numberField(A.stepLossEventsPerYear),
  // Absent = 0, or built from `event`; giving both is refused (checkReliability).
  costPerEvent: money().optional(),
  avoidedPct: numberField(A.avoidedPct),
  event: stepLossEventSchema.optional(),
}).superRefine((r, ctx) => {
  if (r.costPerEvent !== undefined && r.event !== undefined)
    ctx.addIssue({
      code: "custom",
      path: ["event"],
      message:
        "give either costPerEvent or event (the cost built from downtime, scrap and labour), not both",
    });
});

const retrofitSchema = obj({
  kit: kitInputSchema,
  discountPct: pct().default(0),
  installHours: bounded("installHours").default(0),
  commissioningCost: money().default("0"),
  maintenanceSavingPerYear: money().default("0"),
});

const axisObject = obj({
  id: id(),
  label: text(),
  machineId: id(),
  quantity: numberField(A.quantity),
  // The registry's optional text fields of an axis (its asset tag): carried, never computed with.
  ...optionalTextShape(A),
  motor: motorInputSchema,
  drive: driveSchema,
  duty: dutySchema,
  reliability: reliabilitySchema.prefault({}),
  retrofit: retrofitSchema,
});

/**
 * The cross-field checks of one axis. They also run when other fields failed (see
 * reportEveryProblem), so they check the types they rely on.
 */
const MOTION_SUPPLIED = ["movePct", "holdPct", "speedRpm", "loadTorqueNm", "peakTorqueNm"] as const;

function checkAxisDuty(axis: unknown, ctx: z.RefinementCtx): void {
  if (typeof axis !== "object" || axis === null) return;
  const duty = (axis as { duty?: Record<string, unknown> }).duty;
  if (typeof duty !== "object" || duty === null) return;
  // With motion, docs/model.md (Motion from the mechanism) derives these figures and any sent are ignored.
  if (duty.motion !== undefined) return;
  for (const field of MOTION_SUPPLIED)
    if (duty[field] === undefined)
      ctx.addIssue({
        code: "custom",
        path: ["duty", field],
        message: "required: expected a number (or give duty.motion to derive it)",
      });
  const { movePct, holdPct, loadTorqueNm, peakTorqueNm } = duty;
  if (typeof movePct === "number" && typeof holdPct === "number" && movePct + holdPct > 100) {
    ctx.addIssue({
      code: "custom",
      path: ["duty", "holdPct"],
      message: `movePct + holdPct must be at most 100 (here ${movePct} + ${holdPct})`,
    });
  }
  if (
    typeof loadTorqueNm === "number" &&
    typeof peakTorqueNm === "number" &&
    peakTorqueNm < loadTorqueNm
  ) {
    ctx.addIssue({
      code: "custom",
      path: ["duty", "peakTorqueNm"],
      message: `must be at least loadTorqueNm (${loadTorqueNm})`,
    });
  }
}

/** Cross-field checks run even when other fields failed: one pass reports every problem it sees. */
const reportEveryProblem = { when: () => true };

export const axisInputSchema = axisObject.superRefine(checkAxisDuty, reportEveryProblem);

const financeSchema = obj({
  tariffPerKWh: money(),
  tariffEscalationPct: bounded("ratePct").default(0),
  discountRatePct: bounded("discountRatePct").default(8),
  horizonYears: int(1, 30).default(5),
  laborRatePerHour: money().default("0"),
  downtimeCostPerHour: money().default("0"),
  projectOneTimeCost: money().default("0"),
  annualServiceCost: money().default("0"),
  coolingCop: bounded("coolingCop").nullable().default(null),
  gridKgCo2PerKWh: bounded("gridKgCo2PerKWh").default(0),
  inflationPct: bounded("ratePct").default(0),
  taxRatePct: num().min(0, "must be at least 0").lt(100, "must be less than 100").default(0),
  depreciationYears: int(1, 30).default(5),
});

const requiredMargin = () => atLeast(0).lt(100, "must be less than 100");

const machineSchema = obj({
  id: id(),
  name: text(),
  downtimeHours: bounded("downtimeHours").default(0),
  throughputGainPct: bounded("throughputGainPct").default(0),
  marginPerOutputHour: money().default("0"),
});

export const marginsSchema = obj({
  openLoopRequiredPct: requiredMargin().default(40), // common practice: 30–50 % of pull-out
  closedLoopRequiredPct: requiredMargin().default(15), // common practice: 10–20 %
});

const bandSchema = obj({
  lowPct: bounded("bandPct").default(25), // trade claim for closed-loop energy gains: 25–50 %
  highPct: bounded("bandPct").default(50),
}).superRefine((band, ctx) => {
  if (band.highPct < band.lowPct) {
    ctx.addIssue({
      code: "custom",
      path: ["highPct"],
      message: `must be at least lowPct (${band.lowPct})`,
    });
  }
});

/** Reports a repeated id once per repeat, at the later occurrence. */
function checkUniqueIds(
  items: unknown,
  field: string,
  ctx: z.RefinementCtx,
  what: string,
): Set<string> {
  const seen = new Map<string, number>();
  if (!Array.isArray(items)) return new Set();
  items.forEach((item: unknown, index) => {
    const value = (item as Record<string, unknown> | null)?.id;
    if (typeof value !== "string") return;
    const first = seen.get(value);
    if (first === undefined) seen.set(value, index);
    else
      ctx.addIssue({
        code: "custom",
        path: [field, index, "id"],
        message: `duplicate ${what} id "${value}" (first at ${field}[${first}])`,
      });
  });
  return new Set(seen.keys());
}

/** The fields of a case, around the axis schema given (with or without reportEveryProblem). */
const caseObject = (axis: typeof axisInputSchema) =>
  obj({
    currency: text().regex(
      /^[A-Z]{3}$/,
      'must be an ISO 4217 code of three capital letters, e.g. "EUR"',
    ),
    finance: financeSchema,
    margins: marginsSchema.prefault({}),
    band: bandSchema.prefault({}),
    sensitivity: obj({
      swingPct: atLeast(0).max(100, "must be at most 100").default(20),
    }).prefault({}),
    thermal: obj({ lifeHalvingK: bounded("lifeHalvingK").default(10) }).prefault({}), // rule of thumb; IEC 60216
    machines: list(machineSchema),
    axes: list(axis)
      .min(1, "must hold at least 1 axis")
      .max(100000, "must hold at most 100000 axes"),
  });

/** Ids unique, and every axis names a machine of the case; checks the types it relies on. */
function checkCaseReferences(input: unknown, ctx: z.RefinementCtx): void {
  // Runs even when the body is not an object (reportEveryProblem), e.g. a JSON `null`.
  if (typeof input !== "object" || input === null) return;
  const fields = input as { machines?: unknown; axes?: unknown };
  const machineIds = checkUniqueIds(fields.machines, "machines", ctx, "machine");
  checkUniqueIds(fields.axes, "axes", ctx, "axis");
  if (!Array.isArray(fields.axes) || !Array.isArray(fields.machines)) return;
  fields.axes.forEach((axis: unknown, index) => {
    const machineId = (axis as Record<string, unknown> | null)?.machineId;
    if (typeof machineId === "string" && !machineIds.has(machineId)) {
      ctx.addIssue({
        code: "custom",
        path: ["axes", index, "machineId"],
        message: `must name a machine in machines (no machine "${machineId}")`,
      });
    }
  });
}

/** The schema that reports: every problem of invalid input, each with its path. */
const reportingCaseSchema = caseObject(axisInputSchema).superRefine(
  checkCaseReferences,
  reportEveryProblem,
);

/**
 * The same checks without reportEveryProblem, compiled by zod (z.compile) into one generated
 * function: its compiler cannot express a `when`, and a `when` only matters once another issue
 * was found — and input this schema rejects is parsed again by the reporting schema, so every
 * message is the reporting schema's. Compiled on first use, so a module that only imports the
 * engine pays nothing; where code generation is not allowed, z.compile hands the schema back
 * as it is, which parses the same, only slower.
 */
let acceptingCaseSchema: ReturnType<typeof caseObject> | undefined;
const acceptValidCase = (input: unknown) => {
  acceptingCaseSchema ??= z.compile(
    caseObject(axisObject.superRefine(checkAxisDuty)).superRefine(checkCaseReferences),
  );
  const accepted = acceptingCaseSchema.safeParse(input);
  return accepted.success ? accepted.data : z.INVALID;
};

/**
 * CaseInput of docs/model.md. Valid input takes the compiled path, which on a 10,000-axis case
 * allocates less than half of what zod's interpreter does and runs markedly faster (docs/model.md
 * docs/contracts.md (Performance)). Invalid input costs more than before — the accepting schema's interpreter, then the
 * reporting one, whose issues are returned — which only a rejected case pays.
 */
export const caseInputSchema = z.withParser(reportingCaseSchema, acceptValidCase);

export type CaseInput = z.input<typeof caseInputSchema>;
export type ParsedCase = z.output<typeof caseInputSchema>;
export type AxisInput = z.input<typeof axisInputSchema>;
export type ParsedAxis = z.output<typeof axisInputSchema>;
export type MotorInput = z.input<typeof motorInputSchema>;
export type ParsedMotor = z.output<typeof motorInputSchema>;
export type KitInput = z.input<typeof kitInputSchema>;
export type ParsedKit = z.output<typeof kitInputSchema>;
export type MarginsInput = z.input<typeof marginsSchema>;
export type ParsedMargins = z.output<typeof marginsSchema>;
export type MotionInput = z.input<typeof motionInputSchema>;
export type ParsedMotion = z.output<typeof motionInputSchema>;
export type StepLossEventInput = z.input<typeof stepLossEventSchema>;
