import {
  axisInputSchema,
  stepLossEventSchema,
  type MotionInput,
  type StepLossEventInput,
} from "../../lib/engine/schema";
import { DEMO_MOTORS } from "./catalogue";

// The invented installed base of the demo scenario (docs/product.md): three customers, their plants,
// machines and a few hundred NEMA 17/23/34 class axes. A seeded generator keeps it the same on
// every machine.

type AxisTemplate = {
  label: string;
  motor: string;
  speedRpm: number;
  loadShare: number; // load torque as a share of holding torque
  peakShare: number;
  movePct: number;
  holdPct: number;
  holdShare?: number; // a vertical or tensioned axis holds a load at standstill
  stepMode?: "full" | "half" | "half-compensated" | "micro";
  stepLossEventsPerYear?: number;
};

// An axis described by its mechanism and move (docs/model.md (Motion from the mechanism)) instead of typed duty figures,
// optionally with its step-loss events costed from what one causes (docs/model.md (The business case)).
type MotionAxisTemplate = {
  label: string;
  motor: string;
  motion: MotionInput;
  stepLossEventsPerYear?: number;
  event?: StepLossEventInput;
};

type MachineKind = {
  kind: string;
  line: string;
  downtimeHours: number;
  axes: (AxisTemplate | MotionAxisTemplate)[];
};

const CARTONER: MachineKind = {
  kind: "Cartoner",
  line: "Carton line",
  downtimeHours: 6,
  axes: [
    {
      label: "Carton feed",
      motor: "RM23-76",
      speedRpm: 420,
      loadShare: 0.22,
      peakShare: 0.42,
      movePct: 55,
      holdPct: 35,
      stepLossEventsPerYear: 4,
    },
    {
      label: "Flap folder",
      motor: "RM23-56",
      speedRpm: 300,
      loadShare: 0.25,
      peakShare: 0.45,
      movePct: 45,
      holdPct: 45,
    },
    {
      label: "Product pusher",
      motor: "RM23-100",
      speedRpm: 600,
      loadShare: 0.18,
      peakShare: 0.38,
      movePct: 60,
      holdPct: 30,
      stepLossEventsPerYear: 6,
    },
    {
      label: "Glue gun traverse",
      motor: "RM17-48",
      speedRpm: 360,
      loadShare: 0.2,
      peakShare: 0.4,
      movePct: 40,
      holdPct: 50,
    },
    {
      label: "Outfeed belt",
      motor: "RM34-80",
      speedRpm: 240,
      loadShare: 0.2,
      peakShare: 0.35,
      movePct: 80,
      holdPct: 10,
    },
  ],
};

const LABELER: MachineKind = {
  kind: "Labeler",
  line: "Labelling",
  downtimeHours: 3,
  axes: [
    {
      label: "Label web drive",
      motor: "RM23-76",
      speedRpm: 480,
      loadShare: 0.15,
      peakShare: 0.4,
      movePct: 50,
      holdPct: 40,
      holdShare: 0.06,
      stepLossEventsPerYear: 8,
    },
    {
      label: "Backing rewind",
      motor: "RM17-60",
      speedRpm: 200,
      loadShare: 0.25,
      peakShare: 0.4,
      movePct: 50,
      holdPct: 40,
      holdShare: 0.1,
    },
    {
      label: "Applicator stroke",
      motor: "RM17-48",
      speedRpm: 500,
      loadShare: 0.18,
      peakShare: 0.45,
      movePct: 35,
      holdPct: 55,
    },
  ],
};

const PIPETTING_GANTRY: MachineKind = {
  kind: "Pipetting gantry",
  line: "Liquid handling",
  downtimeHours: 2,
  axes: [
    {
      label: "Gantry X",
      motor: "RM23-56",
      speedRpm: 750,
      loadShare: 0.15,
      peakShare: 0.45,
      movePct: 30,
      holdPct: 60,
    },
    {
      label: "Gantry Y",
      motor: "RM17-60",
      speedRpm: 700,
      loadShare: 0.16,
      peakShare: 0.45,
      movePct: 30,
      holdPct: 60,
    },
    {
      label: "Head Z (vertical)",
      motor: "RM17-48",
      speedRpm: 400,
      loadShare: 0.3,
      peakShare: 0.5,
      movePct: 20,
      holdPct: 75,
      holdShare: 0.2,
      stepLossEventsPerYear: 3,
    },
    {
      label: "Plunger",
      motor: "RM17-34",
      speedRpm: 150,
      loadShare: 0.3,
      peakShare: 0.5,
      movePct: 15,
      holdPct: 80,
      stepMode: "half-compensated",
    },
  ],
};

