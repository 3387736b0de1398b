import type { kits, motors } from "../schema";

// Invented reference motors and retrofit kits: plausible values for NEMA 17/23/34 class hybrid
// steppers, taken from no real datasheet.
export const DEMO_MOTORS: (typeof motors.$inferInsert)[] = [
  { code: "RM17-34", name: "Reference motor, frame 17, 34 mm", frameSize: 17, holdingTorqueNm: 0.26, ratedCurrentA: 1.3, phaseResistanceOhm: 2.1, phaseInductanceMh: 4.0, hysteresisWPerHz: 0.0015 },
  { code: "RM17-48", name: "Reference motor, frame 17, 48 mm", frameSize: 17, holdingTorqueNm: 0.45, ratedCurrentA: 1.7, phaseResistanceOhm: 1.5, phaseInductanceMh: 2.8, hysteresisWPerHz: 0.002 },
  { code: "RM17-60", name: "Reference motor, frame 17, 60 mm", frameSize: 17, holdingTorqueNm: 0.59, ratedCurrentA: 2.0, phaseResistanceOhm: 1.4, phaseInductanceMh: 3.0, hysteresisWPerHz: 0.0025 },
  { code: "RM23-56", name: "Reference motor, frame 23, 56 mm", frameSize: 23, holdingTorqueNm: 0.9, ratedCurrentA: 2.5, phaseResistanceOhm: 0.95, phaseInductanceMh: 3.0, hysteresisWPerHz: 0.0035 },
  { code: "RM23-76", name: "Reference motor, frame 23, 76 mm", frameSize: 23, holdingTorqueNm: 1.26, ratedCurrentA: 2.8, phaseResistanceOhm: 0.9, phaseInductanceMh: 3.2, hysteresisWPerHz: 0.004, eddyWPerHz2: 0.000002 },
  { code: "RM23-100", name: "Reference motor, frame 23, 100 mm", frameSize: 23, holdingTorqueNm: 1.9, ratedCurrentA: 4.0, phaseResistanceOhm: 0.55, phaseInductanceMh: 2.4, hysteresisWPerHz: 0.005, eddyWPerHz2: 0.000003 },
  { code: "RM34-80", name: "Reference motor, frame 34, 80 mm", frameSize: 34, holdingTorqueNm: 4.5, ratedCurrentA: 5.6, phaseResistanceOhm: 0.45, phaseInductanceMh: 4.0, hysteresisWPerHz: 0.009, eddyWPerHz2: 0.000006, insulationClass: "F" },
  { code: "RM34-118", name: "Reference motor, frame 34, 118 mm", frameSize: 34, holdingTorqueNm: 8.5, ratedCurrentA: 6.0, phaseResistanceOhm: 0.5, phaseInductanceMh: 6.0, hysteresisWPerHz: 0.012, eddyWPerHz2: 0.00001, insulationClass: "F" },
];

// Kits name their new motor by code; null keeps the axis motor.
export const DEMO_KITS: (Omit<typeof kits.$inferInsert, "motorId"> & { motorCode: string | null })[] = [
  { code: "CL17-E", name: "Closed-loop kit 17, encoder", price: "96.00", currency: "EUR", sensing: "encoder", motorCode: null, busVoltageV: 24 },
  { code: "CL17-S", name: "Closed-loop kit 17, sensorless", price: "74.00", currency: "EUR", sensing: "sensorless", motorCode: null, busVoltageV: 24 },
  { code: "CL17-EM", name: "Closed-loop kit 17 with 60 mm motor", price: "139.00", currency: "EUR", sensing: "encoder", motorCode: "RM17-60", busVoltageV: 36 },
  { code: "CL23-E", name: "Closed-loop kit 23, encoder", price: "189.00", currency: "EUR", sensing: "encoder", motorCode: null },
  { code: "CL23-S", name: "Closed-loop kit 23, sensorless", price: "149.00", currency: "EUR", sensing: "sensorless", motorCode: null },
  { code: "CL23-EM", name: "Closed-loop kit 23 with 100 mm motor", price: "262.00", currency: "EUR", sensing: "encoder", motorCode: "RM23-100", busVoltageV: 48 },
  { code: "CL23-EH", name: "Closed-loop kit 23, encoder, 70 V bus", price: "228.00", currency: "EUR", sensing: "encoder", motorCode: null, busVoltageV: 70 },
  { code: "CL34-E", name: "Closed-loop kit 34, encoder", price: "329.00", currency: "EUR", sensing: "encoder", motorCode: null, busVoltageV: 80 },
  { code: "CL34-S", name: "Closed-loop kit 34, sensorless", price: "268.00", currency: "EUR", sensing: "sensorless", motorCode: null, busVoltageV: 80 },
  { code: "CL34-EM", name: "Closed-loop kit 34 with 118 mm motor", price: "455.00", currency: "EUR", sensing: "encoder", motorCode: "RM34-118", busVoltageV: 80 },
  { code: "CL34-EHV", name: "Closed-loop kit 34, encoder, 110 V bus", price: "398.00", currency: "EUR", sensing: "encoder", motorCode: null, busVoltageV: 110, efficiencyPct: 93 },
  { code: "CL23-OLD", name: "Closed-loop kit 23, first series (retired)", price: "205.00", currency: "EUR", sensing: "encoder", motorCode: null, active: false },
];