const WEB_PRESS: MachineKind = {
  kind: "Web press",
  line: "Printing",
  downtimeHours: 10,
  axes: [
    {
      label: "Infeed nip",
      motor: "RM34-118",
      speedRpm: 300,
      loadShare: 0.2,
      peakShare: 0.38,
      movePct: 75,
      holdPct: 15,
      holdShare: 0.05,
    },
    {
      label: "Register correction",
      motor: "RM23-100",
      speedRpm: 150,
      loadShare: 0.12,
      peakShare: 0.35,
      movePct: 40,
      holdPct: 55,
      stepLossEventsPerYear: 10,
    },
    {
      label: "Ink fountain key",
      motor: "RM17-34",
      speedRpm: 60,
      loadShare: 0.2,
      peakShare: 0.3,
      movePct: 5,
      holdPct: 90,
      stepMode: "full",
    },
  ],
};

const SLITTER: MachineKind = {
  kind: "Slitter rewinder",
  line: "Converting",
  downtimeHours: 8,
  axes: [
    {
      label: "Knife positioner",
      motor: "RM23-76",
      speedRpm: 500,
      loadShare: 0.15,
      peakShare: 0.4,
      movePct: 10,
      holdPct: 85,
      stepLossEventsPerYear: 5,
    },
    {
      label: "Unwind tension",
      motor: "RM34-80",
      speedRpm: 180,
      loadShare: 0.22,
      peakShare: 0.36,
      movePct: 70,
      holdPct: 20,
      holdShare: 0.08,
      stepMode: "half",
    },
    {
      label: "Lay-on roller",
      motor: "RM23-56",
      speedRpm: 120,
      loadShare: 0.25,
      peakShare: 0.4,
      movePct: 60,
      holdPct: 30,
    },
  ],
};

// A microplate handler beside the pipetting gantries, sized from its mechanics: a belt gantry,
// a vertical screw lift that holds the plate gripper at rest, and a geared plate turner. Rotor
// inertias are invented values of the usual order for these frames (NEMA 23 ~300–500 g·cm²,
// NEMA 17 ~50–80 g·cm²).
const PLATE_HANDLER: MachineKind = {
  kind: "Plate handler",
  line: "Liquid handling",
  downtimeHours: 2,
  axes: [
    {
      label: "Plate gantry X (belt)",
      motor: "RM23-56",
      motion: {
        mechanism: "belt",
        radiusMm: 12,
        massKg: 2.5,
        loadInertiaKgM2: { value: 200, unit: "g·cm²" },
        motorInertiaKgM2: { value: 280, unit: "g·cm²" },
        frictionCoeff: 0.01,
        stroke: 400,
        moveTimeS: 0.6,
        dwellTimeS: 0.8,
      },
    },
    {
      label: "Plate lift Z (vertical screw)",
      motor: "RM23-76",
      motion: {
        mechanism: "screw",
        leadMm: 25,
        massKg: 5,
        inclineDeg: 90,
        loadInertiaKgM2: { value: 120, unit: "g·cm²" },
        motorInertiaKgM2: { value: 480, unit: "g·cm²" },
        frictionCoeff: 0.01,
        stroke: 120,
        moveTimeS: 0.6,
        dwellTimeS: 1.5,
        energizedPct: 90,
      },
      // A dropped or misplaced plate: the run stops, the plate and its reagents are lost.
      stepLossEventsPerYear: 3,
      event: {
        downtimeMinutes: 25,
        scrapParts: 4,
        scrapCostPerPart: "6.50",
        restartLaborHours: 0.5,
      },
    },
    {
      label: "Plate turner (rotary)",
      motor: "RM17-48",
      motion: {
        mechanism: "rotary",
        gearRatio: 3,
        gearEfficiencyPct: 95,
        // A plate nest of about 0.3 kg at 60 mm, and the drag of its bearing and seal.
        loadInertiaKgM2: { value: 5000, unit: "g·cm²" },
        motorInertiaKgM2: { value: 68, unit: "g·cm²" },
        externalTorqueNm: 0.3,
        stroke: 180,
        moveTimeS: 0.4,
        dwellTimeS: 1.2,
      },
    },
  ],
};

export type DemoSite = {
  account: string;
  name: string;
  currency: string;
  tariffPerKWh: string;
  gridKgCo2PerKWh: number;
  ambientC: number;
  hoursPerYear: number;
  machines: {
    kind: MachineKind;
    count: number;
    throughputGainPct?: number;
    marginPerOutputHour?: string;
  }[];
};

export const DEMO_SITES: DemoSite[] = [
  {
    account: "Cartonia Packaging Plant",
    name: "North hall",
    currency: "EUR",
    tariffPerKWh: "0.21",
    gridKgCo2PerKWh: 0.38,
    ambientC: 35,
    hoursPerYear: 6000,
    machines: [
      { kind: CARTONER, count: 14, throughputGainPct: 2, marginPerOutputHour: "30" },
      { kind: LABELER, count: 10 },
    ],
  },
  {
    account: "Cartonia Packaging Plant",
    name: "South hall",
    currency: "EUR",
    tariffPerKWh: "0.21",
    gridKgCo2PerKWh: 0.38,
    ambientC: 38,
    hoursPerYear: 4200,
    machines: [
      { kind: CARTONER, count: 6 },
      { kind: LABELER, count: 8, throughputGainPct: 1.5, marginPerOutputHour: "18" },
    ],
  },
  {
    account: "Pipetteworks Lab Automation",
    name: "Assembly and test",
    currency: "EUR",
    tariffPerKWh: "0.26",
    gridKgCo2PerKWh: 0.3,
    ambientC: 28,
    hoursPerYear: 3000,
    machines: [
      { kind: PIPETTING_GANTRY, count: 24 },
      { kind: PLATE_HANDLER, count: 2 },
    ],
  },
  {
    account: "Webline Print Finishing",
    name: "Finishing works",
    currency: "EUR",
    tariffPerKWh: "0.19",
    gridKgCo2PerKWh: 0.42,
    ambientC: 40,
    hoursPerYear: 6500,
    machines: [
      { kind: WEB_PRESS, count: 4, throughputGainPct: 2, marginPerOutputHour: "90" },
      { kind: SLITTER, count: 10 },
    ],
  },
];

// A small deterministic generator (mulberry32), so the demo is the same everywhere.
export function seededRandom(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const round = (v: number, digits = 3) => Number(v.toFixed(digits));

const motionSchema = axisInputSchema.shape.duty.shape.motion.unwrap();

const busVoltageOf = (frameSize: number | null | undefined) =>
  frameSize === 34 ? 70 : frameSize === 23 ? 48 : 24;

// An axis from its mechanism, stored as the JSON API stores it: motion and event as the engine
// parses them, the typed duty figures as placeholders. It draws nothing from the generator, so
// that the rest of the demo comes out as it did before these axes existed.
function motionAxis(t: MotionAxisTemplate, hoursPerYear: number, ambientC: number) {
  const motor = DEMO_MOTORS.find((m) => m.code === t.motor)!;
  return {
    label: t.label,
    quantity: 1,
    motorCode: motor.code,
    rotorTeeth: 50,
    holdingTorqueNm: motor.holdingTorqueNm,
    ratedCurrentA: motor.ratedCurrentA,
    phaseResistanceOhm: motor.phaseResistanceOhm,
    phaseInductanceMh: motor.phaseInductanceMh,
    insulationClass: motor.insulationClass ?? "B",
    hysteresisWPerHz: motor.hysteresisWPerHz ?? 0,
    eddyWPerHz2: motor.eddyWPerHz2 ?? 0,
    busVoltageV: busVoltageOf(motor.frameSize),
    currentSettingA: motor.ratedCurrentA,
    stepMode: "micro" as const,
    hoursPerYear,
    movePct: 0,
    holdPct: 0,
    speedRpm: 0,
    loadTorqueNm: 0,
    peakTorqueNm: 0,
    holdTorqueNm: 0,
    ambientC,
    motion: motionSchema.parse(t.motion),
    stepLossEventsPerYear: t.stepLossEventsPerYear ?? 0,
    costPerEvent: "0",
    event: t.event ? stepLossEventSchema.parse(t.event) : null,
  };
}

// The axis rows of one machine of a kind, varied a little from machine to machine.
export function demoAxesFor(
  kind: MachineKind,
  hoursPerYear: number,
  ambientC: number,
  random: () => number,
) {
  return kind.axes.map((t) => {
    if ("motion" in t) return motionAxis(t, hoursPerYear, ambientC);
    const motor = DEMO_MOTORS.find((m) => m.code === t.motor)!;
    const vary = 0.85 + random() * 0.3;
    const load = round(motor.holdingTorqueNm * t.loadShare * vary);
    return {
      label: t.label,
      quantity: 1,
      motorCode: motor.code,
      rotorTeeth: 50,
      holdingTorqueNm: motor.holdingTorqueNm,
      ratedCurrentA: motor.ratedCurrentA,
      phaseResistanceOhm: motor.phaseResistanceOhm,
      phaseInductanceMh: motor.phaseInductanceMh,
      insulationClass: motor.insulationClass ?? "B",
      hysteresisWPerHz: motor.hysteresisWPerHz ?? 0,
      eddyWPerHz2: motor.eddyWPerHz2 ?? 0,
      busVoltageV: busVoltageOf(motor.frameSize),
      // Open-loop drives are usually set to the rated current, a few a little above it.
      currentSettingA: round(motor.ratedCurrentA * (random() < 0.15 ? 1.1 : 1), 2),
      stepMode: t.stepMode ?? "micro",
      hoursPerYear,
      movePct: t.movePct,
      holdPct: t.holdPct,
      speedRpm: Math.round(t.speedRpm * (0.9 + random() * 0.2)),
      loadTorqueNm: load,
      peakTorqueNm: Math.max(load, round(motor.holdingTorqueNm * t.peakShare * vary)),
      holdTorqueNm: t.holdShare ? round(motor.holdingTorqueNm * t.holdShare) : 0,
      ambientC,
      stepLossEventsPerYear: t.stepLossEventsPerYear ?? 0,
      costPerEvent: t.stepLossEventsPerYear ? String(120 + Math.round(random() * 8) * 10) : "0",
      motion: null,
      event: null,
    };
  });
}
